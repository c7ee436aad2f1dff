import type { Highs } from 'highs';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { defaultChemistryLibrary } from '@shared/chemistry';
import { DEMO_BRIEFS, DEMO_LIBRARY } from '@shared/demo/demo-library';
import { runOptimisation } from '@shared/optimiser/run-optimisation';
import { toLpProblem } from '@shared/optimiser/solve-set';
import { sweepTarget } from '@shared/optimiser/sweep';
import { chemistryPort } from '@shared/thermal/chemistry-adapter';
import { disposeHighsModel, highsModule, solveWithHighs } from './optimiser-highs';

const lib = defaultChemistryLibrary();
const port = chemistryPort(lib);
let highs: Highs;
beforeAll(async () => {
  highs = await highsModule();
});
afterAll(disposeHighsModel);

const compress = { ...DEMO_BRIEFS[0]!, maxActives: 2, allowedIngredientIds: ['urea', 'ammonium-nitrate', 'ammonium-chloride', 'sodium-bicarbonate', 'potassium-nitrate'] };

describe('target sweep', () => {
  it('least cost never falls as the cold target gets colder (every colder pack is a harder brief)', () => {
    const sweep = sweepTarget({ brief: compress, ingredients: DEMO_LIBRARY, chemistry: lib }, { parameter: 'targetTempC', from: 14, to: 1, points: 14 }, { port });
    expect(sweep.points).toHaveLength(14);
    // No feasible set counts as +∞: once a target is out of reach, every colder one is too.
    const values = sweep.points.map((p) => p.bestObjective ?? Infinity);
    expect(values.filter(Number.isFinite).length).toBeGreaterThanOrEqual(10);
    for (let k = 1; k < values.length; k++) expect(values[k]!).toBeGreaterThanOrEqual(values[k - 1]! * (1 - 1e-6));
    expect(values[9]!).toBeGreaterThan(values[0]!);
  });

  it('least cost never falls as the hold gets longer', () => {
    const sweep = sweepTarget({ brief: compress, ingredients: DEMO_LIBRARY, chemistry: lib }, { parameter: 'holdMin', from: 5, to: 60, points: 12 }, { port });
    const values = sweep.points.map((p) => p.bestObjective).filter((v): v is number => v !== null);
    for (let k = 1; k < values.length; k++) expect(values[k]!).toBeGreaterThanOrEqual(values[k - 1]! * (1 - 1e-6));
  });

  it('asks for 10 to 30 points', () => {
    expect(() => sweepTarget({ brief: compress, ingredients: DEMO_LIBRARY, chemistry: lib }, { parameter: 'holdMin', from: 5, to: 60, points: 5 })).toThrow(/10 to 30/);
  });
});

describe('sensitivity of binding constraints', () => {
  it('the marginal rate of each binding row equals HiGHS’s dual value of that row, in the objective’s unit per unit of the row', () => {
    // Reference: HiGHS row duals of the same (scaled) LP, converted back: dObj/dRhs = dual·s_obj/s_row.
    const run = runOptimisation({ brief: DEMO_BRIEFS[3]!, ingredients: DEMO_LIBRARY, chemistry: lib }, { port, verifyTop: 3, keepSolvedSets: true });
    let checked = 0;
    for (const cand of run.candidates.filter((c) => c.sensitivity.length > 0)) {
      const solved = run.solvedSets!.find((s) => s.set.activeIds.join('+') === cand.setIds.join('+'))!;
      const model = solved.model;
      const lp = toLpProblem(model);
      const h = solveWithHighs(highs, lp);
      const oscale = Math.max(...model.objective.coefficients.map(Math.abs));
      for (const sens of cand.sensitivity) {
        const k = model.constraints.findIndex((c) => c.id === sens.constraintId);
        const row = model.constraints[k]!;
        const r = lp.rows.findIndex((x) => x.source === k);
        const rs = Math.max(...row.coefficients.map(Math.abs));
        const dualNatural = Math.abs((h.rowDuals![r]! * oscale) / rs) * row.unitStep;
        if (sens.marginalRate === null || dualNatural < 1e-9) continue;
        expect(Math.abs(sens.marginalRate)).toBeCloseTo(dualNatural, 4);
        // Relaxing a binding row never makes the objective worse.
        const better = model.objective.sense === 'max' ? sens.objectiveChangePerUnit! >= -1e-9 : sens.objectiveChangePerUnit! <= 1e-9;
        expect(better).toBe(true);
        checked++;
      }
    }
    expect(checked).toBeGreaterThan(0);
  });
});

describe('a run', () => {
  it('reports progress up to its total and stops when cancelled, saying so', () => {
    const seen: [number, number][] = [];
    const full = runOptimisation({ brief: compress, ingredients: DEMO_LIBRARY, chemistry: lib }, { port, onProgress: (d, t) => seen.push([d, t]) });
    expect(full.status).toBe('completed');
    expect(seen.at(-1)![0]).toBe(seen.at(-1)![1]);
    expect(seen.every(([d], i) => i === 0 || d > seen[i - 1]![0])).toBe(true);
    let calls = 0;
    const cut = runOptimisation({ brief: compress, ingredients: DEMO_LIBRARY, chemistry: lib }, { port, isCancelled: () => ++calls > 3 });
    expect(cut.status).toBe('cancelled');
    expect(cut.stats.setsSolved).toBe(3);
  });
});
