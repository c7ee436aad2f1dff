import fc from 'fast-check';
import type { Highs } from 'highs';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { defaultChemistryLibrary } from '@shared/chemistry';
import { DEMO_BRIEFS, DEMO_LIBRARY } from '@shared/demo/demo-library';
import { rowViolation, type LinearModel } from '@shared/optimiser/linear-model';
import { runOptimisation, type RunOptimisationOutput } from '@shared/optimiser/run-optimisation';
import { toLpProblem } from '@shared/optimiser/solve-set';
import type { BriefInput } from '@shared/schemas/briefs';
import { chemistryPort } from '@shared/thermal/chemistry-adapter';
import { disposeHighsModel, highsModule, solveWithHighs } from './optimiser-highs';

// Reference: HiGHS (npm `highs`, the HiGHS LP solver compiled to WebAssembly) solves exactly the
// LP that javascript-lp-solver solved for every set; optima must agree within 1e-6 relative.

const lib = defaultChemistryLibrary();
const port = chemistryPort(lib);
let highs: Highs;
beforeAll(async () => {
  highs = await highsModule();
});
afterAll(disposeHighsModel);

const REL = 1e-6;

/** Objective of the scaled LP at x. */
function lpObjective(model: LinearModel, x: readonly number[]): number {
  const lp = toLpProblem(model);
  return x.reduce((s, v, i) => s + v * (lp.objective[i] ?? 0), 0);
}

interface CheckStats {
  optimal: number;
  infeasible: number;
  largestRelDiff: number;
}

/** Every solved set of a run: same status from HiGHS; optimal objective within 1e-6 relative; every returned composition satisfies every row. */
function crossCheck(run: RunOptimisationOutput): CheckStats {
  const stats: CheckStats = { optimal: 0, infeasible: 0, largestRelDiff: 0 };
  for (const s of run.solvedSets ?? []) {
    const h = solveWithHighs(highs, toLpProblem(s.model));
    expect(h.status, `set ${s.set.key}`).toBe(s.solution.status);
    if (s.solution.status !== 'optimal') {
      stats.infeasible++;
      continue;
    }
    stats.optimal++;
    const ours = lpObjective(s.model, s.solution.massesG);
    const rel = Math.abs(ours - h.objective) / Math.max(Math.abs(h.objective), 1e-9);
    stats.largestRelDiff = Math.max(stats.largestRelDiff, rel);
    expect(rel, `set ${s.set.key}: ours ${ours}, HiGHS ${h.objective}`).toBeLessThanOrEqual(REL);
    for (const row of s.model.constraints) {
      const scale = Math.max(1, Math.abs(row.rhs), ...row.coefficients.map((a, i) => Math.abs(a * (s.solution.massesG[i] ?? 0))));
      expect(rowViolation(row, s.solution.massesG) / scale, `set ${s.set.key}, row ${row.id}`).toBeLessThanOrEqual(1e-7);
    }
    for (const m of s.solution.massesG) expect(m).toBeGreaterThanOrEqual(0);
  }
  return stats;
}

const ACTIVE_IDS = DEMO_LIBRARY.filter((i) => i.role === 'active').map((i) => i.id);

const briefArb: fc.Arbitrary<BriefInput> = fc
  .record({
    packType: fc.constantFrom('cold' as const, 'warm' as const),
    ambientC: fc.double({ min: 10, max: 35, noNaN: true }),
    offsetK: fc.double({ min: 4, max: 30, noNaN: true }),
    holdMin: fc.double({ min: 2, max: 90, noNaN: true }),
    reachWithinMin: fc.double({ min: 2, max: 20, noNaN: true }),
    maxMassG: fc.double({ min: 150, max: 2500, noNaN: true }),
    maxUnitCost: fc.option(fc.double({ min: 0.5, max: 6, noNaN: true }), { nil: null }),
    contact: fc.constantFrom('still-air' as const, 'skin-through-fabric' as const, 'insulated' as const),
    packAreaM2: fc.double({ min: 0.01, max: 0.08, noNaN: true }),
    surface: fc.boolean(),
    objective: fc.constantFrom('least-cost' as const, 'least-mass' as const, 'most-hold-margin' as const),
    maxActives: fc.integer({ min: 1, max: 3 }),
    allowed: fc.subarray(ACTIVE_IDS, { minLength: 2, maxLength: 6 }),
    maxGasL: fc.double({ min: 0, max: 5, noNaN: true }),
  })
  .map((r) => {
    const target = r.packType === 'cold' ? r.ambientC - r.offsetK : r.ambientC + r.offsetK;
    return {
      name: 'random brief',
      packType: r.packType,
      ambientC: r.ambientC,
      targetTempC: target,
      holdMin: r.holdMin,
      reachWithinMin: r.reachWithinMin,
      maxMassG: r.maxMassG,
      maxUnitCost: r.maxUnitCost === null ? null : r.maxUnitCost.toFixed(2),
      contact: r.contact,
      packAreaM2: r.packAreaM2,
      minSurfaceTempC: r.packType === 'cold' && r.surface ? target - 8 : null,
      maxSurfaceTempC: r.packType === 'warm' && r.surface ? target + 15 : null,
      objective: r.objective,
      maxActives: r.maxActives,
      allowedIngredientIds: r.allowed,
      maxGasL: r.maxGasL,
    };
  });

describe('optimiser optima agree with HiGHS on the same LPs', () => {
  it('on at least 50 randomly generated feasible briefs, every set agrees with HiGHS within 1e-6 and every composition satisfies every constraint', () => {
    let feasibleBriefs = 0;
    let optimalSets = 0;
    fc.assert(
      fc.property(briefArb, (brief) => {
        const run = runOptimisation({ brief, ingredients: DEMO_LIBRARY, chemistry: lib }, { port, verifyTop: 0, diagnose: false, keepSolvedSets: true });
        fc.pre(run.candidates.length > 0);
        feasibleBriefs++;
        optimalSets += crossCheck(run).optimal;
      }),
      { numRuns: 50, seed: 20250611, maxSkipsPerRun: 20 },
    );
    expect(feasibleBriefs).toBeGreaterThanOrEqual(50);
    expect(optimalSets).toBeGreaterThanOrEqual(50);
  }, 120_000);

  it.each(DEMO_BRIEFS.map((b) => [b.name, b] as const))('the demo brief "%s": every set agrees with HiGHS and every composition satisfies every constraint', (_name, brief) => {
    const run = runOptimisation({ brief, ingredients: DEMO_LIBRARY, chemistry: lib }, { port, verifyTop: 0, diagnose: false, keepSolvedSets: true });
    const stats = crossCheck(run);
    expect(stats.optimal).toBeGreaterThan(0);
    expect(run.candidates.length).toBeGreaterThan(0);
  }, 120_000);
});
