import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { createChemistryLibrary, defaultChemistryLibrary } from './library';
import { ReactionBalanceError, checkReactionBalance, evaluateReaction, reactionAtTemperature } from './reaction';
import type { ChemistryLibrary, SpeciesRecord } from './types';

const lib = defaultChemistryLibrary();
const caoHydration = {
  reactants: [{ formula: 'CaO', phase: 'cr' as const, coef: 1 }, { formula: 'H2O', phase: 'l' as const, coef: 1 }],
  products: [{ formula: 'Ca(OH)2', phase: 'cr' as const, coef: 1 }],
};

describe('checkReactionBalance', () => {
  it('names each element imbalance with both sides', () => {
    expect(() =>
      checkReactionBalance({ reactants: [{ formula: 'Fe', coef: 4 }, { formula: 'O2', coef: 1.5 }], products: [{ formula: 'Fe2O3', coef: 1 }] }),
    ).toThrow('Reaction is not balanced: Fe: 4 on the left, 2 on the right.');
    expect(() =>
      checkReactionBalance({ reactants: [{ formula: 'CaO', coef: 1 }, { formula: 'H2O', coef: 1 }], products: [{ formula: 'CaO2H', coef: 1 }] }),
    ).toThrow('H: 2 on the left, 1 on the right');
    expect(() =>
      checkReactionBalance({ reactants: [{ formula: 'Fe', coef: 1 }, { formula: 'O2', coef: 1 }], products: [{ formula: 'FeO', coef: 1 }] }),
    ).toThrow('O: 2 on the left, 1 on the right');
  });

  it('checks charge balance', () => {
    let err: unknown;
    try {
      checkReactionBalance({ reactants: [{ formula: 'NaCl', coef: 1 }], products: [{ formula: 'Na+', coef: 1 }, { formula: 'Cl', coef: 1 }] });
    } catch (e) {
      err = e;
    }
    expect(err).toBeInstanceOf(ReactionBalanceError);
    expect((err as ReactionBalanceError).imbalances).toEqual([{ what: 'charge', left: 0, right: 1 }]);
    expect(() =>
      checkReactionBalance({ reactants: [{ formula: 'NaCl', coef: 1 }], products: [{ formula: 'Na+', coef: 1 }, { formula: 'Cl-', coef: 1 }] }),
    ).not.toThrow();
  });

  it('rejects non-positive coefficients and empty sides', () => {
    expect(() => checkReactionBalance({ reactants: [{ formula: 'H2', coef: 0 }], products: [{ formula: 'H2', coef: 0 }] })).toThrow(/positive number/);
    expect(() => checkReactionBalance({ reactants: [], products: [{ formula: 'H2', coef: 1 }] })).toThrow(/at least one reactant/);
  });
});

