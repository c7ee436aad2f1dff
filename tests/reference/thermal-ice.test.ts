import { describe, expect, it } from 'vitest';
import { defaultChemistryPort } from '@shared/thermal/chemistry-adapter';
import { solveEndState } from '@shared/thermal/end-state';
import { PackModel, type ThermalComponent } from '@shared/thermal/pack-model';
import { simulateTimeProfile } from '@shared/thermal/time-profile';

/**
 * Ice as an ingredient: it melts (heat of fusion 333.6 J/g at 0 °C, IAPWS release on the
 * thermodynamic properties of ice Ih, Feistel & Wagner, J. Phys. Chem. Ref. Data 35 (2006)
 * 1021) and joins the solution, so ice with a salt is a freezing mixture that reaches towards
 * the salt–water eutectic.
 */

const port = defaultChemistryPort();
const ice = (massG: number): ThermalComponent => ({ key: 'ice', massG, process: { kind: 'dissolution', solidKey: 'H2O(cr)', ionsPerFormulaUnit: 1 } });
const salt = (solidKey: string, massG: number): ThermalComponent => ({ key: solidKey, massG, process: { kind: 'dissolution', solidKey } });

describe('ice that melts', () => {
  it('100 g of ice warmed from −5 to 25 °C absorbs about 45 kJ', () => {
    // Hand balance: 100 g × [2.07 J/(g·K) × 5 K (ice Ih, Feistel & Wagner 2006: 2.10 at 0 °C, 2.03 at −10 °C)
    //   + 333.6 J/g + 4.18 J/(g·K) × 25 K (water, IAPWS-95)] = 44.85 kJ. Tolerance 0.3 kJ (heat capacities held constant).
    const m = new PackModel(port, [ice(100)]);
    const absorbed = m.enthalpyJ(25, m.equilibriumExtents(25)) - m.enthalpyJ(-5, m.initialExtents());
    expect(Math.abs(absorbed - 44850)).toBeLessThan(300);
    const r = solveEndState(port, { components: [ice(100)], initialTempC: -5, heatLostJ: -44850 });
    expect(Math.abs(r.endTempC - 25)).toBeLessThan(1);
    expect(r.iceG).toBe(0);
  });

  it('ice alone at −5 °C stays ice; melting at 0 °C is a plateau', () => {
    const r = solveEndState(port, { components: [ice(100)], initialTempC: -5, heatLostJ: -10000 });
    // 10 kJ: 1 kJ warms the ice to 0 °C, the rest melts ~27 g of it (333.6 J/g).
    expect(r.endTempC).toBeCloseTo(0, 6);
    expect(r.onPlateau).toBe(true);
    expect(Math.abs(r.iceG - (100 - (10000 - 100 * 2.05 * 5) / 333.6))).toBeLessThan(1);
  });

  it('ice + NaCl (3:1) from 0 °C: a freezing mixture that ends at the NaCl–water eutectic, −21.1 °C', () => {
    // Eutectic ice + NaCl·2H2O at −21.1 °C, 23.3 % NaCl (Linke & Seidell, Solubilities of
    // Inorganic and Metal-Organic Compounds, 4th ed., 1965; from memory). Tolerance 0.5 K.
    const components = [ice(100), salt('NaCl(cr)', 33)];
    const end = solveEndState(port, { components, initialTempC: 0 });
    expect(Math.abs(end.endTempC - -21.1)).toBeLessThan(0.5);
    expect(end.iceG).toBeGreaterThan(50);
    const r = simulateTimeProfile(port, { components, initialTempC: 0, envTempC: 0, uaWPerK: 0, holdMin: 30 });
    expect(Math.abs(r.endTempC - end.endTempC)).toBeLessThan(0.2);
    expect(r.energy.relativeBalanceError).toBeLessThan(1e-3);
  });

  it('ice + NH4NO3 from 0 °C reaches the NH4NO3–water eutectic, about −17 °C', () => {
    // Eutectic ice + NH4NO3 at about −16.9 °C, ≈ 42 % NH4NO3 (International Critical Tables vol. 4, 1928; from memory). Tolerance 1 K.
    const components = [ice(100), salt('NH4NO3(cr)', 60)];
    const end = solveEndState(port, { components, initialTempC: 0 });
    expect(Math.abs(end.endTempC - -16.9)).toBeLessThan(1);
    const r = simulateTimeProfile(port, { components, initialTempC: 0, envTempC: 0, uaWPerK: 0, holdMin: 30 });
    expect(Math.abs(r.endTempC - end.endTempC)).toBeLessThan(0.2);
    expect(r.energy.relativeBalanceError).toBeLessThan(1e-3);
  });
});
