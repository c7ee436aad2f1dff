import type { Sensitivity } from '../schemas/briefs';
import type { LinearModel } from './linear-model';
import { solveSet, type LpCounter } from './solve-set';

/** Step of the marginal rate, as a fraction of one unit. */
const MARGINAL_STEP = 1e-3;

/**
 * For each binding constraint of a solved set: the change of the objective when that
 * constraint's right-hand side is relaxed by one unit of its own (1 kJ of heat budget, 1 g of
 * mass or solute, 1 currency unit, 1 L of gas, 1 mmol O2), re-solving the LP with the same
 * coefficients, and the marginal rate (shadow price) from a step of 1/1000 of a unit. Relaxing
 * means: ≤ rows get rhs + unit, ≥ rows rhs − unit. Objective changes are in the objective's
 * unit (negative for least cost/mass means cheaper/lighter; positive for most hold margin).
 *
 * @example sensitivityOf(model, ['total-mass'], best)[0] // → { kind: 'total-mass', objectiveChangePerUnit: 0.21, unit: 'g', … } (most hold margin)
 */
export function sensitivityOf(model: LinearModel, binding: readonly string[], objectiveValue: number, counter?: LpCounter): Sensitivity[] {
  const out: Sensitivity[] = [];
  for (const id of binding) {
    const k = model.constraints.findIndex((c) => c.id === id);
    const row = model.constraints[k];
    if (!row) continue;
    const solveWith = (step: number): number | null => {
      const relaxed = { ...row, rhs: row.sense === 'le' ? row.rhs + step : row.rhs - step };
      const s = solveSet({ ...model, constraints: model.constraints.map((c, j) => (j === k ? relaxed : c)) }, counter);
      return s.status === 'optimal' ? s.objectiveValue : null;
    };
    const one = solveWith(row.unitStep);
    const small = solveWith(row.unitStep * MARGINAL_STEP);
    out.push({
      constraintId: row.id,
      kind: row.kind,
      label: row.label,
      unit: row.unitLabel,
      objectiveChangePerUnit: one === null ? null : one - objectiveValue,
      marginalRate: small === null ? null : (small - objectiveValue) / MARGINAL_STEP,
      objectiveUnit: model.objective.unit,
    });
  }
  return out;
}
