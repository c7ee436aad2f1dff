import { describe, expect, it } from 'vitest';
import { defaultChemistryLibrary } from '@shared/chemistry/library';
import { adiabaticDeltaT_K, idealGasVolumeL, packCharge, runsUntriggered, type PackTerm } from '@shared/chemistry/pack-reaction';
import { evaluateReaction, type ReactionInput } from '@shared/chemistry/reaction';

const lib = defaultChemistryLibrary();

function packTerms(input: ReactionInput): { terms: PackTerm[]; dH_kJ: number; dG_kJ: number | null } {
  const r = evaluateReaction(lib, input);
  return {
    dH_kJ: r.dH_kJ,
    dG_kJ: r.dG_kJ,
    terms: r.terms.map((t) => ({
      key: t.species.key,
      formula: t.species.formula,
      phase: t.species.phase,
      nu: t.nu,
      molarMass_g_per_mol: t.species.molarMass_g_per_mol,
      Cp_J_per_mol_K: t.species.Cp_J_per_mol_K,
    })),
  };
}

const quicklime: ReactionInput = {
  reactants: [{ formula: 'CaO', phase: 'cr', coef: 1 }, { formula: 'H2O', phase: 'l', coef: 1 }],
  products: [{ formula: 'Ca(OH)2', phase: 'cr', coef: 1 }],
  tempC: 25,
};

describe('ideal-gas volume', () => {
  it('1 mol at 273.15 K and 101.325 kPa is 22.413 97 L (CODATA 2018, molar volume of ideal gas)', () => {
    // Tolerance 1e-6 relative: R is exact, so only rounding of the published value remains.
    expect(idealGasVolumeL(1, 0)).toBeCloseTo(22.41396954, 5);
  });

  it('1 mol at 100 kPa and 273.15 K is 22.710 95 L (CODATA 2018, molar volume at 100 kPa)', () => {
    expect(idealGasVolumeL(1, 0, 100_000)).toBeCloseTo(22.71095464, 5);
  });
});

describe('adiabatic temperature change', () => {
  it('4.184 kJ into 1000 g of water at 4.184 J/(g·K) warms it by 1 K (definition of the thermochemical calorie, NIST SP 811)', () => {
    expect(adiabaticDeltaT_K(-4184, 1000 * 4.184)).toBeCloseTo(1, 12);
  });
});

describe('quicklime and water in a pack', () => {
  it('heat per gram of CaO ≈ 1.15 kJ/g (CRC Handbook table 5-4: ΔfH° CaO −634.9, H2O(l) −285.8, Ca(OH)2 −985.2 kJ/mol, from memory)', () => {
    // ΔrH = −985.2 + 634.9 + 285.8 = −64.5 kJ/mol; / 56.077 g/mol = 1150 J/g. The product reads NBS 1982
    // (−65.2 kJ/mol); the two tables differ by about 1 %, so the tolerance is 2 %.
    const { terms, dH_kJ } = packTerms(quicklime);
    const r = packCharge({ terms, dH_kJ, chargeG: { 'CaO(cr)': 10, 'H2O(l)': 10 }, waterRatio_g_per_g: 0, startTempC: 25 });
    expect(r.limitingKey).toBe('CaO(cr)');
    expect(r.extent_mol).toBeCloseTo(10 / 56.077, 3);
    expect(Math.abs((r.heatPerLimiting_J_per_g as number) / 1150 - 1)).toBeLessThan(0.02);
    // Per gram of the whole fill: the same heat over 20 g.
    expect(r.heatPerFill_J_per_g).toBeCloseTo(r.heat_J / 20, 9);
  });

  it('with 1 kg of water as heat sink, ΔT ≈ 64.5 kJ / (1074 g × 4.18 J/(g·K) + Cp Ca(OH)2 87.5 J/K) ≈ 14.4 K (CRC Handbook values, from memory; cp of water at 25 °C 4.1813 J/(g·K), IAPWS-95)', () => {
    const { terms, dH_kJ } = packTerms(quicklime);
    // 56.077 g CaO + 18.015 g water react; 1000 g more water absorbs the heat.
    const reagentsG = 56.077 + 18.015;
    const r = packCharge({ terms, dH_kJ, chargeG: { 'CaO(cr)': 56.077, 'H2O(l)': 18.015 }, waterRatio_g_per_g: 1000 / reagentsG, startTempC: 25 });
    const expected = 64_500 / (1000 * 4.1813 + 87.5);
    // 3 %: the enthalpy tables differ by about 1 % and water's cp varies 0.1 % over the range.
    expect(Math.abs(r.adiabaticDeltaT_K / expected - 1)).toBeLessThan(0.03);
    expect(r.boiledOffG).toBe(0);
    expect(r.packTempC).toBeCloseTo(25 + r.adiabaticDeltaT_K, 9);
  });

  it('with little water the pack would pass 100 °C, so it stays there and boils water off (ΔvapH 2256 J/g, IAPWS-95)', () => {
    const { terms, dH_kJ } = packTerms(quicklime);
    // 0.5 g extra water per g: 37 g. To 100 °C takes ≈ (87.5 + 37 × 4.18) J/K × 75 K ≈ 18 kJ of the 65 kJ; the rest boils ≈ 21 g.
    const r = packCharge({ terms, dH_kJ, chargeG: { 'CaO(cr)': 56.077, 'H2O(l)': 18.015 }, waterRatio_g_per_g: 0.5, startTempC: 25 });
    expect(r.adiabaticDeltaT_K).toBeGreaterThan(75);
    expect(r.packTempC).toBe(100);
    const expectedBoiledG = (r.heat_J - r.heatCapacity_J_per_K * 75) / 2256.4;
    expect(r.boiledOffG).toBeCloseTo(expectedBoiledG, 6);
    expect(Math.abs(r.boiledOffG - 21)).toBeLessThan(1.5);
  });

  it('runs at room temperature without a trigger: ΔrG° ≈ −57 kJ (CRC Handbook table 5-4 ΔfG°: CaO −603.3, H2O(l) −237.1, Ca(OH)2 −897.5, from memory)', () => {
    const { dG_kJ } = packTerms(quicklime);
    expect(Math.abs((dG_kJ as number) - -57.1)).toBeLessThan(1.5);
    expect(runsUntriggered(dG_kJ)).toBe('yes');
    expect(runsUntriggered(null)).toBe('unknown');
    expect(runsUntriggered(12)).toBe('no');
  });
});

