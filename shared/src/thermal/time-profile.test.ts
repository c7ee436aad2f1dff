import { describe, expect, it } from 'vitest';
import { COLD_SALT, constructedPort, SPARING_SALT } from './__fixtures__/constructed-port';
import { defaultChemistryPort } from './chemistry-adapter';
import { DEFAULT_O2_PERMEANCE_MOL_PER_M2_S_PA } from './constants';
import { solveEndState } from './end-state';
import type { ThermalComponent } from './pack-model';
import { simulateTimeProfile, type TimeProfileInput } from './time-profile';

const water = (massG: number): ThermalComponent => ({ key: 'water', massG, process: { kind: 'inert', role: 'water' } });
const salt = (solidKey: string, massG: number): ThermalComponent => ({ key: solidKey, massG, process: { kind: 'dissolution', solidKey } });
const port = constructedPort({ 'COLD(cr)': COLD_SALT, 'SPARING(cr)': SPARING_SALT });
const real = defaultChemistryPort();

const adiabatic = (components: ThermalComponent[], initialTempC: number, holdMin = 60): TimeProfileInput => ({
  components,
  initialTempC,
  envTempC: initialTempC,
  uaWPerK: 0,
  holdMin,
});

describe('simulateTimeProfile', () => {
  const mixtures: [string, ThermalComponent[], number][] = [
    ['cold salt, fully dissolved', [water(100), salt('COLD(cr)', 40)], 25],
    ['sparing salt, solubility-limited', [water(100), salt('SPARING(cr)', 80)], 25],
    ['two salts', [water(100), salt('COLD(cr)', 30), salt('SPARING(cr)', 20)], 25],
    ['cold salt from 0 °C to its eutectic', [water(58), salt('COLD(cr)', 42)], 0],
  ];
  for (const [name, components, t0] of mixtures) {
    it(`an adiabatic profile ends at the end-state temperature (${name})`, () => {
      const end = solveEndState(port, { initialTempC: t0, components });
      const p = simulateTimeProfile(port, adiabatic(components, t0, 90));
      expect(p.endTempC).toBeCloseTo(end.endTempC, 1);
      expect(Math.abs(p.endTempC - end.endTempC)).toBeLessThan(0.05);
    });
  }

  it('an adiabatic profile of the real NH4NO3 chemistry ends at the end-state temperature', () => {
    const components = [water(100), salt('NH4NO3(cr)', 40)];
    const end = solveEndState(real, { initialTempC: 25, components });
    const p = simulateTimeProfile(real, adiabatic(components, 25, 30));
    expect(Math.abs(p.endTempC - end.endTempC)).toBeLessThan(0.02);
  });

  it('energy audit: heat released = heat stored + heat lost, within 0.5 %', () => {
    const cases: TimeProfileInput[] = [
      { components: [water(100), salt('NH4NO3(cr)', 40)], initialTempC: 25, envTempC: 25, uaWPerK: 0.3, holdMin: 20 },
      { components: [water(100), salt('NH4Cl(cr)', 80)], initialTempC: 25, envTempC: 30, uaWPerK: 1, holdMin: 60, packHeatCapacityJPerK: 40 },
      { components: [{ key: 'sat', massG: 120, process: { kind: 'crystallisation' } }], initialTempC: 20, envTempC: 10, uaWPerK: 0.4, holdMin: 90 },
      {
        components: [{ key: 'iron', massG: 20, process: { kind: 'air-oxidation' } }, water(5), { key: 'vermiculite', massG: 10, process: { kind: 'inert', role: 'additive' } }],
        initialTempC: 20,
        envTempC: 20,
        uaWPerK: 0.3,
        holdMin: 240,
        packAreaM2: 0.01,
      },
    ];
    for (const c of cases) {
      const p = simulateTimeProfile(real, c);
      expect(p.energy.relativeBalanceError).toBeLessThan(0.005);
      expect(p.energy.heatReleasedJ - p.energy.heatStoredJ - p.energy.heatLostJ).toBeCloseTo(p.energy.balanceErrorJ, 6);
    }
  });

  it('with UA > 0 the curve relaxes to the surroundings', () => {
    const p = simulateTimeProfile(real, {
      components: [water(100), salt('NH4NO3(cr)', 40)],
      initialTempC: 25,
      envTempC: 22,
      uaWPerK: 0.5,
      holdMin: 600,
    });
    expect(Math.abs(p.endTempC - 22)).toBeLessThan(0.05);
    expect(p.minTempC).toBeLessThan(10);
  });

  it('a triggered sodium acetate trihydrate melt holds a plateau just below its 58 °C melting point', () => {
    const p = simulateTimeProfile(real, {
      components: [{ key: 'sat', massG: 100, process: { kind: 'crystallisation' } }],
      initialTempC: 20,
      envTempC: 20,
      uaWPerK: 0.3,
      holdMin: 60,
      targetBand: { minC: 50, maxC: 58 },
    });
    expect(p.maxTempC).toBeLessThanOrEqual(58);
    expect(p.maxTempC).toBeGreaterThan(55);
    expect(p.minutesInBand!).toBeGreaterThan(10);
  });

  it('iron oxidation is limited by the O2 film supply and capped by the iron load', () => {
    const area = 0.01;
    const input: TimeProfileInput = {
      components: [{ key: 'iron', massG: 2, process: { kind: 'air-oxidation' } }, water(5)],
      initialTempC: 20,
      envTempC: 20,
      uaWPerK: 0.3,
      holdMin: 600,
      packAreaM2: area,
    };
    const p = simulateTimeProfile(real, input);
    const o2Mol = p.extents[0]!;
    const ironO2Cap = 2 / 55.845 / (4 / 3);
    expect(o2Mol).toBeLessThanOrEqual(ironO2Cap * (1 + 1e-9));
    expect(o2Mol).toBeGreaterThan(0.99 * ironO2Cap);
    // Supply-limited heating through one face of the pouch (the default film, area/2):
    // 5.5e-8 mol/(m²·s·Pa) × 0.005 m² × 21.2 kPa × 550 kJ/mol ≈ 3 W; short hold stays well under the cap.
    const early = simulateTimeProfile(real, { ...input, holdMin: 10 });
    const supplied = DEFAULT_O2_PERMEANCE_MOL_PER_M2_S_PA * (area / 2) * 0.2095 * 101325 * 600;
    expect(early.extents[0]!).toBeCloseTo(supplied, 6);
  });

  it('reports the first time a cold pack reaches its target and the minutes it spends in the band', () => {
    const p = simulateTimeProfile(real, {
      components: [water(100), salt('NH4NO3(cr)', 40)],
      initialTempC: 25,
      envTempC: 25,
      uaWPerK: 0.3,
      holdMin: 20,
      targetTempC: 10,
      targetBand: { minC: 0, maxC: 10 },
    });
    expect(p.timeToTargetMin).not.toBeNull();
    expect(p.timeToTargetMin!).toBeGreaterThan(0);
    expect(p.timeToTargetMin!).toBeLessThan(3);
    expect(p.minutesInBand!).toBeGreaterThan(10);
    expect(p.minutesInBand!).toBeLessThanOrEqual(20);
    expect(p.curve[0]).toEqual({ tMin: 0, tempC: 25 });
    expect(p.curve.at(-1)!.tMin).toBeCloseTo(20, 9);
  });

  it('one 20-minute cold-pack profile takes a few milliseconds', () => {
    const input: TimeProfileInput = { components: [water(100), salt('NH4NO3(cr)', 40)], initialTempC: 25, envTempC: 25, uaWPerK: 0.3, holdMin: 20 };
    simulateTimeProfile(real, input);
    const runs = 20;
    const t = performance.now();
    for (let i = 0; i < runs; i++) simulateTimeProfile(real, input);
    const ms = (performance.now() - t) / runs;
    // Measured about 2 ms on the development machine; the bound leaves room for slower CI.
    expect(ms).toBeLessThan(25);
  });

  it('rejects a negative UA, naming the field', () => {
    expect(() => simulateTimeProfile(port, { ...adiabatic([water(10)], 20), uaWPerK: -1 })).toThrow(/uaWPerK/);
  });
});
