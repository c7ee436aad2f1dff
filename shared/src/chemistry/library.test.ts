import { describe, expect, it } from 'vitest';
import { molarMass, parseFormula, splitHydrate } from './formula';
import {
  ChemistryDataError,
  UnknownSpeciesError,
  createChemistryLibrary,
  defaultChemistryLibrary,
  findDilutionSeries,
  findSolubilitySeries,
  findSpecies,
} from './library';
import type { SpeciesRecord } from './types';

const lib = defaultChemistryLibrary();

describe('bundled species data', () => {
  it('holds at least 80 species, each with a source and a molar mass from the formula', () => {
    expect(lib.species.length).toBeGreaterThanOrEqual(80);
    for (const s of lib.species) {
      expect(s.source.length).toBeGreaterThan(10);
      expect(s.molarMass_g_per_mol).toBeCloseTo(molarMass(s.formula), 3);
      expect(s.key).toBe(`${s.formula}(${s.phase})`);
    }
  });

  it.each([
    'NH4NO3(cr)', 'NH4Cl(cr)', 'CO(NH2)2(cr)', 'KCl(cr)', 'KNO3(cr)', 'NaCl(cr)', 'CH3COONa(cr)', 'CH3COONa·3H2O(cr)',
    'Na2S2O3·5H2O(cr)', 'CaCl2(cr)', 'CaCl2·6H2O(cr)', 'MgSO4(cr)', 'MgSO4·7H2O(cr)', 'Na2CO3(cr)', 'Na2CO3·10H2O(cr)',
    'CaO(cr)', 'Ca(OH)2(cr)', 'Fe(cr)', 'Fe2O3(cr)', 'FeO(OH)(cr)', 'Mg(cr)', 'Mg(OH)2(cr)', 'Ba(OH)2·8H2O(cr)',
    'BaCl2·2H2O(cr)', 'NH3(g)', 'NH3(ao)', 'H2(g)', 'O2(g)', 'N2(g)', 'C(cr)', 'H2O(l)', 'H2O(g)', 'H2O(cr)', 'CO2(g)',
    'NH4+(ai)', 'NO3-(ai)', 'Cl-(ai)', 'K+(ai)', 'Na+(ai)', 'CH3COO-(ai)', 'S2O3^2-(ai)', 'Ca^2+(ai)', 'Mg^2+(ai)',
    'SO4^2-(ai)', 'CO3^2-(ai)', 'OH-(ai)', 'Ba^2+(ai)', 'Fe^2+(ai)', 'Fe^3+(ai)',
  ])('has %s with ΔfH°', (key) => {
    const s = lib.species.find((x) => x.key === key);
    expect(s, key).toBeDefined();
    expect(s?.dfH_kJ_per_mol).not.toBeNull();
  });

  it('elements in their reference state have ΔfH° = ΔfG° = 0', () => {
    for (const key of ['H2(g)', 'O2(g)', 'N2(g)', 'C(cr)', 'Fe(cr)', 'Mg(cr)', 'Ca(cr)']) {
      const s = lib.species.find((x) => x.key === key) as SpeciesRecord;
      expect(s.dfH_kJ_per_mol).toBe(0);
      expect(s.dfG_kJ_per_mol).toBe(0);
    }
  });

  it('every dissolving solid with a solubility series also has a dilution series, except where NBS has none', () => {
    const noDilution = new Set(['Ba(OH)2(cr)']);
    for (const s of lib.solubility) {
      if (noDilution.has(s.solute)) continue;
      expect(() => findDilutionSeries(lib, s.solute), s.solute).not.toThrow();
    }
  });

  it('ice is below liquid water in enthalpy by the enthalpy of fusion', () => {
    const ice = findSpecies(lib, 'H2O', 'cr');
    const liquid = findSpecies(lib, 'H2O', 'l');
    expect((liquid.dfH_kJ_per_mol as number) - (ice.dfH_kJ_per_mol as number)).toBeCloseTo(6.01, 6);
  });
});

