import type { Brief, BriefInput } from '../schemas/briefs';
import { briefSchema } from '../schemas/briefs';
import { runOptimisation, type RunOptimisationInput, type RunOptimisationOptions } from './run-optimisation';

export interface SweepPoint {
  /** The swept value: target temperature (°C) or hold time (min). */
  value: number;
  /** Best objective of the linear model at this value (objective's unit), null when no set is feasible. */
  bestObjective: number | null;
  /** Active ids of the best set, empty when none is feasible. */
  bestSetIds: string[];
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
}

/**
 * Target sweep: the best objective of the brief against its target temperature or hold time,
 * at `points` (10–30) evenly spaced values from `from` to `to` inclusive. Each point is a full
 * enumeration with the enthalpy iteration, without verification, diagnosis or sensitivity (the
 * sweep shows the trade-off of the linear model). A value that breaks the brief's rules (a
 * cold target above ambient, say) is reported as infeasible.
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
  for (let k = 0; k < range.points; k++) {
    if (options.isCancelled?.()) {
      status = 'cancelled';
      break;
    }
    const value = range.from + ((range.to - range.from) * k) / (range.points - 1);
    const candidateBrief: BriefInput = { ...base, [range.parameter]: value };
    const parsed = briefSchema.safeParse(candidateBrief);
    if (!parsed.success) {
      points.push({ value, bestObjective: null, bestSetIds: [], feasibleSets: 0 });
    } else {
      const r = runOptimisation(
        { ...input, brief: parsed.data },
        { ...(options.port ? { port: options.port } : {}), ...(options.extraCaps ? { extraCaps: options.extraCaps } : {}), ...(options.iteration ? { iteration: options.iteration } : {}), verifyTop: 0, diagnose: false, sensitivity: false },
      );
      lps += r.stats.lpsSolved;
      objectiveUnit = r.objectiveUnit;
      const best = r.candidates[0];
      points.push({ value, bestObjective: best ? best.objectiveValue : null, bestSetIds: best ? best.setIds : [], feasibleSets: r.stats.feasibleSets });
    }
    options.onProgress?.(k + 1, range.points);
  }
  return { parameter: range.parameter, objective: base.objective, objectiveUnit, points, lpsSolved: lps, status };
}
