import { describe, expect, it } from 'vitest';
import { defaultChemistryLibrary, integralEnthalpyOfSolution, solubility } from '../chemistry';
import { chemistryPort } from './chemistry-adapter';

const lib = defaultChemistryLibrary();
const port = chemistryPort(lib);

describe('chemistryPort', () => {
  it('its sampled integral enthalpy of solution reproduces the chemistry function within 0.01 %', () => {
    for (const key of ['NH4NO3(cr)', 'KCl(cr)', 'NH4Cl(cr)']) {
      for (const n of [4, 7.3, 11.1, 25, 63, 150, 414, 2000, 40000]) {
        const want = integralEnthalpyOfSolution(lib, key, n).dH_kJ_per_mol;
        const got = port.integralSolutionEnthalpy_kJ_per_mol(key, n).value;
        expect(Math.abs(got - want)).toBeLessThan(1e-4 * Math.abs(want) + 1e-9);
      }
    }
  });

  it('its sampled solubility reproduces the chemistry function within 0.01 %', () => {
    for (const key of ['NH4NO3(cr)', 'KCl(cr)', 'NH4Cl(cr)']) {
      for (const t of [0, 3.3, 17.9, 25, 61.2, 100]) {
        const want = solubility(lib, key, t).gPer100gWater;
        expect(port.solubility_g_per_100g(key, t).value).toBeCloseTo(want, 2);
        expect(Math.abs(port.solubility_g_per_100g(key, t).value - want)).toBeLessThan(1e-4 * want);
      }
    }
  });

  it('holds the apparent heat capacity at the edge of the fitted range and says so', () => {
    const inside = port.apparentSoluteCp_J_per_gK('NH4Cl(cr)', 0.1, 25);
    const edge = port.apparentSoluteCp_J_per_gK('NH4Cl(cr)', 0.141, 25);
    const beyond = port.apparentSoluteCp_J_per_gK('NH4Cl(cr)', 0.3, 25);
    expect(inside.warnings).toHaveLength(0);
    expect(beyond.value).toBeCloseTo(edge.value, 2);
    expect(beyond.warnings[0]!.code).toBe('heat-capacity-clamped');
  });

  it('passes the eutectic of ammonium nitrate through with its source', () => {
    const e = port.eutectic!('NH4NO3(cr)');
    expect(e?.tempC).toBeLessThan(-15);
    expect(e?.source).toBeTruthy();
  });
});
