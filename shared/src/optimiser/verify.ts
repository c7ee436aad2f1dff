import type { Brief, Verification } from '../schemas/briefs';
import type { ChemistryPort } from '../thermal/chemistry-port';
import type { ThermalComponent } from '../thermal/pack-model';
import { simulateTimeProfile, type TargetBand, type TimeProfileResult } from '../thermal/time-profile';
import { resolveHeatExchange } from './heat-exchange';
import type { OptimiserIngredient } from './types';

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

/** Simulated horizon, min: reach + 1.5 × hold, so a margin of up to half the hold can show. */
/** The band in words: an open end (no surface limit) is left out rather than printed as −273 °C. */
export function describeBand(band: TargetBand): string {
  const fmtC = (v: number) => (Math.round(v * 10) / 10).toFixed(1);
  if (band.minC <= -273) return `at most ${fmtC(band.maxC)} °C`;
  if (band.maxC >= 1000) return `at least ${fmtC(band.minC)} °C`;
  return `${fmtC(band.minC)}–${fmtC(band.maxC)} °C`;
}

export function verificationHorizonMin(brief: Pick<Brief, 'reachWithinMin' | 'holdMin'>): number {
  return brief.reachWithinMin + 1.5 * brief.holdMin;
}

export interface VerifyOptions {
  /** Relative tolerance of the time model's integrator (default 1e-5: verification needs ~0.01 K). */
  rtol?: number;
  /** Calibration of the brief's contact case (default 1). */
  uaMultiplier?: number;
}

/**
 * Check a composition against the brief with the thermal time model (lumped capacitance with
 * per-process kinetics, thermal/time-profile.ts), over {@link verificationHorizonMin}:
 * - it reaches the target (cold: ≤ targetTempC, warm: ≥) within reachWithinMin;
 * - it spends at least holdMin minutes in the {@link holdBand};
 * - it stays within the surface limits (minSurfaceTempC ≤ T ≤ maxSurfaceTempC).
 * Each miss gives a reason with the figures. Differences under {@link VERIFY_TOLERANCE_K} and
 * {@link VERIFY_TOLERANCE_MIN} are not misses. An error from the time model gives `failed`.
 */
export function verifyComposition(
  port: ChemistryPort,
  brief: Brief,
  composition: readonly { ingredient: OptimiserIngredient; massG: number }[],
  options: VerifyOptions = {},
): Verification & { profile: TimeProfileResult | null } {
  const components: ThermalComponent[] = composition
    .filter((c) => c.massG > 0)
    .map((c) => ({
      key: c.ingredient.id,
      massG: c.massG,
      process: c.ingredient.process ?? {
        kind: 'inert',
        role: c.ingredient.role === 'solvent' ? 'water' : c.ingredient.role === 'packaging' ? 'packaging' : 'additive',
        ...(c.ingredient.cpJPerGK ? { cp_J_per_gK: c.ingredient.cpJPerGK } : {}),
      },
    }));
  const exchange = resolveHeatExchange(brief, options.uaMultiplier ?? 1);
  const band = holdBand(brief);
  const horizon = verificationHorizonMin(brief);
  let profile: TimeProfileResult;
  try {
    profile = simulateTimeProfile(port, {
      components,
      initialTempC: brief.initialTempC,
      envTempC: exchange.envTempC,
      uaWPerK: exchange.uaWPerK,
      packHeatCapacityJPerK: brief.packaging.heatCapacityJPerK,
      packAreaM2: brief.packAreaM2,
      holdMin: horizon,
      targetTempC: brief.targetTempC,
      targetBand: band,
      rtol: options.rtol ?? 1e-5,
    });
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
    };
  }
  const reasons: string[] = [];
  const cold = brief.packType === 'cold';
  const word = cold ? 'down to' : 'up to';
  if (profile.timeToTargetMin === null) {
    reasons.push(`never gets ${word} ${brief.targetTempC} °C in ${fmt(horizon)} min (${cold ? 'coldest' : 'warmest'} ${fmt(cold ? profile.minTempC : profile.maxTempC)} °C)`);
  } else if (profile.timeToTargetMin > brief.reachWithinMin + VERIFY_TOLERANCE_MIN) {
    reasons.push(`gets ${word} ${brief.targetTempC} °C after ${fmt(profile.timeToTargetMin)} min, later than the ${fmt(brief.reachWithinMin)} min allowed`);
  }
  const inBand = profile.minutesInBand ?? 0;
  if (inBand < brief.holdMin - VERIFY_TOLERANCE_MIN) {
    reasons.push(`holds ${describeBand(band)} for ${fmt(inBand)} min, short of the ${fmt(brief.holdMin)} min asked`);
  }
  if (brief.minSurfaceTempC !== null && profile.minTempC < brief.minSurfaceTempC - VERIFY_TOLERANCE_K) {
    reasons.push(`gets as cold as ${fmt(profile.minTempC)} °C, below the ${brief.minSurfaceTempC} °C surface limit`);
  }
  if (brief.maxSurfaceTempC !== null && profile.maxTempC > brief.maxSurfaceTempC + VERIFY_TOLERANCE_K) {
    reasons.push(`gets as warm as ${fmt(profile.maxTempC)} °C, above the ${brief.maxSurfaceTempC} °C surface limit`);
  }
  return {
    status: reasons.length ? 'missed' : 'passed',
    reasons,
    timeToTargetMin: profile.timeToTargetMin,
    minutesInBand: profile.minutesInBand,
    minTempC: profile.minTempC,
    maxTempC: profile.maxTempC,
    endTempC: profile.endTempC,
    holdMarginMin: inBand - brief.holdMin,
    profile,
  };
}

function fmt(x: number): string {
  return Math.abs(x) >= 100 ? x.toFixed(0) : x.toFixed(1);
}
