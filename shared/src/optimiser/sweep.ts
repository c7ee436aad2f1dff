import type { Brief, BriefInput, OptimisationResult } from '../schemas/briefs';
import { briefSchema } from '../schemas/briefs';
import { runOptimisation, type RunOptimisationInput, type RunOptimisationOptions } from './run-optimisation';

export interface SweepPoint {
  /** The swept value: target temperature (°C) or hold time (min). */
  value: number;
  /**
   * Best objective at this value (objective's unit) among the sets whose optimum passes the
   * brief in simulation, as a run ranks them; null when none does.
   */
  bestObjective: number | null;
  /** Active ids of that set, empty when none passes. */
  bestSetIds: string[];
  /** Sets the linear model finds feasible at this value (passing in simulation or not). */
  feasibleSets: number;
}

export interface SweepResult {
  parameter: 'targetTempC' | 'holdMin';
  objective: Brief['objective'];
  objectiveUnit: string;
  points: SweepPoint[];
  lpsSolved: number;
  status: 'completed' | 'cancelled';
}

export interface SweepOptions extends Pick<RunOptimisationOptions, 'port' | 'extraCaps' | 'iteration' | 'isCancelled'> {
  /** Called after each point with (done, total). */
  onProgress?: (done: number, total: number) => void;
  /**
   * The run of the brief itself, when there is one: the point at the brief's own value is read
   * from its rank 1 instead of being solved again, so the two always agree.
   */
  run?: Pick<OptimisationResult, 'candidates' | 'stats'>;
}

/**
 * Target sweep: the best objective of the brief against its target temperature or hold time,
 * at `points` (10–30) evenly spaced values from `from` to `to` inclusive, plus the brief's own
 * value when it lies inside the range and is not one of them. Each point is a full enumeration
 * with the enthalpy iteration, simulated in objective order until the best set that passes is
 * known (`verifyMode: 'best-passing'`), without diagnosis or sensitivity: every objective on the
 * sweep is one a run would rank. A value that breaks the brief's rules (a cold target above
 * ambient, say) is reported as infeasible.
 *
 * @example sweepTarget({ brief, ingredients, chemistry }, { parameter: 'targetTempC', from: 10, to: 0, points: 11 }).points[0]
 * // → { value: 10, bestObjective: 0.11, bestSetIds: ['urea'], feasibleSets: 14 }
 */
export function sweepTarget(
  input: RunOptimisationInput,
  range: { parameter: 'targetTempC' | 'holdMin'; from: number; to: number; points: number },
  options: SweepOptions = {},
): SweepResult {
  if (!(Number.isInteger(range.points) && range.points >= 10 && range.points <= 30)) {
    throw new RangeError(`expected 10 to 30 sweep points, found ${range.points}`);
  }
  if (!(Number.isFinite(range.from) && Number.isFinite(range.to))) throw new RangeError(`expected a finite sweep range, found ${range.from} to ${range.to}`);
  const base: Brief = briefSchema.parse(input.brief);
  const points: SweepPoint[] = [];
  let lps = 0;
  let objectiveUnit = '';
  let status: SweepResult['status'] = 'completed';
  const values = Array.from({ length: range.points }, (_, k) => range.from + ((range.to - range.from) * k) / (range.points - 1));
  const own = base[range.parameter];
  const inside = (own - range.from) * (own - range.to) <= 0;
  if (inside && !values.some((v) => Math.abs(v - own) < 1e-9)) {
    values.push(own);
    values.sort((a, b) => (range.to >= range.from ? a - b : b - a));
  }
  for (let k = 0; k < values.length; k++) {
    if (options.isCancelled?.()) {
      status = 'cancelled';
      break;
    }
    const value = values[k]!;
    if (options.run && Math.abs(value - own) < 1e-9) {
      const best = options.run.candidates.find((c) => c.verification.status === 'passed');
      points.push({ value, bestObjective: best ? best.objectiveValue : null, bestSetIds: best ? best.setIds : [], feasibleSets: options.run.stats.feasibleSets });
      options.onProgress?.(k + 1, values.length);
      continue;
    }
    const candidateBrief: BriefInput = { ...base, [range.parameter]: value };
    const parsed = briefSchema.safeParse(candidateBrief);
    if (!parsed.success) {
      points.push({ value, bestObjective: null, bestSetIds: [], feasibleSets: 0 });
    } else {
      const r = runOptimisation(
        { ...input, brief: parsed.data },
        { ...(options.port ? { port: options.port } : {}), ...(options.extraCaps ? { extraCaps: options.extraCaps } : {}), ...(options.iteration ? { iteration: options.iteration } : {}), verifyMode: 'best-passing', diagnose: false, sensitivity: false },
      );
      lps += r.stats.lpsSolved;
      objectiveUnit = r.objectiveUnit;
      const best = r.candidates.find((c) => c.verification.status === 'passed');
      points.push({ value, bestObjective: best ? best.objectiveValue : null, bestSetIds: best ? best.setIds : [], feasibleSets: r.stats.feasibleSets });
    }
    options.onProgress?.(k + 1, values.length);
  }
  return { parameter: range.parameter, objective: base.objective, objectiveUnit, points, lpsSolved: lps, status };
}
