import { describe, expect, it } from 'vitest';
import { defaultChemistryPort } from '@shared/thermal/chemistry-adapter';
import { contactUA } from '@shared/thermal/contact';
import { solveEndState } from '@shared/thermal/end-state';
import { ThermalModelError } from '@shared/thermal/errors';
import type { ThermalComponent } from '@shared/thermal/pack-model';
import { simulateTimeProfile } from '@shared/thermal/time-profile';

/**
 * Boiling at 1 atm caps the temperature near 100 °C and the steam leaves the pack; beyond the
 * range where the data hold (−80…400 °C) the model stops with a message.
 */

const port = defaultChemistryPort();
const water = (massG: number): ThermalComponent => ({ key: 'water', massG, process: { kind: 'inert', role: 'water' } });
const quicklime = (massG: number): ThermalComponent => ({
  key: 'quicklime',
  massG,
  process: { kind: 'reaction', reactants: [{ key: 'CaO(cr)', coef: 1 }, { key: 'H2O(l)', coef: 1 }], products: [{ key: 'Ca(OH)2(cr)', coef: 1 }], ingredientKey: 'CaO(cr)' },
});

describe('boiling at 1 atm', () => {
  it('50 g CaO in 100 g water ends at the boiling point, not at 155 °C, and about 10 g of steam leaves', () => {
    // Hand balance from 20 °C: CaO + H2O → Ca(OH)2 releases 65.2 kJ/mol (Perry's Chemical
    // Engineers' Handbook, heats of formation, from memory) × 50/56.08 mol = 58.1 kJ. Heating the
    // 83.9 g of water left (4.18 J/(g·K)) and 66.1 g Ca(OH)2 (1.18 J/(g·K), CRC, from memory) by
    // 80 K takes 34.3 kJ; the rest boils 23.8 kJ / 2257 J/g (IAPWS-95) ≈ 10.5 g at 100 °C.
    // Tolerance 1.5 g: heat capacities are held at their 25 °C values.
    const r = solveEndState(port, { initialTempC: 20, components: [water(100), quicklime(50)] });
    expect(r.endTempC).toBeCloseTo(100, 2);
    expect(Math.abs(r.steamLostG - 10.5)).toBeLessThan(1.5);
    expect(r.massInventory.steamLostG).toBeCloseTo(r.steamLostG, 9);
    expect(r.warnings.map((w) => w.code)).toContain('thermal.steam-lost');
    expect(r.energy.relativeBalanceError).toBeLessThan(1e-6);
  });

  it('its time profile in still air holds near 100 °C while water boils off', () => {
    const components = [water(100), quicklime(50)];
    const c = contactUA({ case: 'still-air', geometry: { massG: 150 } }, 20, 150);
    const r = simulateTimeProfile(port, { components, initialTempC: 20, envTempC: 20, uaWPerK: c.uaWPerK, holdMin: 60 });
    // "Near": within 1.5 K of 100 °C (IAPWS-95: 99.97 °C at 101.325 kPa; the model boils off the
    // excess heat with a 2 s time constant).
    expect(r.maxTempC).toBeGreaterThan(99);
    expect(r.maxTempC).toBeLessThan(101.5);
    expect(r.steamLostG).toBeGreaterThan(1);
    expect(r.energy.relativeBalanceError).toBeLessThan(5e-3);
  });
});

describe('the range where the data hold', () => {
  it('an iron warmer has no adiabatic end state within −80…400 °C: a clear error, not 400 °C', () => {
    // 20 g Fe → Fe2O3 releases about 7.4 kJ/g (Hess's law, NBS 1982): ~150 kJ on ~30 J/K — far beyond 400 °C (common practice, no source).
    const components: ThermalComponent[] = [{ key: 'iron', massG: 20, process: { kind: 'air-oxidation' } }, water(5)];
    expect(() => solveEndState(port, { initialTempC: 20, components })).toThrow(ThermalModelError);
    expect(() => solveEndState(port, { initialTempC: 20, components })).toThrow(/−80 and 400 °C|-80 and 400 °C/);
  });

  it('a curve that would run beyond 400 °C stops with a message naming when', () => {
    // Iron oxidising with no losses and no water to boil: nothing caps it (common practice, no source).
    const components: ThermalComponent[] = [{ key: 'iron', massG: 20, process: { kind: 'air-oxidation', filmAreaM2: 0.05 } }];
    expect(() =>
      simulateTimeProfile(port, { components, initialTempC: 20, envTempC: 20, uaWPerK: 0, holdMin: 600 }),
    ).toThrow(/leaves the range where the model's data hold/);
  });
});
