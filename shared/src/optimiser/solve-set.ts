import solver from 'javascript-lp-solver';
import { objectiveValue, rowValue, type LinearConstraint, type LinearModel } from './linear-model';

/**
 * A solver-neutral LP: minimise or maximise c·x subject to rows (≤ or ≥) and x ≥ 0. Built from a
 * {@link LinearModel} by {@link toLpProblem}, solved here with javascript-lp-solver; the tests and
 * the benchmark hand the very same problem to HiGHS.
 */
export interface LpProblem {
  sense: 'min' | 'max';
  objective: number[];
  rows: LpRow[];
  /** Number of variables. */
  size: number;
}

export interface LpRow {
  coefficients: number[];
  sense: 'le' | 'ge';
  rhs: number;
  /** Index of the model's constraint the row came from. */
  source: number;
}

export type LpStatus = 'optimal' | 'infeasible' | 'unbounded';

export interface LpSolution {
  status: LpStatus;
  /** Variable values (grams); zeros unless optimal. */
  x: number[];
  /** c·x of the scaled problem. */
  objective: number;
}

/**
 * The LP of a linear model, scaled for the simplex: each row divided by its largest |a_ij| (and
 * so its rhs), the objective by its largest |c_i|. Scaling changes neither the feasible set nor
 * the optimum's location; it keeps the tableau's pivots near 1 (heat rows are in J, about 10³ per
 * gram; cost rows about 10⁻³ per gram). A row with no non-zero coefficient is dropped when
 * 0 satisfies it and kept (so the LP is infeasible) when it does not.
 */
export function toLpProblem(model: LinearModel, extraRows: readonly LinearConstraint[] = []): LpProblem {
  const rows: LpRow[] = [];
  const all = [...model.constraints, ...extraRows];
  all.forEach((c, source) => {
    const scale = Math.max(...c.coefficients.map(Math.abs));
    if (!(scale > 0)) {
      const ok = c.sense === 'le' ? 0 <= c.rhs : 0 >= c.rhs;
      if (!ok) rows.push({ coefficients: c.coefficients.map(() => 0), sense: c.sense, rhs: c.rhs, source });
      return;
    }
    rows.push({ coefficients: c.coefficients.map((a) => a / scale), sense: c.sense, rhs: c.rhs / scale, source });
  });
  const oscale = Math.max(...model.objective.coefficients.map(Math.abs)) || 1;
  return { sense: model.objective.sense, objective: model.objective.coefficients.map((c) => c / oscale), rows, size: model.coefficients.length };
}

/** The part of javascript-lp-solver's loosely typed answer that we read. */
interface JsLpAnswer {
  feasible: boolean;
  bounded: boolean;
  values: Record<string, number>;
}

function narrow(raw: unknown): JsLpAnswer {
  if (typeof raw !== 'object' || raw === null) throw new TypeError(`javascript-lp-solver: expected an object answer, found ${typeof raw}`);
  const r = raw as Record<string, unknown>;
  if (typeof r.feasible !== 'boolean') throw new TypeError(`javascript-lp-solver: expected a boolean "feasible", found ${typeof r.feasible}`);
  const values: Record<string, number> = {};
  for (const [k, v] of Object.entries(r)) if (k.startsWith('x') && typeof v === 'number') values[k] = v;
  return { feasible: r.feasible, bounded: r.bounded !== false, values };
}

/**
 * Solve an {@link LpProblem} with javascript-lp-solver (dense simplex; values it reports are
 * rounded to 1e-9). A zero-coefficient row that 0 cannot satisfy makes the problem infeasible
 * before the solver is asked.
 *
 * @example solveLp({ sense: 'min', objective: [1], rows: [{ coefficients: [2], sense: 'ge', rhs: 4, source: 0 }], size: 1 }).x // → [2]
 */
export function solveLp(problem: LpProblem): LpSolution {
  const zeros = new Array<number>(problem.size).fill(0);
  if (problem.rows.some((r) => r.coefficients.every((a) => a === 0))) return { status: 'infeasible', x: zeros, objective: 0 };
  const constraints: Record<string, { min?: number; max?: number }> = {};
  const variables: Record<string, Record<string, number>> = {};
  for (let i = 0; i < problem.size; i++) variables[`x${i}`] = { obj: problem.objective[i] ?? 0 };
  problem.rows.forEach((row, k) => {
    const name = `r${k}`;
    constraints[name] = row.sense === 'le' ? { max: row.rhs } : { min: row.rhs };
    row.coefficients.forEach((a, i) => {
      if (a !== 0) variables[`x${i}`]![name] = a;
    });
  });
  const answer = narrow(solver.Solve({ optimize: 'obj', opType: problem.sense, constraints, variables }));
  if (!answer.feasible) return { status: 'infeasible', x: zeros, objective: 0 };
  if (!answer.bounded) return { status: 'unbounded', x: zeros, objective: problem.sense === 'min' ? -Infinity : Infinity };
  const x = zeros.map((_, i) => Math.max(0, answer.values[`x${i}`] ?? 0));
  const objective = x.reduce((s, v, i) => s + v * (problem.objective[i] ?? 0), 0);
  return { status: 'optimal', x, objective };
}

/** Counts LP solves across a run (the benchmark reports LPs per second). */
export interface LpCounter {
  count: number;
}

export interface SetSolution {
  status: LpStatus;
  massesG: number[];
  /** Objective in the model's unit, packaging constant included. */
  objectiveValue: number;
  /** Ids of the constraints that hold with equality at the optimum. */
  binding: string[];
}

/** Relative tolerance under which a row counts as binding. */
export const BINDING_TOLERANCE = 1e-7;

/**
 * Solve the LP of one set with javascript-lp-solver and read back grams, the objective in its
 * unit (recomputed from the grams, so rounding in the solver's reported objective does not
 * matter) and the binding rows: |Σa·m − rhs| ≤ 1e-7·max(1, |rhs|, Σ|a_i·m_i|).
 */
export function solveSet(model: LinearModel, counter?: LpCounter): SetSolution {
  const lp = toLpProblem(model);
  const sol = solveLp(lp);
  if (counter) counter.count++;
  if (sol.status !== 'optimal') return { status: sol.status, massesG: sol.x, objectiveValue: NaN, binding: [] };
  return { status: 'optimal', massesG: sol.x, objectiveValue: objectiveValue(model, sol.x), binding: bindingConstraints(model, sol.x) };
}

/** Ids of the rows of `model` that hold with equality at `massesG` (see {@link BINDING_TOLERANCE}). */
export function bindingConstraints(model: LinearModel, massesG: readonly number[]): string[] {
  const out: string[] = [];
  for (const c of model.constraints) {
    const v = rowValue(c, massesG);
    let mag = 0;
    c.coefficients.forEach((a, i) => (mag += Math.abs(a * (massesG[i] ?? 0))));
    if (Math.abs(v - c.rhs) <= BINDING_TOLERANCE * Math.max(1, Math.abs(c.rhs), mag)) out.push(c.id);
  }
  return out;
}
