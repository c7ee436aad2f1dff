import { describe, expect, it } from 'vitest';
import { defaultChemistryLibrary, findHeatCapacityCoefficients, findSpecies } from './library';
import { solutionHeatCapacity, soluteApparentHeatCapacity_J_per_gK, waterHeatCapacity_J_per_gK } from './solution-heat-capacity';
import type { SolutionHeatCapacityCoefficients } from './types';

const lib = defaultChemistryLibrary();

describe('solutionHeatCapacity', () => {
  it('equals pure water with no solute', () => {
    const r = solutionHeatCapacity(lib, [], 30);
    expect(r.cp_J_per_gK).toBeCloseTo(waterHeatCapacity_J_per_gK(30), 12);
    expect(r.basis).toBe('laliberte');
  });

  it('inside the fitted range it is w_w·cp_w + Σ w_i·cp_app,i with no warning', () => {
    const c = findHeatCapacityCoefficients(lib, 'KCl(cr)') as SolutionHeatCapacityCoefficients;
    const r = solutionHeatCapacity(lib, [{ solute: 'KCl(cr)', massFraction: 0.1 }], 40);
    expect(r.basis).toBe('laliberte');
    expect(r.warnings).toEqual([]);
    expect(r.cp_J_per_gK).toBeCloseTo(0.9 * waterHeatCapacity_J_per_gK(40) + 0.1 * soluteApparentHeatCapacity_J_per_gK(c, 40, 0.9), 12);
  });

  it('outside the fitted range falls back to the water + solid mixing rule and says so', () => {
    // Ammonium nitrate coefficients were fitted at 25 °C only.
    const r = solutionHeatCapacity(lib, [{ solute: 'NH4NO3(cr)', massFraction: 0.4 }], 5);
    expect(r.basis).toBe('mixing-rule');
    expect(r.warnings.map((w) => w.code)).toEqual(['heat-capacity-fallback']);
    const s = findSpecies(lib, 'NH4NO3', 'cr');
    expect(r.cp_J_per_gK).toBeCloseTo(0.6 * waterHeatCapacity_J_per_gK(5) + (0.4 * (s.Cp_J_per_mol_K as number)) / s.molarMass_g_per_mol, 12);
  });

  it('solution heat capacity falls as a salt is added (apparent cp of salts is below water)', () => {
    const cps = [0, 0.05, 0.1, 0.2].map((w) => solutionHeatCapacity(lib, w === 0 ? [] : [{ solute: 'NaCl(cr)', massFraction: w }], 25).cp_J_per_gK);
    for (let k = 1; k < cps.length; k++) expect(cps[k]).toBeLessThan(cps[k - 1] as number);
  });

  it('rejects mass fractions that sum to 1 or more', () => {
    expect(() => solutionHeatCapacity(lib, [{ solute: 'NaCl(cr)', massFraction: 1 }], 25)).toThrow(/sum to less than 1/);
  });
});
