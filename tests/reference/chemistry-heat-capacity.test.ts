import { describe, expect, it } from 'vitest';
import { defaultChemistryLibrary } from '@shared/chemistry/library';
import { solutionHeatCapacity, waterHeatCapacity_J_per_gK } from '@shared/chemistry/solution-heat-capacity';

const lib = defaultChemistryLibrary();

describe('heat capacity of water and solutions against published values', () => {
  // IAPWS-95 isobaric heat capacity of liquid water at 0.1 MPa, J/(g·K) (from memory; e.g. NIST
  // Chemistry WebBook fluid properties).
  it.each([
    [0.01, 4.2199],
    [10, 4.1955],
    [25, 4.1813],
    [50, 4.1806],
    [80, 4.1963],
    [95, 4.2117],
  ])('water at %f °C within 0.3 %% of IAPWS-95 (%f J/(g·K))', (t, cp) => {
    expect(Math.abs(waterHeatCapacity_J_per_gK(t) - cp) / cp).toBeLessThan(0.003);
  });

  it('3.5 % NaCl at 25 °C is within 0.5 % of seawater (S = 35, 3.993 J/(g·K))', () => {
    // Seawater specific heat at S = 35 g/kg, 25 °C, 1 atm ≈ 3.993 J/(g·K) (from memory; TEOS-10 /
    // Millero). Sea salt is mostly NaCl, so a 3.5 % NaCl solution should be close.
    const r = solutionHeatCapacity(lib, [{ solute: 'NaCl(cr)', massFraction: 0.035 }], 25);
    expect(r.basis).toBe('laliberte');
    expect(Math.abs(r.cp_J_per_gK - 3.993) / 3.993).toBeLessThan(0.005);
  });

  it('1 mol/kg NaCl at 25 °C is about 3.92 J/(g·K)', () => {
    // From the apparent molar heat capacity of NaCl(aq) at 1 mol/kg, about −37 J/(mol·K)
    // (Pitzer-model literature, from memory): cp = (1000·4.1813 − 37)/1058.44 ≈ 3.915 J/(g·K).
    const w = 58.44 / 1058.44;
    const r = solutionHeatCapacity(lib, [{ solute: 'NaCl(cr)', massFraction: w }], 25);
    expect(Math.abs(r.cp_J_per_gK - 3.915)).toBeLessThan(0.03);
  });
});
