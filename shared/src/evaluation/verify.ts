import type { ChemistryLibrary } from '../chemistry/types';
import type { ModelCalibrations } from '../calibration/calibrations';
import type { Brief, Verification } from '../schemas/briefs';
import type { ChemistryPort } from '../thermal/chemistry-port';
import type { TargetBand, TimeProfileResult } from '../thermal/time-profile';
import type { EvaluationLine } from './components';
import { evaluate, type Evaluation, type EvaluationConditions, type EvaluationFigures } from './evaluate';
import { thermalContactCase } from './heat-exchange';

/** Temperature tolerance of the verification, K: differences below this are integration noise. */
export const VERIFY_TOLERANCE_K = 0.05;
/** Time tolerance, min. */
export const VERIFY_TOLERANCE_MIN = 0.05;

/**
 * The band a held pack must stay in: cold [minSurfaceTempC (or −273.15), target + bandK],
 * warm [target − bandK, maxSurfaceTempC (or 1000)] °C.
 *
 * @example holdBand({ packType: 'cold', targetTempC: 5, bandK: 2, minSurfaceTempC: 0, … }) // → { minC: 0, maxC: 7 }
 */
export function holdBand(brief: Pick<Brief, 'packType' | 'targetTempC' | 'bandK' | 'minSurfaceTempC' | 'maxSurfaceTempC'>): TargetBand {
  return brief.packType === 'cold'
    ? { minC: brief.minSurfaceTempC ?? -273.15, maxC: brief.targetTempC + brief.bandK }
    : { minC: brief.targetTempC - brief.bandK, maxC: brief.maxSurfaceTempC ?? 1000 };
}

/** The band in words: an open end (no surface limit) is left out rather than printed as −273 °C. */
export function describeBand(band: TargetBand): string {
  const fmtC = (v: number) => (Math.round(v * 10) / 10).toFixed(1);
  if (band.minC <= -273) return `at most ${fmtC(band.maxC)} °C`;
  if (band.maxC >= 1000) return `at least ${fmtC(band.minC)} °C`;
  return `${fmtC(band.minC)}–${fmtC(band.maxC)} °C`;
}

/** Simulated horizon, min: reach + 1.5 × hold, so a margin of up to half the hold can show. */
export function verificationHorizonMin(brief: Pick<Brief, 'reachWithinMin' | 'holdMin'>): number {
  return brief.reachWithinMin + 1.5 * brief.holdMin;
}

/**
 * The conditions of a brief: its start and ambient, its UA when given (the ambient as exchange
 * temperature) else its contact case over its area (thermal/contact.ts; a lab calibration of
 * that case applies), the packaging's heat capacity, the verification horizon, the target and
 * the hold band.
 *
 * @example conditionsFromBrief(brief).horizonMin // reach + 1.5 × hold
 */
export function conditionsFromBrief(brief: Brief, horizonMin = verificationHorizonMin(brief)): EvaluationConditions {
  const direct = brief.uaWPerK !== null && brief.uaWPerK !== undefined;
  return {
    initialTempC: brief.initialTempC,
    ambientC: brief.ambientC,
    exchange: direct ? { uaWPerK: brief.uaWPerK! } : { contact: { case: thermalContactCase(brief.contact), geometry: { areaM2: brief.packAreaM2 } } },
    ...(direct ? {} : { calibratedContact: brief.contact }),
    packHeatCapacityJPerK: brief.packaging.heatCapacityJPerK,
    packAreaM2: brief.packAreaM2,
    horizonMin,
    targetTempC: brief.targetTempC,
    targetBand: holdBand(brief),
    // Stored briefs from before the load was part of a brief have none.
    ...(brief.load ? { load: brief.load } : {}),
  };
}

/**
 * How a run misses its brief, one reason per miss with the figures (empty: it meets the brief);
 * with a load, the target and hold are judged on the load's temperature:
 * - it reaches the target (cold: ≤ targetTempC, warm: ≥) within reachWithinMin;
 * - it spends at least holdMin minutes in the {@link holdBand};
 * - it stays within the surface limits (minSurfaceTempC ≤ T ≤ maxSurfaceTempC).
 * Differences under {@link VERIFY_TOLERANCE_K} and {@link VERIFY_TOLERANCE_MIN} are not misses.
 */
