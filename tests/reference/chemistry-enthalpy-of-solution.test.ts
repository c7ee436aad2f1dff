import { describe, expect, it } from 'vitest';
import { enthalpyOfSolutionInfinite } from '@shared/chemistry/dissolution';
import { defaultChemistryLibrary } from '@shared/chemistry/library';

const lib = defaultChemistryLibrary();

describe('enthalpy of solution at infinite dilution, from ion formation enthalpies', () => {
  // Reference: CRC Handbook of Chemistry and Physics, table "Enthalpy of Solution of Electrolytes"
  // (V. B. Parker, NSRDS-NBS 2, 1965), ΔsolH at infinite dilution, 25 °C, kJ/mol. Values from memory.
  it.each([
    ['NH4NO3(cr)', 25.69],
    ['NH4Cl(cr)', 14.78],
    ['NaCl(cr)', 3.88],
    ['CH3COONa(cr)', -17.32],
    ['CH3COONa·3H2O(cr)', 19.66],
    ['KCl(cr)', 17.22],
    ['KNO3(cr)', 34.89],
    ['CaCl2(cr)', -81.33],
    ['MgSO4(cr)', -91.21],
  ])('%s: %f kJ/mol within 0.3 kJ/mol (Parker 1965 via CRC, from memory)', (solute, expected) => {
    expect(Math.abs(enthalpyOfSolutionInfinite(lib, solute).dH_kJ_per_mol - expected)).toBeLessThan(0.3);
  });

  it('cold-pack salts absorb heat and warm-pack salts release it', () => {
    // Common practice: NH4NO3, NH4Cl, KCl, urea dissolve endothermically; CaCl2, MgSO4 exothermically.
    for (const s of ['NH4NO3(cr)', 'NH4Cl(cr)', 'KCl(cr)', 'CO(NH2)2(cr)']) expect(enthalpyOfSolutionInfinite(lib, s).dH_kJ_per_mol).toBeGreaterThan(10);
    for (const s of ['CaCl2(cr)', 'MgSO4(cr)']) expect(enthalpyOfSolutionInfinite(lib, s).dH_kJ_per_mol).toBeLessThan(-50);
  });

  it('urea dissolves with about +15 kJ/mol', () => {
    // Enthalpy of solution of urea in water at 25 °C, about 15.1–15.4 kJ/mol (from memory; CRC
    // Handbook "Enthalpy of solution of organic compounds" and calorimetric literature).
    const dH = enthalpyOfSolutionInfinite(lib, 'CO(NH2)2(cr)').dH_kJ_per_mol;
    expect(dH).toBeGreaterThan(14.8);
    expect(dH).toBeLessThan(15.6);
  });
});
