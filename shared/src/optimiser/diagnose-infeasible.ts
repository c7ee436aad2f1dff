import type { BlockingConstraint, InfeasibleSet } from '../schemas/briefs';
import { rowValue, type LinearConstraint, type LinearModel } from './linear-model';
import { solveLp, toLpProblem, type LpCounter, type LpProblem } from './solve-set';

/**
 * Why a set's LP is infeasible, and by how much.
 *
 * 1. Relax each constraint in turn: with every other row kept, push the row's left-hand side as
 *    far as it goes in its own direction (≤ rows: min Σa·m; ≥ rows: max Σa·m). When the other
 *    rows are feasible, the gap to the rhs is exactly how far this constraint alone must be
 *    relaxed ("alone"), in the row's unit (J → reported in kJ, g, currency, L, mol).
 * 2. When no single row's relaxation suffices, the elastic LP: each row gets a slack e_k ≥ 0
 *    (Σa·m + e_k ≥ rhs, or Σa·m − e_k ≤ rhs), each slack weighted by 1/max(|rhs|, row scale),
 *    and min Σ w_k·e_k; every row with e_k > 0 is reported with its slack ("jointly").
 *
 * Rows added only to tie additives to their active (additive-ratio) and the water balance are
 * never reported as the reason on their own; they stay hard.
 *
 * @example diagnoseInfeasible(model).blocking[0] // → { kind: 'heat-budget', shortfall: 12.4, unit: 'kJ', relaxation: 'alone', … }
 */
export function diagnoseInfeasible(model: LinearModel, counter?: LpCounter): InfeasibleSet {
  const rows = model.constraints;
  const relaxable = rows.map((r) => r.kind !== 'additive-ratio' && r.kind !== 'water-for-reaction');
  const blocking: BlockingConstraint[] = [];
  rows.forEach((row, k) => {
    if (!relaxable[k]) return;
    const others: LinearModel = { ...model, constraints: rows.filter((_, j) => j !== k) };
    const lp = toLpProblem(others);
    const scale = Math.max(...row.coefficients.map(Math.abs)) || 1;
    const probe: LpProblem = { ...lp, sense: row.sense === 'le' ? 'min' : 'max', objective: row.coefficients.map((a) => a / scale) };
    const sol = solveLp(probe);
    if (counter) counter.count++;
    if (sol.status === 'infeasible') return;
    if (sol.status === 'unbounded') return;
    const best = rowValue(row, sol.x);
    const gap = row.sense === 'le' ? best - row.rhs : row.rhs - best;
    if (gap > 1e-9 * Math.max(1, Math.abs(row.rhs))) blocking.push(toBlocking(row, gap, 'alone'));
  });
  if (blocking.length === 0) blocking.push(...elastic(model, relaxable, counter));
  blocking.sort((a, b) => (a.relaxation === b.relaxation ? 0 : a.relaxation === 'alone' ? -1 : 1));
  const names = model.set.members.filter((m) => model.set.activeIds.includes(m.id)).map((m) => m.name);
  return {
    setIds: model.set.activeIds,
    setNames: names,
    blocking,
    reason: reasonText(blocking),
  };
}

function elastic(model: LinearModel, relaxable: boolean[], counter?: LpCounter): BlockingConstraint[] {
  const rows = model.constraints;
  const nv = model.coefficients.length;
  const slackIndex: number[] = [];
  let nExtra = 0;
  rows.forEach((_, k) => {
    slackIndex[k] = relaxable[k] ? nv + nExtra++ : -1;
  });
  const size = nv + nExtra;
  const lpRows = rows.map((row, k) => {
    const scale = Math.max(...row.coefficients.map(Math.abs), 1e-300);
    const coefficients = new Array<number>(size).fill(0);
    row.coefficients.forEach((a, i) => (coefficients[i] = a / scale));
    const si = slackIndex[k]!;
    if (si >= 0) coefficients[si] = row.sense === 'ge' ? 1 : -1;
    return { coefficients, sense: row.sense, rhs: row.rhs / scale, source: k };
  });
  const objective = new Array<number>(size).fill(0);
  rows.forEach((row, k) => {
    const si = slackIndex[k]!;
    if (si < 0) return;
    const scale = Math.max(...row.coefficients.map(Math.abs), 1e-300);
    objective[si] = 1 / Math.max(Math.abs(row.rhs) / scale, 1);
  });
  const sol = solveLp({ sense: 'min', objective, rows: lpRows, size });
  if (counter) counter.count++;
  if (sol.status !== 'optimal') return [];
  const out: BlockingConstraint[] = [];
  rows.forEach((row, k) => {
    const si = slackIndex[k]!;
    if (si < 0) return;
    const scale = Math.max(...row.coefficients.map(Math.abs), 1e-300);
    const e = (sol.x[si] ?? 0) * scale;
    if (e > 1e-9 * Math.max(1, Math.abs(row.rhs))) out.push(toBlocking(row, e, 'jointly'));
  });
  return out;
}

function toBlocking(row: LinearConstraint, gap: number, relaxation: 'alone' | 'jointly'): BlockingConstraint {
  const inUnit = gap / row.unitStep;
  // JSON has no Infinity: an unbounded shortfall is null and said in words by reasonText.
  return { constraintId: row.id, kind: row.kind, label: row.label, shortfall: Number.isFinite(inUnit) ? inUnit : null, unit: row.unitLabel, relaxation };
}

function reasonText(blocking: BlockingConstraint[]): string {
  if (blocking.length === 0) return 'no mixture of this set meets the brief, and no single constraint explains it';
  const fmt = (b: BlockingConstraint) =>
    b.shortfall === null ? `${b.label} (no amount of this set can meet it)` : `${b.label} (short by ${b.shortfall.toPrecision(3)} ${b.unit})`;
  const alone = blocking.filter((b) => b.relaxation === 'alone');
  if (alone.length) return `stopped by ${alone.map(fmt).join('; or by ')}`;
  return `stopped by ${blocking.map(fmt).join(' together with ')}`;
}