describe('evaluateReaction identities', () => {
  it('ΔG = ΔH − TΔS at every temperature', () => {
    for (const tempC of [-20, 0, 25, 60, 150, 400]) {
      const r = evaluateReaction(lib, { ...caoHydration, tempC });
      const T = tempC + 273.15;
      expect(r.dG_kJ as number).toBeCloseTo(r.dH_kJ - (T * (r.dS_J_per_K as number)) / 1000, 9);
    }
  });

  it('Kirchhoff: dΔH/dT = ΔCp and dΔG/dT = −ΔS numerically', () => {
    const h = 1e-3;
    for (const tempC of [0, 25, 80, 200]) {
      const lo = evaluateReaction(lib, { ...caoHydration, tempC: tempC - h });
      const hi = evaluateReaction(lib, { ...caoHydration, tempC: tempC + h });
      const mid = evaluateReaction(lib, { ...caoHydration, tempC });
      expect(((hi.dH_kJ - lo.dH_kJ) * 1000) / (2 * h)).toBeCloseTo(mid.dCp_J_per_K as number, 4);
      expect((((hi.dG_kJ as number) - (lo.dG_kJ as number)) * 1000) / (2 * h)).toBeCloseTo(-(mid.dS_J_per_K as number), 3);
    }
  });

  it('at 25 °C the reported values equal the 298.15 K values', () => {
    const r = evaluateReaction(lib, caoHydration);
    expect(r.dH_kJ).toBeCloseTo(r.dH298_kJ, 12);
    expect(r.dS_J_per_K as number).toBeCloseTo(r.dS298_J_per_K as number, 12);
  });

  it('the Kirchhoff crossover root makes ΔG vanish', () => {
    const r = evaluateReaction(lib, {
      reactants: [{ formula: 'CaCO3', phase: 'cr', coef: 1 }],
      products: [{ formula: 'CaO', phase: 'cr', coef: 1 }, { formula: 'CO2', phase: 'g', coef: 1 }],
    });
    expect(r.crossoverKirchhoffC).not.toBeNull();
    const at = reactionAtTemperature(r, r.crossoverKirchhoffC as number);
    expect(Math.abs(at.dG_kJ as number)).toBeLessThan(1e-6);
    expect(r.crossoverC as number).toBeCloseTo((r.dH298_kJ * 1000) / (r.dS298_J_per_K as number) - 273.15, 9);
  });

  it('scaling all coefficients scales ΔH, ΔS and ΔG and keeps the crossover', () => {
    fc.assert(
      fc.property(fc.double({ min: 0.1, max: 10, noNaN: true }), (k) => {
        const base = evaluateReaction(lib, caoHydration);
        const scaled = evaluateReaction(lib, {
          reactants: caoHydration.reactants.map((t) => ({ ...t, coef: t.coef * k })),
          products: caoHydration.products.map((t) => ({ ...t, coef: t.coef * k })),
        });
        expect(scaled.dH_kJ).toBeCloseTo(k * base.dH_kJ, 8);
        expect(scaled.dS_J_per_K as number).toBeCloseTo(k * (base.dS_J_per_K as number), 8);
        expect(scaled.crossoverC as number).toBeCloseTo(base.crossoverC as number, 6);
      }),
    );
  });

  it('a missing Cp° gives a warning and no Kirchhoff correction', () => {
    const r = evaluateReaction(lib, {
      reactants: [{ formula: 'Ba(OH)2·8H2O', phase: 'cr', coef: 1 }, { formula: 'NH4Cl', phase: 'cr', coef: 2 }],
      products: [{ formula: 'BaCl2·2H2O', phase: 'cr', coef: 1 }, { formula: 'NH3', phase: 'aq', coef: 2 }, { formula: 'H2O', phase: 'l', coef: 8 }],
      tempC: 60,
    });
    expect(r.dCp_J_per_K).toBeNull();
    expect(r.warnings.map((w) => w.code)).toContain('missing-cp');
    expect(r.dH_kJ).toBe(r.dH298_kJ);
  });
});

describe('favourability statement', () => {
  // A synthetic library: A → B with chosen ΔH and ΔS (S of A zero), so each sign case is pinned.
  const synthetic = (dH: number, dS: number): ChemistryLibrary => {
    const rec = (formula: string, h: number, s: number): SpeciesRecord => ({
      key: `${formula}(g)`, formula, phase: 'g', name: formula, dfH_kJ_per_mol: h, dfG_kJ_per_mol: null,
      S_J_per_mol_K: s, Cp_J_per_mol_K: 0, molarMass_g_per_mol: 1, source: 'synthetic',
    });
    // Isomers: same composition, different formulas written distinctly.
    return createChemistryLibrary({ species: [rec('C2H6O', 0, 100), rec('CH3OCH3', dH, 100 + dS)], dilution: [], solubility: [], solutionHeatCapacity: [] });
  };
  const run = (dH: number, dS: number) =>
    evaluateReaction(synthetic(dH, dS), { reactants: [{ formula: 'C2H6O', phase: 'g', coef: 1 }], products: [{ formula: 'CH3OCH3', phase: 'g', coef: 1 }] });

  it('ΔH < 0 and ΔS > 0: favourable at all temperatures', () => {
    expect(run(-10, 5).favourabilityText).toMatch(/^favourable at all temperatures/);
    expect(run(-10, 5).crossoverC).toBeNull();
  });
  it('ΔH > 0 and ΔS < 0: not favourable at any temperature', () => {
    expect(run(10, -5).favourabilityText).toMatch(/^not favourable at any temperature/);
  });
  it('ΔH > 0 and ΔS > 0: favourable above ΔH/ΔS', () => {
    const r = run(68.515, 100); // T* = 685.15 K = 412 °C
    expect(r.favourability).toBe('above');
    expect(r.favourabilityText).toMatch(/^favourable above 412 °C/);
  });
  it('ΔH < 0 and ΔS < 0: favourable below ΔH/ΔS', () => {
    const r = run(-37.315, -100); // T* = 373.15 K = 100 °C
    expect(r.favourability).toBe('below');
    expect(r.favourabilityText).toMatch(/^favourable below 100 °C/);
  });
});
