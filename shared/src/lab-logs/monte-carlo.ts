import type { ModelCalibrations } from '../calibration/calibrations';
import type { Brief } from '../schemas/briefs';
import { briefMisses, holdBand, verificationHorizonMin } from '../evaluation/verify';
import type { ChemistryPort } from '../thermal/chemistry-port';
import type { ThermalComponent } from '../thermal/pack-model';
import type { TimeProfileResult } from '../thermal/time-profile';
import { interpolateCurve } from './overlay';
import { simulateScenario, type LabScenario, type ModelParameters } from './scenario';

/**
 * Relative standard deviations (1σ) of the data behind a prediction, and their basis.
 */
export interface UncertaintySpreads {
  /** Enthalpy of solution / reaction heat. */
  enthalpyRel: number;
  /** Heat capacity of the pack. */
  heatCapacityRel: number;
  /** Overall heat-exchange conductance UA. */
  uaRel: number;
}

/**
 * Default spreads (1σ, relative):
 * - ΔH ±3 %: integral enthalpies of solution from the NBS tables carry about ±0.2–0.5 kJ/mol
 *   on 15–80 kJ/mol, plus interpolation in concentration (from memory; assumption 3 %).
 * - Cp ±2 %: the Laliberté apparent-heat-capacity fits reproduce data to about 1–2 % (Laliberté,
 *   J. Chem. Eng. Data 54 (2009) 1725, from memory; assumption 2 %).
 * - UA ±15 %: free-convection correlations are quoted to about ±15–25 % (Incropera & DeWitt,
 *   Fundamentals of Heat and Mass Transfer, ch. 9, from memory) and fabric contact varies more;
 *   assumption 15 % — a lab calibration of the contact case is what narrows it.
 */
export const DEFAULT_SPREADS: UncertaintySpreads = { enthalpyRel: 0.03, heatCapacityRel: 0.02, uaRel: 0.15 };
export const SPREAD_BASIS: Record<keyof UncertaintySpreads, string> = {
  enthalpyRel: 'NBS-table enthalpies of solution ±0.2–0.5 kJ/mol plus concentration interpolation (from memory; assumption)',
  heatCapacityRel: 'Laliberté (2009) apparent heat-capacity fits, about 1–2 % (from memory; assumption)',
  uaRel: 'free-convection correlations ±15–25 % (Incropera & DeWitt ch. 9, from memory; assumption) — narrowed by a lab calibration',
};

