import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { defaultChemistryPort } from '@shared/thermal/chemistry-adapter';
import { solveEndState } from '@shared/thermal/end-state';
import type { ThermalComponent } from '@shared/thermal/pack-model';

/**
 * Adiabatic end temperatures of salt–water mixtures against enthalpy balances worked here by
 * hand from published values the product does not read (it reads NBS 1982 dilution data, the
 * CRC solubility table and Laliberté heat capacities), and against textbook calorimetry.
 */

const port = defaultChemistryPort();
const water = (massG: number): ThermalComponent => ({ key: 'water', massG, process: { kind: 'inert', role: 'water' } });
const salt = (solidKey: string, massG: number): ThermalComponent => ({ key: solidKey, massG, process: { kind: 'dissolution', solidKey } });

// Specific heat of water, J/(g·K): 4.18 (common textbook value).
const CP_WATER = 4.18;

/** Hand balance for complete dissolution: n·ΔsolH∞ = (m_w·cp_w + m_s·cp_s)·(T0 − T). */
function handCompleteDissolution(o: { saltG: number; molarMass: number; dH_kJ_per_mol: number; solidCp: number; waterG: number; t0: number }): number {
  const q = (o.saltG / o.molarMass) * o.dH_kJ_per_mol * 1000;
  return o.t0 - q / (o.waterG * CP_WATER + o.saltG * o.solidCp);
}

describe('adiabatic end temperature against hand-worked balances', () => {
  it('10 g KCl in 100 g water from 25 °C: within 0.3 K of the infinite-dilution balance', () => {
    // ΔsolH∞(KCl) = 17.22 kJ/mol: Parker, NSRDS-NBS 2 (1965), as printed in the CRC Handbook table
    // "Enthalpy of Solution of Electrolytes" (from memory). M = 74.55 g/mol; cp(KCl, s) = 0.69 J/(g·K) (CRC, from memory).
    // At n ≈ 414 mol H2O/mol the concentration effect is a few tenths of a kJ/mol, hence 0.3 K.
    const hand = handCompleteDissolution({ saltG: 10, molarMass: 74.55, dH_kJ_per_mol: 17.22, solidCp: 0.69, waterG: 100, t0: 25 });
    const r = solveEndState(port, { initialTempC: 25, components: [water(100), salt('KCl(cr)', 10)] });
    expect(Math.abs(r.endTempC - hand)).toBeLessThan(0.3);
    expect(r.solutes[0]!.dissolvedFraction).toBe(1);
  });

  it('40 g NH4NO3 in 100 g water from 25 °C: colder than 10 °C, but warmer than the infinite-dilution balance by the concentration effect', () => {
    // ΔsolH∞(NH4NO3) = 25.69 kJ/mol (Parker / CRC "Enthalpy of Solution of Electrolytes", from memory);
    // M = 80.04 g/mol; cp(NH4NO3, s) = 1.74 J/(g·K) (CRC, from memory). Hand balance ≈ −1.3 °C.
    // At n ≈ 11 mol H2O/mol the integral enthalpy of solution is well below the infinite-dilution value
    // (a concentrated cold pack absorbs less per mole), so the product must end warmer, yet the
    // temperature drop must keep at least 70 % of the hand-balance drop.
    const hand = handCompleteDissolution({ saltG: 40, molarMass: 80.04, dH_kJ_per_mol: 25.69, solidCp: 1.74, waterG: 100, t0: 25 });
    const r = solveEndState(port, { initialTempC: 25, components: [water(100), salt('NH4NO3(cr)', 40)] });
    expect(r.endTempC).toBeGreaterThan(hand);
    expect(25 - r.endTempC).toBeGreaterThan(0.7 * (25 - hand));
    expect(r.endTempC).toBeLessThan(10);
  });

  it('80 g NH4Cl in 100 g water from 25 °C is solubility-limited and within 3 K of a hand balance on solubility at the end temperature', () => {
    // Solubility of NH4Cl, g per 100 g water (Perry's Chemical Engineers' Handbook / Seidell, from memory):
    // 29.4 at 0 °C, 33.3 at 10 °C, 37.2 at 20 °C. ΔsolH∞ = 14.78 kJ/mol (Parker / CRC, from memory);
    // M = 53.49 g/mol; cp(NH4Cl, s) = 1.57 J/(g·K) (CRC, from memory).
    const sol = (t: number) => (t <= 10 ? 29.4 + (33.3 - 29.4) * (t / 10) : 33.3 + (37.2 - 33.3) * ((t - 10) / 10));
    const c = 100 * CP_WATER + 80 * 1.57;
    // Hand balance: (s(T)/M)·ΔsolH = C·(25 − T), solved by bisection on T in [0, 25].
    let lo = 0;
    let hi = 25;
    for (let i = 0; i < 60; i++) {
      const t = 0.5 * (lo + hi);
      const g = (sol(t) / 53.49) * 14.78e3 - c * (25 - t);
      // g rises with T: more dissolves and less sensible heat is left to supply.
      if (g > 0) hi = t;
      else lo = t;
    }
    const hand = 0.5 * (lo + hi);
    const r = solveEndState(port, { initialTempC: 25, components: [water(100), salt('NH4Cl(cr)', 80)] });
    expect(r.solutes[0]!.limitedBy).toBe('solubility');
    expect(Math.abs(r.endTempC - hand)).toBeLessThan(3);
    // The dissolved amount respects solubility at the end temperature (the product's own curve).
    const dissolvedG = r.solutes[0]!.dissolvedFraction * 80;
    expect(dissolvedG).toBeCloseTo(port.solubility_g_per_100g('NH4Cl(cr)', r.endTempC).value, 3);
  });
});