export function briefMisses(
  brief: Brief,
  f: Pick<EvaluationFigures, 'minTempC' | 'maxTempC' | 'timeToTargetMin' | 'minutesInBand'> & { load?: { minTempC: number; maxTempC: number } | null },
  horizonMin = verificationHorizonMin(brief),
): string[] {
  const band = holdBand(brief);
  const reasons: string[] = [];
  const cold = brief.packType === 'cold';
  const word = cold ? 'down to' : 'up to';
  // With a load, the target and the hold are the load's (the surface limits stay the pack's).
  const who = f.load ? 'the load ' : '';
  const served = f.load ?? f;
  if (f.timeToTargetMin === null) {
    reasons.push(`${who}never gets ${word} ${brief.targetTempC} °C in ${fmt(horizonMin)} min (${cold ? 'coldest' : 'warmest'} ${fmt(cold ? served.minTempC : served.maxTempC)} °C)`);
  } else if (f.timeToTargetMin > brief.reachWithinMin + VERIFY_TOLERANCE_MIN) {
    reasons.push(`${who}gets ${word} ${brief.targetTempC} °C after ${fmt(f.timeToTargetMin)} min, later than the ${fmt(brief.reachWithinMin)} min allowed`);
  }
  const inBand = f.minutesInBand ?? 0;
  if (inBand < brief.holdMin - VERIFY_TOLERANCE_MIN) {
    reasons.push(`${who}holds ${describeBand(band)} for ${fmt(inBand)} min, short of the ${fmt(brief.holdMin)} min asked`);
  }
  if (brief.minSurfaceTempC !== null && f.minTempC < brief.minSurfaceTempC - VERIFY_TOLERANCE_K) {
    reasons.push(`gets as cold as ${fmt(f.minTempC)} °C, below the ${brief.minSurfaceTempC} °C surface limit`);
  }
  if (brief.maxSurfaceTempC !== null && f.maxTempC > brief.maxSurfaceTempC + VERIFY_TOLERANCE_K) {
    reasons.push(`gets as warm as ${fmt(f.maxTempC)} °C, above the ${brief.maxSurfaceTempC} °C surface limit`);
  }
  return reasons;
}

export interface VerifyOptions {
  /** Relative tolerance of the time model's integrator (default 1e-5: verification needs ~0.01 K). */
  rtol?: number;
  /** Applied lab calibrations (the run's snapshot or the workspace's active ones). */
  calibrations?: ModelCalibrations | null;
}

export type VerificationWithProfile = Verification & { profile: TimeProfileResult | null; evaluation: Evaluation | null };

/**
 * Check some lines against a brief with the evaluation core ({@link evaluate} under
 * {@link conditionsFromBrief}) over {@link verificationHorizonMin}; the misses are
 * {@link briefMisses}. An error from the time model gives `failed`.
 */
export function verifyComposition(
  chemistry: ChemistryLibrary | ChemistryPort,
  brief: Brief,
  lines: readonly EvaluationLine[],
  options: VerifyOptions = {},
): VerificationWithProfile {
  const horizon = verificationHorizonMin(brief);
  let ev: Evaluation;
  try {
    ev = evaluate({ lines, conditions: conditionsFromBrief(brief, horizon), chemistry, calibrations: options.calibrations ?? null, options: { rtol: options.rtol ?? 1e-5 } });
  } catch (e) {
    return {
      status: 'failed',
      reasons: [`the time model could not run this mixture: ${(e as Error).message}`],
      timeToTargetMin: null,
      minutesInBand: null,
      minTempC: null,
      maxTempC: null,
      endTempC: null,
      holdMarginMin: null,
      profile: null,
      evaluation: null,
    };
  }
  const f = ev.figures;
  const reasons = briefMisses(brief, f, horizon);
  return {
    status: reasons.length ? 'missed' : 'passed',
    reasons,
    timeToTargetMin: f.timeToTargetMin,
    minutesInBand: f.minutesInBand,
    minTempC: f.minTempC,
    maxTempC: f.maxTempC,
    endTempC: f.endTempC,
    holdMarginMin: (f.minutesInBand ?? 0) - brief.holdMin,
    profile: ev.profile,
    evaluation: ev,
  };
}

function fmt(x: number): string {
  return Math.abs(x) >= 100 ? x.toFixed(0) : x.toFixed(1);
}
