import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { ATOMIC_WEIGHTS } from './atomic-weights';
import { FormulaError, hillFormula, molarMass, parseFormula, splitHydrate } from './formula';

describe('parseFormula', () => {
  it.each([
    ['NH4NO3', { N: 2, H: 4, O: 3 }, 0],
    ['CO(NH2)2', { C: 1, O: 1, N: 2, H: 4 }, 0],
    ['CH3COONa', { C: 2, H: 3, O: 2, Na: 1 }, 0],
    ['Ca(OH)2', { Ca: 1, O: 2, H: 2 }, 0],
    ['[Cu(NH3)4]^2+', { Cu: 1, N: 4, H: 12 }, 2],
    ['NH4+', { N: 1, H: 4 }, 1],
    ['SO4^2-', { S: 1, O: 4 }, -2],
    ['SO4-2', { S: 1, O: 4 }, -2],
    ['Fe+3', { Fe: 1 }, 3],
    ['Ca^2+', { Ca: 1 }, 2],
    ['Ca2+', { Ca: 1 }, 2],
    ['Ca+2', { Ca: 1 }, 2],
    ['Fe3+', { Fe: 1 }, 3],
    ['Cl-', { Cl: 1 }, -1],
    ['NO3-', { N: 1, O: 3 }, -1],
    ['HCO3-', { H: 1, C: 1, O: 3 }, -1],
    ['SO42-', { S: 1, O: 4 }, -2],
    ['PO43-', { P: 1, O: 4 }, -3],
    ['Cr2O72-', { Cr: 2, O: 7 }, -2],
    ['Fe(CN)63-', { Fe: 1, C: 6, N: 6 }, -3],
    ['Fe++', { Fe: 1 }, 2],
    ['SO₄²⁻', { S: 1, O: 4 }, -2],
  ])('reads %s into element counts and charge', (f, elements, charge) => {
    const p = parseFormula(f);
    expect(p.elements).toEqual(elements);
    expect(p.charge).toBe(charge);
  });

  it('reads hydrates written with ·, . and * alike', () => {
    const forms = ['CaCl2·6H2O', 'CaCl2.6H2O', 'CaCl2*6H2O'].map(parseFormula);
    for (const p of forms) {
      expect(p.elements).toEqual({ Ca: 1, Cl: 2, H: 12, O: 6 });
      expect(p.formula).toBe('CaCl2·6H2O');
    }
    expect(parseFormula('KCl·MgSO4·2.75H2O').elements.O).toBeCloseTo(6.75, 12);
  });

  it.each([
    ['NaCl(cr)', 'cr'],
    ['NaCl(s)', 'cr'],
    ['H2O(l)', 'l'],
    ['NH3(g)', 'g'],
    ['NH3(aq)', 'aq'],
    ['NH4NO3(ai)', 'ai'],
    ['NH3(ao)', 'ao'],
    ['NH4+(aq)', 'aq'],
  ])('reads the phase tag of %s as %s', (f, phase) => {
    expect(parseFormula(f).phase).toBe(phase);
  });

  it('reports an unknown element with its symbol and position', () => {
    expect(() => parseFormula('NaXx2')).toThrow(FormulaError);
    expect(() => parseFormula('NaXx2')).toThrow('Unknown element "Xx" at position 3');
  });

  it('reports unbalanced brackets and empty formulas', () => {
    expect(() => parseFormula('Ca(OH2')).toThrow(/Unbalanced bracket: "\(" at position 3 is never closed/);
    expect(() => parseFormula('CaOH)2')).toThrow(/Unbalanced bracket: "\)" at position 5/);
    expect(() => parseFormula('Ca(OH]2')).toThrow(/expected "\)" at position 6, found "\]"/);
    expect(() => parseFormula('')).toThrow(/Empty formula/);
    expect(() => parseFormula('   ')).toThrow(/Empty formula/);
    expect(() => parseFormula('(aq)')).toThrow(/Empty formula/);
    expect(() => parseFormula('NaCl(zz)')).toThrow(/Unknown phase tag "\(zz\)"/);
  });

  it('splitHydrate separates the water of crystallisation', () => {
    expect(splitHydrate('CaCl2·6H2O')).toEqual({ anhydrous: 'CaCl2', waterCount: 6 });
    expect(splitHydrate('Ba(OH)2.8H2O')).toEqual({ anhydrous: 'Ba(OH)2', waterCount: 8 });
    expect(splitHydrate('NaCl')).toEqual({ anhydrous: 'NaCl', waterCount: 0 });
  });

  it('hillFormula makes differently written formulas of one compound compare equal', () => {
    expect(hillFormula(parseFormula('CH3COONa'))).toBe(hillFormula(parseFormula('NaCH3CO2')));
    expect(hillFormula(parseFormula('SO4^2-'))).toBe(hillFormula(parseFormula('SO4-2')));
  });
});

// Properties over generated formulas built from a few common elements.
const symbols = ['H', 'C', 'N', 'O', 'Na', 'Mg', 'S', 'Cl', 'K', 'Ca', 'Fe', 'Ba'] as const;
const term = fc.record({ el: fc.constantFrom(...symbols), n: fc.integer({ min: 1, max: 12 }) });
const simpleFormula = fc.array(term, { minLength: 1, maxLength: 5 }).map((ts) => ts.map((t) => (t.n === 1 ? t.el : `${t.el}${t.n}`)).join(''));

describe('formula properties', () => {
  it('molar mass of a hydrate is M(A) + n·M(H2O) for every separator', () => {
    fc.assert(
      fc.property(simpleFormula, fc.integer({ min: 1, max: 12 }), fc.constantFrom('·', '.', '*'), (a, n, sep) => {
        expect(molarMass(`${a}${sep}${n}H2O`)).toBeCloseTo(molarMass(a) + n * molarMass('H2O'), 9);
      }),
    );
  });

  it('molar mass is the sum of counts times the CIAAW weights', () => {
    fc.assert(
      fc.property(fc.array(term, { minLength: 1, maxLength: 5 }), (ts) => {
        const f = ts.map((t) => `${t.el}${t.n}`).join('');
        const expected = ts.reduce((s, t) => s + t.n * (ATOMIC_WEIGHTS[t.el]?.asaw as number), 0);
        expect(molarMass(f)).toBeCloseTo(expected, 9);
      }),
    );
  });

  it('a bracketed group with count k weighs k times the group', () => {
    fc.assert(
      fc.property(simpleFormula, fc.integer({ min: 2, max: 9 }), (g, k) => {
        expect(molarMass(`(${g})${k}`)).toBeCloseTo(k * molarMass(g), 9);
      }),
    );
  });

  it('charge suffixes ^n+, ^n- and sign-number agree', () => {
    fc.assert(
      fc.property(simpleFormula, fc.integer({ min: 1, max: 4 }), fc.boolean(), (f, z, positive) => {
        const sign = positive ? '+' : '-';
        const expected = positive ? z : -z;
        expect(parseFormula(`${f}^${z}${sign}`).charge).toBe(expected);
        expect(parseFormula(`${f}${sign}${z}`).charge).toBe(expected);
        expect(parseFormula(`${f}^${z}${sign}`).elements).toEqual(parseFormula(f).elements);
      }),
    );
  });
});
