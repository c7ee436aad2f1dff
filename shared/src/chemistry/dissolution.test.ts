import { describe, expect, it } from 'vitest';
import {
  cryoscopicConstant,
  dissolutionHeat,
  dissolutionProducts,
  enthalpyOfSolutionInfinite,
  eutectic,
  freezingPoint,
  integralEnthalpyOfSolution,
  nH2OPerMol,
  solubility,
} from './dissolution';
import { defaultChemistryLibrary, findDilutionSeries, findSolubilitySeries, findSpecies } from './library';

const lib = defaultChemistryLibrary();

describe('dissolutionProducts', () => {
  it.each([
    ['NH4NO3(cr)', ['NH4+(ai)', 'NO3-(ai)'], [1, 1], 0],
    ['CaCl2·6H2O(cr)', ['Ca^2+(ai)', 'Cl-(ai)'], [1, 2], 6],
    ['Na2S2O3·5H2O(cr)', ['Na+(ai)', 'S2O3^2-(ai)'], [2, 1], 5],
    ['CH3COONa·3H2O(cr)', ['Na+(ai)', 'CH3COO-(ai)'], [1, 1], 3],
    ['Ba(OH)2·8H2O(cr)', ['Ba^2+(ai)', 'OH-(ai)'], [1, 2], 8],
    ['CO(NH2)2(cr)', ['CO(NH2)2(ao)'], [1], 0],
  ])('splits %s into its aqueous species', (solute, keys, nus, water) => {
    const r = dissolutionProducts(lib, solute);
    expect(r.products.map((p) => p.species.key)).toEqual(keys);
    expect(r.products.map((p) => p.nu)).toEqual(nus);
    expect(r.waterReleased).toBe(water);
  });
});

describe('enthalpy of solution at infinite dilution', () => {
  it('the ion sum equals the NBS ionised-salt state minus the solid (Hess consistency of the table)', () => {
    for (const salt of ['NH4NO3', 'NH4Cl', 'KCl', 'KNO3', 'NaCl', 'CH3COONa', 'CaCl2', 'MgSO4', 'Na2CO3', 'BaCl2', 'NaOH']) {
      const ai = findSpecies(lib, salt, 'ai').dfH_kJ_per_mol as number;
      const cr = findSpecies(lib, salt, 'cr').dfH_kJ_per_mol as number;
      expect(enthalpyOfSolutionInfinite(lib, `${salt}(cr)`).dH_kJ_per_mol, salt).toBeCloseTo(ai - cr, 1);
    }
  });

  it('a hydrate differs from its anhydrous salt by the hydration enthalpy of the solid', () => {
    const anh = enthalpyOfSolutionInfinite(lib, 'CaCl2(cr)').dH_kJ_per_mol;
    const hyd = enthalpyOfSolutionInfinite(lib, 'CaCl2·6H2O(cr)').dH_kJ_per_mol;
    const hydration =
      (findSpecies(lib, 'CaCl2·6H2O', 'cr').dfH_kJ_per_mol as number) -
      (findSpecies(lib, 'CaCl2', 'cr').dfH_kJ_per_mol as number) -
      6 * (findSpecies(lib, 'H2O', 'l').dfH_kJ_per_mol as number);
    expect(anh - hyd).toBeCloseTo(hydration, 9);
  });
});