describe('findSpecies', () => {
  it('finds a species however its formula is written', () => {
    expect(findSpecies(lib, 'CaCl2.6H2O', 'cr').key).toBe('CaCl2·6H2O(cr)');
    expect(findSpecies(lib, 'NaCH3CO2', 'cr').key).toBe('CH3COONa(cr)');
    expect(findSpecies(lib, 'SO4-2', 'ai').key).toBe('SO4^2-(ai)');
    expect(findSpecies(lib, 'NH3(g)').key).toBe('NH3(g)');
  });

  it('aq finds the aqueous standard state: undissociated first, then ionised; ions in any aqueous tag', () => {
    expect(findSpecies(lib, 'NH3', 'aq').key).toBe('NH3(ao)');
    expect(findSpecies(lib, 'NaCl', 'aq').key).toBe('NaCl(ai)');
    expect(findSpecies(lib, 'Ca^2+', 'aq').key).toBe('Ca^2+(ai)');
    expect(findSpecies(lib, 'NH4+', 'ao').key).toBe('NH4+(ai)');
  });

  it('names the phases it has when asked for a missing one', () => {
    expect(() => findSpecies(lib, 'NH4NO3', 'g')).toThrow(UnknownSpeciesError);
    expect(() => findSpecies(lib, 'NH4NO3', 'g')).toThrow('Unknown species NH4NO3(g): the library has NH4NO3 only as (cr), (ai).');
    expect(() => findSpecies(lib, 'XeF6', 'cr')).toThrow(/no species with composition/);
    expect(() => findSpecies(lib, 'H2O')).toThrow(/needs a phase/);
  });

  it('series lookups map a hydrate to its anhydrous salt', () => {
    expect(findSolubilitySeries(lib, 'CaCl2·6H2O(cr)').solute).toBe('CaCl2(cr)');
    expect(findDilutionSeries(lib, 'CaCl2·6H2O(cr)').solute).toBe('CaCl2(cr)');
    expect(() => findSolubilitySeries(lib, 'ZnO(cr)')).toThrow(/No solubility data for "ZnO\(cr\)"/);
  });
});

describe('createChemistryLibrary', () => {
  const base = { dilution: [], solubility: [], solutionHeatCapacity: [] };
  const rec = (over: Partial<SpeciesRecord>): SpeciesRecord => ({
    key: 'NaCl(cr)', formula: 'NaCl', phase: 'cr', name: 'x', dfH_kJ_per_mol: 0, dfG_kJ_per_mol: 0,
    S_J_per_mol_K: 0, Cp_J_per_mol_K: 0, molarMass_g_per_mol: 58.44, source: 'test', ...over,
  });
  it('rejects duplicate keys and keys that are not formula(phase)', () => {
    expect(() => createChemistryLibrary({ ...base, species: [rec({}), rec({})] })).toThrow(ChemistryDataError);
    expect(() => createChemistryLibrary({ ...base, species: [rec({ key: 'NaCl(aq)' })] })).toThrow(/does not match formula\(phase\)/);
  });
  it('rejects dilution points that repeat an n', () => {
    expect(() =>
      createChemistryLibrary({
        ...base,
        species: [rec({})],
        dilution: [{ solute: 'NaCl(cr)', source: 't', points: [{ nH2O_per_mol: 10, dfH_kJ_per_mol: 1 }, { nH2O_per_mol: 10, dfH_kJ_per_mol: 2 }] }],
      }),
    ).toThrow(/strictly increasing/);
  });
  it('keeps every bundled formula parseable and hydrates split as written', () => {
    for (const s of lib.species) {
      const { waterCount } = splitHydrate(s.formula);
      expect(parseFormula(s.formula).parts.length).toBeGreaterThanOrEqual(waterCount > 0 ? 2 : 1);
    }
  });
});

describe('ions written as in print', () => {
  it('Ca2+, Ca+2 and Ca^2+ find the same aqueous ion', async () => {
    const { defaultChemistryLibrary, findSpecies } = await import('./library');
    const lib = defaultChemistryLibrary();
    const keys = ['Ca2+', 'Ca+2', 'Ca^2+'].map((f) => findSpecies(lib, f).key);
    expect(new Set(keys).size).toBe(1);
    expect(keys[0]).toMatch(/^Ca\^2\+\(a[iq]\)$/);
  });
});
