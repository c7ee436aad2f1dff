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

/** Solve an LpProblem with HiGHS (a persistent model reloaded with the LP as sparse CSR), x ≥ 0. `rowDuals` (one per problem row, NaN for dropped empty rows) when optimal. */
export function solveWithHighs(highs: Highs, problem: LpProblem): LpSolution & { rowDuals?: number[] } {
  const zeros = new Array<number>(problem.size).fill(0);
  const n = problem.size;
  // Rows with no coefficient are checked here (0 must satisfy them) and not passed to HiGHS.
  const rowIndex: number[] = [];
  const starts: number[] = [0];
  const indices: number[] = [];
  const values: number[] = [];
  const lower: number[] = [];
  const upper: number[] = [];
  for (const row of problem.rows) {
    const lo = row.sense === 'ge' ? row.rhs : -highs.infinity;
    const hi = row.sense === 'le' ? row.rhs : highs.infinity;
    const nz = row.coefficients.map((a, i) => [i, a] as const).filter(([, a]) => a !== 0);
    if (nz.length === 0) {
      if (0 < lo || 0 > hi) return { status: 'infeasible', x: zeros, objective: 0 };
      rowIndex.push(-1);
      continue;
    }
    rowIndex.push(lower.length);
    for (const [i, a] of nz) {
      indices.push(i);
      values.push(a);
    }
    starts.push(indices.length);
    lower.push(lo);
    upper.push(hi);
  }
  const data = {
    numCols: n,
    numRows: lower.length,
    sense: problem.sense === 'max' ? highs.constants.objectiveSense.maximize : highs.constants.objectiveSense.minimize,
    colCost: new Float64Array(problem.objective),
    colLower: new Float64Array(n),
    colUpper: new Float64Array(n).fill(highs.infinity),
    rowLower: new Float64Array(lower),
    rowUpper: new Float64Array(upper),
    matrix: { format: 'csr', numRows: lower.length, numCols: n, starts: new Int32Array(starts), indices: new Int32Array(indices), values: new Float64Array(values) },
  } as const;
  const model = persistentModel(highs);
  {
    model.passModel(data);
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
  }
}

let persistent: { highs: Highs; model: ReturnType<Highs['createModel']> } | null = null;

/** One persistent HiGHS model, reloaded with passModel for each LP; dispose with {@link disposeHighsModel}. */
function persistentModel(highs: Highs): ReturnType<Highs['createModel']> {
  if (!persistent || persistent.highs !== highs) {
    persistent?.model.dispose();
    const model = highs.createModel();
    model.options.set({ output_flag: false });
    persistent = { highs, model };
  }
  return persistent.model;
}

/** Dispose the persistent HiGHS model (its Wasm memory is not garbage-collected). */
export function disposeHighsModel(): void {
  persistent?.model.dispose();
  persistent = null;
}
