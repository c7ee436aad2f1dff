import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { defaultChemistryLibrary } from '@shared/chemistry';
import { DEMO_BRIEFS, DEMO_LIBRARY } from '@shared/demo/demo-library';
import { pruneDominated } from '@shared/optimiser/dominance';
import { runOptimisation } from '@shared/optimiser/run-optimisation';
import { sweepTarget } from '@shared/optimiser/sweep';
import type { OptimiserIngredient } from '@shared/optimiser/types';
import { chemistryPort } from '@shared/thermal/chemistry-adapter';

const lib = defaultChemistryLibrary();
const port = chemistryPort(lib);
const heater = DEMO_BRIEFS.find((b) => b.name === 'Trail-meal heater')!;
const compress = DEMO_BRIEFS.find((b) => b.name === 'Sideline cold compress')!;

describe('a run lists only simulated candidates and corrects the linear model by simulation', () => {
  const run = runOptimisation({ brief: heater, ingredients: DEMO_LIBRARY, chemistry: lib }, { port, sensitivity: false });

  it('every listed candidate was simulated with the time model', { timeout: 60_000 }, () => {
    expect(run.candidates.length).toBeGreaterThan(0);
    for (const c of run.candidates) expect(['passed', 'missed', 'failed'], c.setIds.join('+')).toContain(c.verification.status);
    expect(run.stats.verified).toBe(run.candidates.length);
  });

  it('every candidate that meets the brief ranks before every one that misses it', () => {
    const firstMiss = run.candidates.findIndex((c) => c.verification.status !== 'passed');
    if (firstMiss >= 0) for (const c of run.candidates.slice(firstMiss)) expect(c.verification.status).not.toBe('passed');
  });

  it('a set whose first optimum misses the hold is solved again with its shortfall and then meets the brief', () => {
    const corrected = run.candidates.filter((c) => (c.correction?.rounds ?? 0) > 0 && c.verification.status === 'passed');
    expect(corrected.length).toBeGreaterThan(0);
    for (const c of corrected) {
      expect(c.correction!.heatBudgetCorrectionJ).toBeGreaterThan(0);
      expect(c.correction!.rounds).toBeLessThanOrEqual(3);
      // The brief's own rule, checked on the simulated figures the candidate carries.
      expect(c.verification.minutesInBand!).toBeGreaterThanOrEqual((heater.holdMin ?? 0) - 0.05);
      expect(c.correction!.finalHoldMarginMin).toBeCloseTo(c.verification.holdMarginMin!, 9);
    }
    expect(run.stats.correctedSets).toBeGreaterThanOrEqual(corrected.length);
  });

  it("the target sweep's point at the brief's own target is rank 1's objective", () => {
    const brief = { ...heater, targetTempC: heater.targetTempC!, maxActives: 1 };
    const small = runOptimisation({ brief, ingredients: DEMO_LIBRARY, chemistry: lib }, { port, sensitivity: false });
    const sweep = sweepTarget({ brief, ingredients: DEMO_LIBRARY, chemistry: lib }, { parameter: 'targetTempC', from: brief.targetTempC - 2.5, to: brief.targetTempC + 2, points: 10 }, { port, run: small });
    const own = sweep.points.find((p) => Math.abs(p.value - brief.targetTempC) < 1e-9)!;
    expect(own).toBeDefined();
    expect(small.candidates[0]!.verification.status).toBe('passed');
    expect(own.bestObjective).toBe(small.candidates[0]!.objectiveValue);
  }, 60_000);

  it('a sweep point solved on its own reports the best objective that passes in simulation, as a run ranks it', () => {
    const brief = { ...compress, maxActives: 1 };
    const full = runOptimisation({ brief, ingredients: DEMO_LIBRARY, chemistry: lib }, { port, sensitivity: false, diagnose: false });
    const sweep = sweepTarget({ brief, ingredients: DEMO_LIBRARY, chemistry: lib }, { parameter: 'targetTempC', from: compress.targetTempC! + 1, to: compress.targetTempC! - 1, points: 10 }, { port });
    const own = sweep.points.find((p) => Math.abs(p.value - compress.targetTempC!) < 1e-9)!;
    const best = full.candidates.find((c) => c.verification.status === 'passed');
    expect(own.bestObjective).toBe(best ? best.objectiveValue : null);
  }, 60_000);
});

/** A demo library with extra grades of its actives: same chemistry, another cost (invented). */
function withGrades(extra: { baseIndex: number; costFactor: number }[]): OptimiserIngredient[] {
  const actives = DEMO_LIBRARY.filter((i) => i.role === 'active');
  const grades = extra.map((e, k) => {
    const base = actives[e.baseIndex % actives.length]!;
    return { ...base, id: `${base.id}~grade${k}`, name: `${base.name}, grade ${k}`, costPerKg: (Number(base.costPerKg) * e.costFactor).toFixed(2) };
  });
  return [...DEMO_LIBRARY, ...grades];
}

describe('dominance pruning loses no optimum', () => {
  it('keeps the cheapest of actives with the same chemistry, and says why the others were left out', () => {
    const library = withGrades([{ baseIndex: 0, costFactor: 1.5 }, { baseIndex: 0, costFactor: 0.5 }]);
    const actives = library.filter((i) => i.role === 'active');
    const { kept, dominated } = pruneDominated(actives);
    expect(kept.length + dominated.length).toBe(actives.length);
    const base = actives[0]!;
    const cheap = kept.find((i) => i.id === `${base.id}~grade1`);
    expect(cheap).toBeDefined();
    expect(dominated.map((d) => d.ingredient.id).sort()).toEqual([base.id, `${base.id}~grade0`].sort());
  });

  // Reference: full enumeration of every 1–3-active set of the same library (pruning off).
  it('on random libraries of grades, the pruned search finds the same best objective and only candidates full enumeration lists too', () => {
    const brief = { ...compress, maxActives: 2 };
    fc.assert(
      fc.property(
        fc.array(fc.record({ baseIndex: fc.integer({ min: 0, max: 40 }), costFactor: fc.double({ min: 0.3, max: 2.5, noNaN: true }) }), { minLength: 1, maxLength: 6 }),
        (extra) => {
          const library = withGrades(extra);
          const opts = { port, verifyTop: 0, diagnose: false, sensitivity: false } as const;
          const pruned = runOptimisation({ brief, ingredients: library, chemistry: lib }, opts);
          const full = runOptimisation({ brief, ingredients: library, chemistry: lib }, { ...opts, pruneDominated: false });
          expect(pruned.stats.setsEnumerated).toBeLessThanOrEqual(full.stats.setsEnumerated);
          const best = (r: typeof full) => (r.candidates.length ? Math.min(...r.candidates.map((c) => c.objectiveValue)) : null);
          const bp = best(pruned);
          const bf = best(full);
          if (bf === null) expect(bp).toBeNull();
          else expect(bp!).toBeCloseTo(bf, 9);
          const fullByKey = new Map(full.candidates.map((c) => [c.setIds.join('+'), c]));
          for (const c of pruned.candidates) {
            const twin = fullByKey.get(c.setIds.join('+'));
            expect(twin, c.setIds.join('+')).toBeDefined();
            expect(c.objectiveValue).toBeCloseTo(twin!.objectiveValue, 9);
          }
        },
      ),
      { numRuns: 12, seed: 20261202 },
    );
  }, 120_000);
});
