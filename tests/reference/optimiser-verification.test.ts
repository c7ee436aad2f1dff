import { describe, expect, it } from 'vitest';
import { defaultChemistryLibrary } from '@shared/chemistry';
import { DEMO_LIBRARY } from '@shared/demo/demo-library';
import { runOptimisation } from '@shared/optimiser/run-optimisation';
import type { OptimiserIngredient } from '@shared/optimiser/types';
import { chemistryPort } from '@shared/thermal/chemistry-adapter';

const lib = defaultChemistryLibrary();
const port = chemistryPort(lib);
const byId = new Map(DEMO_LIBRARY.map((i) => [i.id, i]));

/**
 * Constructed case: "slow urea" is urea whose granules dissolve with a 100 min time constant
 * (rate constant 0.01/min instead of the default 1.5/min). Its equilibrium heat is urea's, so the
 * linear model (which is at equilibrium) finds it as good as urea, and it is cheaper; the time model
 * cannot get it to the target within the 3 min the brief allows.
 */
const slowUrea: OptimiserIngredient = {
  ...byId.get('urea')!,
  id: 'slow-urea',
  name: 'Urea, coarse granules (slow)',
  costPerKg: '0.55',
  process: { kind: 'dissolution', solidKey: 'CO(NH2)2(cr)', ionsPerFormulaUnit: 1, rateConstantPerMin: 0.01, rateConstantSource: 'constructed for the test' },
};
const library = [...DEMO_LIBRARY, slowUrea];
const brief = {
  name: 'quick compress',
  packType: 'cold' as const,
  targetTempC: 8,
  reachWithinMin: 3,
  holdMin: 10,
  maxActives: 1,
  minSurfaceTempC: -5,
  allowedIngredientIds: ['slow-urea', 'urea'],
};

describe('verification with the time model', () => {
  it('flags a candidate that meets the linear model but misses in simulation, with the reason, and ranks it below those that pass', () => {
    const run = runOptimisation({ brief, ingredients: library, chemistry: lib }, { port });
    const slow = run.candidates.find((c) => c.setIds.join() === 'slow-urea')!;
    const an = run.candidates.find((c) => c.setIds.join() === 'urea')!;
    expect(slow).toBeDefined();
    expect(an).toBeDefined();
    // Cheaper in the linear model…
    expect(slow.objectiveValue).toBeLessThan(an.objectiveValue);
    expect(slow.heatSurplusJ).toBeGreaterThanOrEqual(-1e-6);
    // …but the time model misses the brief, and says why.
    expect(slow.verification.status).toBe('missed');
    expect(slow.verification.reasons.join(' ')).toMatch(/later than the 3\.0 min allowed|never gets down to 8 °C/);
    expect(an.verification.status).toBe('passed');
    expect(an.rank).toBeLessThan(slow.rank);
    expect(run.candidates[0]!.verification.status).toBe('passed');
  });

  it('verified candidates carry the simulated extremes and minutes in band', () => {
    const run = runOptimisation({ brief: { ...brief, allowedIngredientIds: ['ammonium-nitrate', 'urea'] }, ingredients: library, chemistry: lib }, { port });
    for (const c of run.candidates.filter((x) => x.verification.status !== 'not-verified')) {
      expect(c.predictedMinTempC).not.toBeNull();
      expect(c.minutesInBand).not.toBeNull();
      // A cold pack's coldest simulated point is at or above the linear model's adiabatic extreme
      // (heat gained while it cools, and less salt dissolves as it gets colder).
      expect(c.predictedMinTempC!).toBeGreaterThanOrEqual(c.predictedExtremeTempC - 0.05);
    }
  });
});