/** Mulberry32: a small seeded 32-bit PRNG (T. Ettinger, public domain), uniform in [0, 1). */
export function mulberry32(seed: number): () => number {
  let a = seed >>> 0;
  return () => {
    a = (a + 0x6d2b79f5) >>> 0;
    let t = a;
    t = Math.imul(t ^ (t >>> 15), t | 1);
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
}

/** Standard normal deviates by the Box–Muller transform (Box & Muller, Ann. Math. Stat. 29 (1958) 610). */
export function normalSampler(uniform: () => number): () => number {
  let spare: number | null = null;
  return () => {
    if (spare !== null) {
      const s = spare;
      spare = null;
      return s;
    }
    let u = 0;
    while (u <= 1e-12) u = uniform();
    const v = uniform();
    const r = Math.sqrt(-2 * Math.log(u));
    spare = r * Math.sin(2 * Math.PI * v);
    return r * Math.cos(2 * Math.PI * v);
  };
}

export interface BandPoint {
  tMin: number;
  p5: number;
  p50: number;
  p95: number;
}

export interface MonteCarloResult {
  band: BandPoint[];
  nominal: { tMin: number; tempC: number }[];
  /** Share of samples meeting the brief (null when no criterion was given). */
  probabilityMeetsBrief: number | null;
  samples: number;
  failedSamples: number;
  spreads: UncertaintySpreads;
  seed: number;
}

export interface MonteCarloOptions {
  samples?: number;
  seed?: number;
  spreads?: UncertaintySpreads;
  /** Relative tolerance of each sample's integration (default 1e-4: the band is a few tenths of a kelvin wide at least). */
  rtol?: number;
  /** Points of the band (default 80). */
  bandPoints?: number;
  meets?: (profile: TimeProfileResult) => boolean;
}

/** Linear-interpolated percentile of sorted values (type 7, as R's default and numpy's `linear`). */
export function percentile(sorted: readonly number[], q: number): number {
  if (sorted.length === 0) return NaN;
  const h = (sorted.length - 1) * q;
  const lo = Math.floor(h);
  const hi = Math.min(sorted.length - 1, lo + 1);
  return sorted[lo]! + (h - lo) * (sorted[hi]! - sorted[lo]!);
}

/**
 * Monte Carlo propagation of the data's uncertainty through the time model: N samples of
 * (ΔH factor, Cp factor, UA factor) ~ independent normals about 1 with the given relative σ
 * (truncated at ±4σ and at 0.05), each simulated with {@link simulateScenario}; at each of
 * `bandPoints` times the 5th, 50th and 95th percentiles of temperature; and the share of
 * samples meeting the brief (`meets`). Seeded (mulberry32 + Box–Muller), so the same input
 * gives the same band.
 *
 * @example monteCarloBand(port, scenario, { samples: 200, meets }).probabilityMeetsBrief // e.g. 0.87
 */
export function monteCarloBand(port: ChemistryPort, scenario: LabScenario, options: MonteCarloOptions = {}): MonteCarloResult {
  const n = Math.max(2, Math.floor(options.samples ?? 200));
  const seed = options.seed ?? 20240501;
  const spreads = options.spreads ?? DEFAULT_SPREADS;
  const rtol = options.rtol ?? 1e-4;
  const bandPoints = Math.max(2, options.bandPoints ?? 80);
  const gauss = normalSampler(mulberry32(seed));
  const draw = (sigma: number) => Math.max(0.05, 1 + sigma * Math.max(-4, Math.min(4, gauss())));
  const times = Array.from({ length: bandPoints }, (_, i) => (scenario.horizonMin * i) / (bandPoints - 1));
  const nominalProfile = simulateScenario(port, scenario, { uaMultiplier: 1, enthalpyFactor: 1, rateMultiplier: 1, heatCapacityFactor: 1 }, { rtol });
  const columns: number[][] = times.map(() => []);
  let meets = 0;
  let failed = 0;
  for (let s = 0; s < n; s++) {
    const p: ModelParameters = {
      enthalpyFactor: draw(spreads.enthalpyRel),
      heatCapacityFactor: draw(spreads.heatCapacityRel),
      uaMultiplier: draw(spreads.uaRel),
      rateMultiplier: 1,
    };
    let profile: TimeProfileResult;
    try {
      profile = simulateScenario(port, scenario, p, { rtol });
    } catch {
      failed++;
      continue;
    }
    const hint = { k: 0 };
    times.forEach((t, i) => {
      const v = interpolateCurve(profile.curve, t, hint);
      if (v !== null) columns[i]!.push(v);
    });
    if (options.meets?.(profile)) meets++;
  }
  const hint = { k: 0 };
  return {
    band: times.map((tMin, i) => {
      const sorted = columns[i]!.sort((a, b) => a - b);
      return { tMin, p5: percentile(sorted, 0.05), p50: percentile(sorted, 0.5), p95: percentile(sorted, 0.95) };
    }),
    nominal: times.map((tMin) => ({ tMin, tempC: interpolateCurve(nominalProfile.curve, tMin, hint) ?? nominalProfile.endTempC })),
    probabilityMeetsBrief: options.meets ? meets / Math.max(1, n - failed) : null,
    samples: n - failed,
    failedSamples: failed,
    spreads,
    seed,
  };
}

/**
 * Does a simulated profile meet the brief? The verification's own rules and tolerances
 * (evaluation/verify.ts, {@link briefMisses}): no miss.
 */
export function meetsBrief(brief: Brief, profile: TimeProfileResult): boolean {
  const l = profile.load;
  return briefMisses(brief, l ? { ...profile, timeToTargetMin: l.timeToTargetMin, minutesInBand: l.minutesInBand, load: l } : profile).length === 0;
}

/** The scenario of a candidate under its brief: the verification's horizon, band and exchange, and the run's calibrations. */
export function briefScenario(brief: Brief, components: ThermalComponent[], calibrations: ModelCalibrations | null = null): LabScenario {
  return {
    components,
    initialTempC: brief.initialTempC,
    ambientC: brief.ambientC,
    contact: brief.contact,
    packAreaM2: brief.packAreaM2,
    uaWPerK: brief.uaWPerK ?? null,
    calibrations,
    load: brief.load ?? null,
    packHeatCapacityJPerK: brief.packaging.heatCapacityJPerK,
    horizonMin: verificationHorizonMin(brief),
    targetTempC: brief.targetTempC,
    targetBand: holdBand(brief),
  };
}
