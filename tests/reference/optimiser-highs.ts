import loadHighs, { type Highs } from 'highs';
import type { LpProblem, LpSolution } from '@shared/optimiser/solve-set';

/**
 * HiGHS (npm `highs`, the WebAssembly build of the HiGHS solver, University of Edinburgh) as the
 * reference LP solver: it is handed exactly the {@link LpProblem} that javascript-lp-solver
 * solves. One module is loaded per process; every persistent model is disposed.
 */
let loaded: Promise<Highs> | null = null;

export function highsModule(): Promise<Highs> {
  loaded ??= loadHighs();
  return loaded;
}

/** Solve an LpProblem with HiGHS (dual simplex by default), x ≥ 0. `rowDuals` (one per problem row, NaN for dropped empty rows) when optimal. */
export function solveWithHighs(highs: Highs, problem: LpProblem): LpSolution & { rowDuals?: number[] } {
  const zeros = new Array<number>(problem.size).fill(0);
  const model = highs.createModel();
  try {
    model.options.set({ output_flag: false });
    model.addVars(new Float64Array(problem.size), new Float64Array(problem.size).fill(highs.infinity));
    problem.objective.forEach((c, i) => model.changeColCost(i, c));
    model.changeObjectiveSense(problem.sense === 'max' ? highs.constants.objectiveSense.maximize : highs.constants.objectiveSense.minimize);
    const rowIndex: number[] = [];
    let added = 0;
    for (const row of problem.rows) {
      const indices: number[] = [];
      const values: number[] = [];
      row.coefficients.forEach((a, i) => {
        if (a !== 0) {
          indices.push(i);
          values.push(a);
        }
      });
      const lo = row.sense === 'ge' ? row.rhs : -highs.infinity;
      const hi = row.sense === 'le' ? row.rhs : highs.infinity;
      if (indices.length === 0) {
        if (0 < lo || 0 > hi) return { status: 'infeasible', x: zeros, objective: 0 };
        rowIndex.push(-1);
        continue;
      }
      rowIndex.push(added++);
      model.addRow(lo, hi, { indices: new Int32Array(indices), values: new Float64Array(values) });
    }
    model.run();
    const status = model.getModelStatus();
    if (status === highs.constants.modelStatus.optimal) {
      const sol = model.getSolution();
      const x = Array.from(sol.colValue, (v) => Math.max(0, v));
      const rowDuals = rowIndex.map((r) => (r < 0 ? NaN : sol.rowDual[r]!));
      return { status: 'optimal', x, objective: x.reduce((s, v, i) => s + v * (problem.objective[i] ?? 0), 0), rowDuals };
    }
    if (status === highs.constants.modelStatus.infeasible) return { status: 'infeasible', x: zeros, objective: 0 };
    if (status === highs.constants.modelStatus.unbounded) return { status: 'unbounded', x: zeros, objective: problem.sense === 'min' ? -Infinity : Infinity };
    if (status === highs.constants.modelStatus.unboundedOrInfeasible) return { status: 'infeasible', x: zeros, objective: 0 };
    throw new Error(`HiGHS: expected optimal, infeasible or unbounded, found model status ${status}`);
  } finally {
    model.dispose();
  }
}