describe('textbook calorimetry (coffee-cup calorimeter, no heat loss)', () => {
  it('4.25 g NH4NO3 in 60.0 g water falls from 22.0 °C to 16.9 °C, within 0.3 K', () => {
    // Brown, LeMay, Bursten et al., Chemistry: The Central Science, 12th ed., exercise 5.56.
    const r = solveEndState(port, { initialTempC: 22.0, components: [water(60), salt('NH4NO3(cr)', 4.25)] });
    expect(Math.abs(r.endTempC - 16.9)).toBeLessThan(0.3);
  });

  it('1.60 g NH4NO3 in 75.0 g water falls from 25.00 °C to 23.34 °C, within 0.1 K', () => {
    // Zumdahl & Zumdahl, Chemistry, 10th ed., chapter 11 exercise on the lattice energy of NH4NO3.
    const r = solveEndState(port, { initialTempC: 25.0, components: [water(75), salt('NH4NO3(cr)', 1.6)] });
    expect(Math.abs(r.endTempC - 23.34)).toBeLessThan(0.1);
  });
});

describe('ammonium nitrate packs and the NH4NO3–H2O eutectic', () => {
  it('a concentrated NH4NO3 pack never ends below the eutectic, about −17 °C', () => {
    // NH4NO3–H2O eutectic: about −16.9 °C at about 42 % NH4NO3 (phase-diagram compilations, e.g. the
    // CRC Handbook; from memory). Bound −17.0 °C.
    fc.assert(
      fc.property(fc.double({ min: 20, max: 250, noNaN: true }), fc.double({ min: 30, max: 150, noNaN: true }), fc.double({ min: -5, max: 30, noNaN: true }), (saltG, waterG, t0) => {
        const r = solveEndState(port, { initialTempC: t0, components: [water(waterG), salt('NH4NO3(cr)', saltG)] });
        expect(r.endTempC).toBeGreaterThanOrEqual(-17.0);
        expect(r.energy.relativeBalanceError).toBeLessThan(1e-6);
      }),
      { numRuns: 150 },
    );
  });

  it('42 g NH4NO3 in 58 g water pre-chilled to 0 °C sits on the eutectic plateau with ice and undissolved salt', () => {
    const r = solveEndState(port, { initialTempC: 0, components: [water(58), salt('NH4NO3(cr)', 42)] });
    expect(r.endTempC).toBeGreaterThan(-17.0);
    expect(r.endTempC).toBeLessThan(-16.5);
    expect(r.iceG).toBeGreaterThan(0);
    expect(r.solutes[0]!.limitedBy).toBe('ice');
  });
});