describe('integral enthalpy of solution', () => {
  it('reproduces each tabulated dilution point exactly', () => {
    const series = findDilutionSeries(lib, 'NH4NO3(cr)');
    const cr = findSpecies(lib, 'NH4NO3', 'cr').dfH_kJ_per_mol as number;
    for (const p of series.points) {
      expect(integralEnthalpyOfSolution(lib, 'NH4NO3(cr)', p.nH2O_per_mol).dH_kJ_per_mol).toBeCloseTo(p.dfH_kJ_per_mol - cr, 9);
    }
  });

  it('tends to the tabulated infinite-dilution value as n → ∞, which matches the ion sum within NBS rounding', () => {
    for (const salt of ['NH4NO3(cr)', 'NaCl(cr)', 'KCl(cr)', 'CaCl2(cr)', 'CH3COONa(cr)']) {
      const limit = integralEnthalpyOfSolution(lib, salt, 1e6).dH_infinite_kJ_per_mol;
      const gaps = [1e5, 1e6, 1e8, 1e10].map((n) => Math.abs(integralEnthalpyOfSolution(lib, salt, n).dH_kJ_per_mol - limit));
      for (let k = 1; k < gaps.length; k++) expect(gaps[k]).toBeLessThan(gaps[k - 1] as number);
      expect(gaps[gaps.length - 1]).toBeLessThan(1e-3);
      expect(integralEnthalpyOfSolution(lib, salt, Infinity).dH_kJ_per_mol).toBeCloseTo(limit, 12);
      // NBS rounds ion and salt values separately: they agree within 0.02 kJ/mol.
      expect(Math.abs(limit - enthalpyOfSolutionInfinite(lib, salt).dH_kJ_per_mol)).toBeLessThan(0.02);
    }
  });

  it('a concentrated NH4NO3 solution absorbs less heat per mole than infinite dilution', () => {
    // 40 g NH4NO3 in 100 g water: n = (100/18.015)/(40/80.043) = 11.11 mol water per mol.
    const n = nH2OPerMol(lib, 'NH4NO3(cr)', 40, 100);
    expect(n).toBeCloseTo(100 / 18.015 / (40 / 80.043), 3);
    const conc = integralEnthalpyOfSolution(lib, 'NH4NO3(cr)', n).dH_kJ_per_mol;
    const inf = enthalpyOfSolutionInfinite(lib, 'NH4NO3(cr)').dH_kJ_per_mol;
    expect(conc).toBeLessThan(inf - 4);
    expect(conc).toBeGreaterThan(0);
  });

  it('counts hydrate water in n and rejects n below it', () => {
    expect(() => integralEnthalpyOfSolution(lib, 'CaCl2·6H2O(cr)', 5)).toThrow(/at least the 6 mol of crystal water/);
    // 1 mol hexahydrate in 44 mol water gives CaCl2 in 50 H2O.
    const hyd = integralEnthalpyOfSolution(lib, 'CaCl2·6H2O(cr)', 50).dH_kJ_per_mol;
    const anh = integralEnthalpyOfSolution(lib, 'CaCl2(cr)', 50).dH_kJ_per_mol;
    const hydration =
      (findSpecies(lib, 'CaCl2·6H2O', 'cr').dfH_kJ_per_mol as number) -
      (findSpecies(lib, 'CaCl2', 'cr').dfH_kJ_per_mol as number) -
      6 * (findSpecies(lib, 'H2O', 'l').dfH_kJ_per_mol as number);
    expect(anh - hyd).toBeCloseTo(hydration, 9);
    expect(nH2OPerMol(lib, 'CaCl2·6H2O(cr)', 219.068, 0)).toBeCloseTo(6, 9);
  });

  it('warns when the solution is more concentrated than the data', () => {
    const r = integralEnthalpyOfSolution(lib, 'NH4NO3(cr)', 2);
    expect(r.warnings.map((w) => w.code)).toEqual(['below-dilution-data']);
    expect(integralEnthalpyOfSolution(lib, 'NH4NO3(cr)', 10).warnings).toEqual([]);
  });

  it('dissolutionHeat is moles times the integral enthalpy', () => {
    const q = dissolutionHeat(lib, 'NH4NO3(cr)', 80.043, 10 * 18.015);
    expect(q.nH2O_per_mol).toBeCloseTo(10, 9);
    expect(q.dH_kJ).toBeCloseTo(integralEnthalpyOfSolution(lib, 'NH4NO3(cr)', 10).dH_kJ_per_mol, 9);
  });
});

describe('solubility', () => {
  it('passes through every tabulated point with no warning', () => {
    for (const s of lib.solubility) {
      for (const p of s.points) {
        const r = solubility(lib, s.solute, p.tempC);
        expect(r.gPer100gWater).toBeCloseTo(p.gPer100gWater, 9);
        expect(r.warnings).toEqual([]);
      }
    }
  });

  it('stays between neighbouring points of a monotone curve', () => {
    const r = solubility(lib, 'KNO3(cr)', 15).gPer100gWater;
    const pts = findSolubilitySeries(lib, 'KNO3(cr)').points;
    expect(r).toBeGreaterThan(pts[1]?.gPer100gWater as number);
    expect(r).toBeLessThan(pts[2]?.gPer100gWater as number);
  });

  it('warns outside the data range instead of extrapolating silently', () => {
    expect(solubility(lib, 'NH4NO3(cr)', -5).warnings.map((w) => w.code)).toEqual(['outside-solubility-data']);
    expect(solubility(lib, 'NH4NO3(cr)', 110).warnings.map((w) => w.code)).toEqual(['outside-solubility-data']);
  });

  it('reports the mass fraction of the saturated solution', () => {
    const r = solubility(lib, 'NaCl(cr)', 25);
    expect(r.massFraction).toBeCloseTo(r.gPer100gWater / (100 + r.gPer100gWater), 12);
  });
});

describe('freezing point and eutectic', () => {
  it('is 0 °C for pure water and falls with concentration', () => {
    expect(freezingPoint(lib, 'NaCl(cr)', 0).tempC).toBeCloseTo(0, 12);
    const a = freezingPoint(lib, 'NaCl(cr)', 0.05).tempC;
    const b = freezingPoint(lib, 'NaCl(cr)', 0.1).tempC;
    expect(b).toBeLessThan(a);
    expect(a).toBeLessThan(0);
  });

  it('uses the colligative estimate with a warning where no data exist', () => {
    const r = freezingPoint(lib, 'NH4NO3(cr)', 0.05);
    expect(r.basis).toBe('colligative');
    expect(r.warnings.map((w) => w.code)).toContain('colligative-estimate');
    const m = 0.05 / 0.95 / (80.043 / 1000);
    expect(r.depressionK).toBeCloseTo(cryoscopicConstant() * 2 * m, 9);
  });

  it('warns beyond the eutectic composition', () => {
    const e = eutectic(lib, 'NaCl(cr)');
    expect(e).not.toBeNull();
    expect(freezingPoint(lib, 'NaCl(cr)', (e?.massFraction as number) + 0.01).warnings.map((w) => w.code)).toContain('beyond-eutectic');
  });
});