describe('magnesium and water (flameless heater chemistry)', () => {
  const magnesium: ReactionInput = {
    reactants: [{ formula: 'Mg', phase: 'cr', coef: 1 }, { formula: 'H2O', phase: 'l', coef: 2 }],
    products: [{ formula: 'Mg(OH)2', phase: 'cr', coef: 1 }, { formula: 'H2', phase: 'g', coef: 1 }],
    tempC: 25,
  };

  it('gives one mole of hydrogen per mole of Mg: 1 g Mg → 0.0411 mol, ≈ 1.01 L at 25 °C and 1 atm (24.465 L/mol, CODATA molar volume scaled by 298.15/273.15)', () => {
    const { terms, dH_kJ } = packTerms(magnesium);
    // Lots of water keeps the pack near room temperature; the volume is then checked at the pack temperature it reports.
    const r = packCharge({ terms, dH_kJ, chargeG: { 'Mg(cr)': 1, 'H2O(l)': 5 }, waterRatio_g_per_g: 2000, startTempC: 25 });
    expect(r.limitingKey).toBe('Mg(cr)');
    expect(r.gas_mol).toBeCloseTo(1 / 24.305, 4); // Mg 24.305 g/mol (IUPAC 2021 conventional weight)
    expect(r.packTempC - 25).toBeLessThan(0.5);
    expect(r.gasVolumeL).toBeCloseTo((1 / 24.305) * 22.41396954 * ((r.packTempC + 273.15) / 273.15), 4);
    expect(Math.abs(r.gasVolumeL - 1.007)).toBeLessThan(0.01);
  });

  it('heat per gram of Mg ≈ 14.5 kJ/g (CRC Handbook table 5-4: ΔfH° Mg(OH)2 −924.5, H2O(l) −285.8 kJ/mol → −352.9 kJ/mol, from memory)', () => {
    const { terms, dH_kJ } = packTerms(magnesium);
    const r = packCharge({ terms, dH_kJ, chargeG: { 'Mg(cr)': 1, 'H2O(l)': 5 }, waterRatio_g_per_g: 0, startTempC: 25 });
    // 2 %: NBS and CRC tables differ by a fraction of a per cent here.
    expect(Math.abs((r.heatPerLimiting_J_per_g as number) / (352_900 / 24.305) - 1)).toBeLessThan(0.02);
  });
});
