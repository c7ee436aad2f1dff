import { describe, expect, it } from 'vitest';
import { defaultChemistryPort } from '@shared/thermal/chemistry-adapter';
import { WATER_CP_J_PER_GK } from '@shared/thermal/constants';
import { simulateTimeProfile } from '@shared/thermal/time-profile';

const port = defaultChemistryPort();

describe('time profile against the lumped-capacitance solution', () => {
  it('an inert water pack cools as T_env + (T0 − T_env)·exp(−UA·t/C)', () => {
    // Lumped-capacitance transient: Incropera & DeWitt, Fundamentals of Heat and Mass Transfer, eq. 5.6.
    const massG = 200;
    const packC = 30;
    const ua = 0.4;
    const c = massG * WATER_CP_J_PER_GK + packC;
    const p = simulateTimeProfile(port, {
      components: [{ key: 'water', massG, process: { kind: 'inert', role: 'water' } }],
      initialTempC: 60,
      envTempC: 20,
      uaWPerK: ua,
      packHeatCapacityJPerK: packC,
      holdMin: 120,
    });
    for (const pt of p.curve) {
      const exact = 20 + 40 * Math.exp((-ua * pt.tMin * 60) / c);
      expect(Math.abs(pt.tempC - exact)).toBeLessThan(1e-3);
    }
    // Heat lost equals the sensible heat given up: C·(T0 − T_end).
    expect(p.energy.heatLostJ).toBeCloseTo(c * (60 - p.endTempC), 0);
  });
});
