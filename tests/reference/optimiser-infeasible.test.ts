import type { Highs } from 'highs';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { defaultChemistryLibrary } from '@shared/chemistry';
import { DEMO_LIBRARY } from '@shared/demo/demo-library';
import { diagnoseInfeasible } from '@shared/optimiser/diagnose-infeasible';
import { rowValue } from '@shared/optimiser/linear-model';
import { runOptimisation } from '@shared/optimiser/run-optimisation';
import { toLpProblem } from '@shared/optimiser/solve-set';
import { chemistryPort } from '@shared/thermal/chemistry-adapter';
import { disposeHighsModel, highsModule, solveWithHighs } from './optimiser-highs';

const lib = defaultChemistryLibrary();
const port = chemistryPort(lib);
let highs: Highs;
beforeAll(async () => {
  highs = await highsModule();
});
afterAll(disposeHighsModel);

/** A cold pack that must hold 5 °C for ten hours in still air within 60 g: no mixture can. */
const impossible = {
  name: 'impossible',
  packType: 'cold' as const,
  ambientC: 30,
  targetTempC: 5,
  holdMin: 600,
  maxMassG: 60,
  maxActives: 2,
  packaging: { massG: 5, heatCapacityJPerK: 10, cost: '0.02' },
};

describe('an impossible brief', () => {
  it('returns no candidates and names the blocking constraints of every set, with shortfalls in their units', () => {
    const run = runOptimisation({ brief: impossible, ingredients: DEMO_LIBRARY, chemistry: lib }, { port });
    expect(run.candidates).toHaveLength(0);
    expect(run.infeasible.length).toBe(run.stats.setsEnumerated);
    for (const s of run.infeasible) {
      expect(s.blocking.length, s.setIds.join('+')).toBeGreaterThan(0);
      for (const b of s.blocking) {
        // A shortfall no finite relaxation covers is null and said in words (JSON has no Infinity).
        if (b.shortfall === null) expect(s.reason).toMatch(/no amount of this set can meet it/);
        else expect(b.shortfall).toBeGreaterThan(0);
        expect(b.unit.length).toBeGreaterThan(0);
      }
      expect(s.reason).toMatch(/stopped by/);
    }
    const kinds = new Set(run.infeasible.flatMap((s) => s.blocking.map((b) => b.kind)));
    expect(kinds.has('heat-budget')).toBe(true);
    expect(kinds.has('total-mass')).toBe(true);
  });

  it('the shortfall of a constraint relaxed alone equals the gap HiGHS finds when it pushes that row as far as the others allow', () => {
    // Reference: HiGHS, on the LP without the row, min (≤ rows) or max (≥ rows) of the row.
    const run = runOptimisation(
      { brief: { ...impossible, maxActives: 1, allowedIngredientIds: ['urea'] }, ingredients: DEMO_LIBRARY, chemistry: lib },
      { port, keepSolvedSets: true },
    );
    const model = run.solvedSets![0]!.model;
    const diagnosis = diagnoseInfeasible(model);
    const alone = diagnosis.blocking.filter((b) => b.relaxation === 'alone');
    expect(alone.length).toBeGreaterThan(0);
    for (const b of alone) {
      const k = model.constraints.findIndex((c) => c.id === b.constraintId);
      const row = model.constraints[k]!;
      const others = toLpProblem({ ...model, constraints: model.constraints.filter((_, j) => j !== k) });
      const h = solveWithHighs(highs, { ...others, sense: row.sense === 'le' ? 'min' : 'max', objective: row.coefficients });
      expect(h.status).toBe('optimal');
      const gap = row.sense === 'le' ? rowValue(row, h.x) - row.rhs : row.rhs - rowValue(row, h.x);
      expect(b.shortfall).not.toBeNull();
      expect(b.shortfall! * row.unitStep).toBeCloseTo(gap, 3);
    }
  });

  it('an ingredient that cannot help the pack type is left out with the reason', () => {
    const run = runOptimisation({ brief: { name: 'x', packType: 'cold', allowedIngredientIds: ['calcium-chloride', 'urea'] }, ingredients: DEMO_LIBRARY, chemistry: lib }, { port, verifyTop: 0 });
    expect(run.excludedIngredients).toEqual([expect.objectContaining({ ingredientId: 'calcium-chloride', reason: expect.stringMatching(/releases heat/) })]);
  });
});
