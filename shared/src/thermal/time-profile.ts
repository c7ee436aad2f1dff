import type { ComputationWarning } from '../chemistry/types';
import type { ChemistryPort } from './chemistry-port';
import { energyBreakdown, type EnergyBreakdown } from './energy';
import { ThermalModelError } from './errors';
import { PackModel, type ThermalComponent } from './pack-model';
import { hermiteAt, integrateDormandPrince, type OdeSolution } from './rk45';
import { END_STATE_MAX_TEMP_C, END_STATE_MIN_TEMP_C, noteBoiling, type DissolutionLimit } from './end-state';

export interface TargetBand {
  minC: number;
  maxC: number;
}

export interface TimeProfileInput {
  components: ThermalComponent[];
  initialTempC: number;
  /** Temperature of the surroundings the pack exchanges heat with, °C. */
  envTempC: number;
  /** Overall conductance to the surroundings, W/K (0: adiabatic). */
  uaWPerK: number;
  /** Heat capacity of pouch and anything else not listed as a component, J/K. */
  packHeatCapacityJPerK?: number;
  /** Pack surface area, m²: the O2 film area of air oxidation unless the process gives its own. */
  packAreaM2?: number;
  holdMin: number;
  /** Temperature whose first crossing gives `timeToTargetMin`. */
  targetTempC?: number;
  targetBand?: TargetBand;
  /** Spacing of the reported curve, min (default: holdMin/80, at least 0.05 min). */
  curveStepMin?: number;
  /** Relative tolerance of the integrator (default 1e-6). */
  rtol?: number;
  /** The thing the pack heats or cools, as a second lumped node; the target and band then apply to it. */
  load?: LumpedLoad;
}

/**
 * A load as a second lumped node (a meal, a limb through fabric, a box's contents):
 *   C_load·dT_load/dt = UA_pl·(T_pack − T_load) − UA_le·(T_load − T_env,load)
 * and the pack node gets −UA_pl·(T_pack − T_load).
 */
export interface LumpedLoad {
  heatCapacityJPerK: number;
  initialTempC: number;
  /** Conductance pack ↔ load, W/K. */
  uaToPackWPerK: number;
  /** Conductance load ↔ its surroundings, W/K. */
  uaToEnvWPerK: number;
  /** Temperature the load exchanges with, °C (default the pack's envTempC). */
  envTempC?: number;
}

/** The load's side of a profile. */
export interface LoadProgress {
  curve: CurvePoint[];
  endTempC: number;
  minTempC: number;
  maxTempC: number;
  timeToTargetMin: number | null;
  minutesInBand: number | null;
  /** Heat the pack gave the load over the profile, J (negative: took from it). */
  heatFromPackJ: number;
}

export interface CurvePoint {
  tMin: number;
  tempC: number;
}

export interface SoluteProgress {
  label: string;
  soluteKey: string;
  dissolvedFraction: number;
  limitedBy: DissolutionLimit;
}

export interface TimeProfileResult {
  curve: CurvePoint[];
  endTempC: number;
  minTempC: number;
  maxTempC: number;
  timeToTargetMin: number | null;
  minutesInBand: number | null;
  solutes: SoluteProgress[];
  iceG: number;
  /** Water boiled off as steam that left the pack, g (a scald hazard; hazard input). */
  steamLostG: number;
  /**
   * Energy audit between start and end: heat released by the processes = heat stored in the
   * pack + heat lost to the surroundings (lost integrated along the curve, the rest from the
   * pack's enthalpy function at both ends). `relativeBalanceError` measures how well the
   * integration honours the first law.
   */
  energy: EnergyBreakdown;
  warnings: ComputationWarning[];
  stats: { steps: number; rhsEvaluations: number; rejectedSteps: number };
  /** Extents at the end (internal layout of PackModel). */
  extents: number[];
  /** With a load: its temperatures (the target and band are judged on them). */
  load?: LoadProgress;
}

/**
 * Default parameters of the time profile and where they come from.
 */
export const TIME_PROFILE_DEFAULTS = {
  rtol: 1e-6,
  /** Absolute tolerance on temperature, K. */
  atolTempK: 1e-4,
  /** Longest step, s: keeps the curve resolved when nothing happens. */
  maxStepS: 60,
} as const;

/**
 * Lumped-capacitance time profile of a pack:
 *
 *   C(x)·dT/dt = −Σ_i (∂H/∂x_i)·dx_i/dt − UA·(T − T_env) [− UA_pl·(T − T_load)]
 *
 * where H(T, x) is the pack's enthalpy (PackModel), ∂H/∂x_i·dx_i/dt the heat absorbed by
 * process i (so −… is its heat release rate q̇_i, including the Kirchhoff term of the changing
 * heat capacity), C(x) = ∂H/∂T, and the extents follow their kinetics (PackModel.rates:
 * first-order dissolution towards the solubility-limited amount, reaction towards completion,
 * crystal growth driven by undercooling — a plateau at the melting point —, O2 uptake limited
 * by the film, ice towards the water–ice equilibrium). Integrated by Dormand–Prince 5(4)
 * ({@link integrateDormandPrince}); ∂H/∂x_i by central differences of H.
 *
 * With a load ({@link LumpedLoad}), a second node C_load·dT_load/dt = UA_pl·(T − T_load) −
 * UA_le·(T_load − T_env); the target and band are then also judged on T_load (`load`).
 *
 * Example: 40 g NH4NO3 + 100 g water from 25 °C, UA = 0 → T falls within a few minutes to the
 * end-state temperature (about 2.6 °C) and stays there.
 */
export function simulateTimeProfile(port: ChemistryPort, input: TimeProfileInput): TimeProfileResult {
  const model = new PackModel(port, input.components, {
    packHeatCapacityJPerK: input.packHeatCapacityJPerK ?? 0,
    ...(input.packAreaM2 !== undefined ? { packAreaM2: input.packAreaM2 } : {}),
  });
  return simulateModel(model, input);
}

function validate(input: Omit<TimeProfileInput, 'components'>): void {
  const finite = (v: number, field: string) => {
    if (!Number.isFinite(v)) throw new ThermalModelError(`expected a finite number for ${field}, found ${v}`, { field });
  };
  finite(input.initialTempC, 'initialTempC');
  finite(input.envTempC, 'envTempC');
  finite(input.uaWPerK, 'uaWPerK');
  finite(input.holdMin, 'holdMin');
  if (input.uaWPerK < 0) throw new ThermalModelError(`expected uaWPerK ≥ 0 W/K, found ${input.uaWPerK}`, { field: 'uaWPerK' });
  if (!(input.holdMin > 0) || input.holdMin > 7 * 24 * 60) {
    throw new ThermalModelError(`expected holdMin between 0 and 10080 min (one week), found ${input.holdMin}`, { field: 'holdMin' });
  }
  if (input.targetBand && !(input.targetBand.maxC >= input.targetBand.minC)) {
    throw new ThermalModelError(
      `expected targetBand.maxC ≥ targetBand.minC, found ${input.targetBand.minC} to ${input.targetBand.maxC} °C`,
      { field: 'targetBand' },
    );
  }
}

export function simulateModel(model: PackModel, input: Omit<TimeProfileInput, 'components' | 'packHeatCapacityJPerK' | 'packAreaM2'>): TimeProfileResult {
  validate(input);
  const n = model.size;
  const ua = input.uaWPerK;
  const tEnv = input.envTempC;
  const xdot = new Array<number>(n).fill(0);
  const xb = new Array<number>(n).fill(0);
  const scales = model.extentScales();

  // y = [T, x_0 … x_{n−1}, heat lost (J)]
  const rhs = (_t: number, y: readonly number[], dy: number[]) => {
    const T = y[0]!;
    const x = y.slice(1, n + 1);
    model.rates(T, x, xdot);
    const c = model.evaluate(x).cJPerK;
    let absorbed = 0;
    for (let i = 0; i < n; i++) {
      const r = xdot[i]!;
      if (r === 0) continue;
      absorbed += dHdx(model, T, x, i, scales[i]!, xb) * r;
    }
    const loss = ua * (T - tEnv);
    const toLoad = loadRhs(load, T, tEnv, y, n, dy);
    dy[0] = -(absorbed + loss + toLoad) / Math.max(c, 1e-9);
    for (let i = 0; i < n; i++) dy[i + 1] = xdot[i]!;
    dy[n + 1] = loss;
  };

  const load = input.load;
  const y0 = [input.initialTempC, ...model.initialExtents(), 0, ...(load ? [load.initialTempC, 0] : [])];
  const atol = [TIME_PROFILE_DEFAULTS.atolTempK, ...scales.map((s) => s * 1e-9), 1e-3, ...(load ? [TIME_PROFILE_DEFAULTS.atolTempK, 1e-3] : [])];
  const tEndS = input.holdMin * 60;
  const sol = integrateDormandPrince(rhs, 0, tEndS, y0, {
    rtol: input.rtol ?? TIME_PROFILE_DEFAULTS.rtol,
    atol,
    firstStep: 0.5,
    maxStep: TIME_PROFILE_DEFAULTS.maxStepS,
    maxSteps: 50000,
  });
  if (sol.status === 'max-steps') {
    model.warnings.add({
      code: 'thermal.integration-incomplete',
      message: `the time profile stopped at ${(sol.t.at(-1)! / 60).toFixed(1)} min of ${input.holdMin} min (step limit reached)`,
    });
  }
  // The curve must stay where the data hold (the end-state range): stop with a message, never draw beyond it.
  for (let k = 0; k < sol.y.length; k++) {
    const T = sol.y[k]![0]!;
    if (!(T >= END_STATE_MIN_TEMP_C && T <= END_STATE_MAX_TEMP_C)) {
      throw new ThermalModelError(
        `the pack's temperature leaves the range where the model's data hold (${END_STATE_MIN_TEMP_C} to ${END_STATE_MAX_TEMP_C} °C) after ${(sol.t[k]! / 60).toFixed(1)} min (${Number.isFinite(T) ? T.toFixed(0) : String(T)} °C)${
          T > END_STATE_MAX_TEMP_C ? ', with no liquid water left to boil: the mixture runs away (less reactive metal or more water, and a contact case that removes the heat)' : ''
        }`,
        { field: 'components' },
      );
    }
  }
  const last = sol.y.at(-1)!;
  const endT = last[0]!;
  const xEnd = last.slice(1, n + 1);
  const lostJ = last[n + 1]!;
  const toLoadJ = load ? last[n + 3]! : 0;
  const x0 = model.initialExtents();
  // Heat given to the load leaves the pack as surely as heat lost to the surroundings.
  const energy = energyBreakdown(model, { tempC: input.initialTempC, x: x0 }, { tempC: endT, x: xEnd }, lostJ + toLoadJ);

  const stats = analyseCurve(sol, input);
  const loadStats = load ? analyseCurve(sol, input, n + 2, load.initialTempC) : null;
  const ice = model.iceG(xEnd);
  const steam = model.steamLostG(xEnd);
  noteBoiling(model, steam, stats.maxC);
  const solutes: SoluteProgress[] = model.solutes.map((s, j) => {
    const fraction = model.dissolvedFraction(j, xEnd);
    const limitedBy: DissolutionLimit = fraction >= 1 - 1e-6 ? 'none' : ice > 1e-6 ? 'ice' : 'solubility';
    return { label: s.label, soluteKey: s.soluteKey, dissolvedFraction: fraction, limitedBy };
  });
  return {
    curve: stats.curve,
    endTempC: endT,
    minTempC: stats.minC,
    maxTempC: stats.maxC,
    timeToTargetMin: stats.timeToTargetMin,
    minutesInBand: stats.minutesInBand,
    solutes,
    iceG: ice,
    steamLostG: steam,
    energy,
    warnings: model.warnings.list(),
    stats: { steps: sol.t.length - 1, rhsEvaluations: sol.rhsEvaluations, rejectedSteps: sol.rejectedSteps },
    extents: xEnd,
    ...(loadStats
      ? {
          load: {
            curve: loadStats.curve,
            endTempC: last[n + 2]!,
            minTempC: loadStats.minC,
            maxTempC: loadStats.maxC,
            timeToTargetMin: loadStats.timeToTargetMin,
            minutesInBand: loadStats.minutesInBand,
            heatFromPackJ: toLoadJ,
          },
        }
      : {}),
  };
}

/**
 * The load node's terms of the right-hand side (y = [T, x…, lost, T_load, heat to load]):
 * writes dT_load/dt and the heat-to-load rate, returns q_pl = UA_pl·(T − T_load), W, for the
 * pack node. 0 without a load.
 */
function loadRhs(load: LumpedLoad | undefined, T: number, tEnv: number, y: readonly number[], n: number, dy: number[]): number {
  if (!load) return 0;
  const tLoad = y[n + 2]!;
  const q = load.uaToPackWPerK * (T - tLoad);
  const out = load.uaToEnvWPerK * (tLoad - (load.envTempC ?? tEnv));
  dy[n + 2] = (q - out) / Math.max(load.heatCapacityJPerK, 1e-9);
  dy[n + 3] = q;
  return q;
}

/** ∂H/∂x_i at (T, x), J per unit of x_i, by central difference (one-sided at x_i ≈ 0). */
function dHdx(model: PackModel, T: number, x: readonly number[], i: number, scale: number, buf: number[]): number {
  const d = 1e-6 * scale;
  for (let k = 0; k < x.length; k++) buf[k] = x[k]!;
  const xi = x[i]!;
  // Central where the extent is clear of 0 on either side (charged ice melting runs negative).
  if (xi - d >= 0 || xi + d <= 0) {
    buf[i] = xi + d;
    const hp = model.enthalpyJ(T, buf);
    buf[i] = xi - d;
    const hm = model.enthalpyJ(T, buf);
    return (hp - hm) / (2 * d);
  }
  buf[i] = Math.max(xi, 0);
  const h0 = model.enthalpyJ(T, buf);
  buf[i] = Math.max(xi, 0) + d;
  const h1 = model.enthalpyJ(T, buf);
  buf[i] = Math.max(xi, 0) + 2 * d;
  const h2 = model.enthalpyJ(T, buf);
  // Second-order forward difference.
  return (-3 * h0 + 4 * h1 - h2) / (2 * d);
}

const SUBSTEPS = 8;

function analyseCurve(
  sol: OdeSolution,
  input: Omit<TimeProfileInput, 'components'>,
  index = 0,
  t0 = input.initialTempC,
): { curve: CurvePoint[]; minC: number; maxC: number; timeToTargetMin: number | null; minutesInBand: number | null } {
  const tEnd = sol.t.at(-1)!;
  const stepMin = input.curveStepMin ?? Math.max(0.05, input.holdMin / 80);
  const curve: CurvePoint[] = [];
  let k = 0;
  const tempAt = (tS: number): number => {
    while (k < sol.t.length - 2 && sol.t[k + 1]! < tS) k++;
    if (sol.t.length === 1) return sol.y[0]![index]!;
    return hermiteAt(sol, k, index, Math.min(Math.max(tS, sol.t[k]!), sol.t[k + 1]!));
  };
  const nPoints = Math.min(5000, Math.floor((tEnd / 60) / stepMin + 1e-9) + 1);
  for (let p = 0; p < nPoints; p++) {
    const tS = p * stepMin * 60;
    curve.push({ tMin: tS / 60, tempC: tempAt(tS) });
  }
  if (curve.length === 0 || Math.abs(curve.at(-1)!.tMin - tEnd / 60) > 1e-9) curve.push({ tMin: tEnd / 60, tempC: sol.y.at(-1)![index]! });

  const target = input.targetTempC;
  const band = input.targetBand;
  let minC = t0;
  let maxC = t0;
  let timeToTarget: number | null = null;
  let inBandS = 0;
  const reached = (T: number) => (target === undefined ? false : target <= t0 ? T <= target : T >= target);
  if (target !== undefined && reached(t0)) timeToTarget = 0;
  let prevT = t0;
  let prevTime = 0;
  for (let s = 0; s + 1 < sol.t.length; s++) {
    const ta = sol.t[s]!;
    const tb = sol.t[s + 1]!;
    for (let q = 1; q <= SUBSTEPS; q++) {
      const time = ta + ((tb - ta) * q) / SUBSTEPS;
      const T = hermiteAt(sol, s, index, time);
      if (T < minC) minC = T;
      if (T > maxC) maxC = T;
      if (timeToTarget === null && target !== undefined && reached(T)) {
        const frac = prevT === T ? 1 : (target - prevT) / (T - prevT);
        timeToTarget = (prevTime + Math.min(1, Math.max(0, frac)) * (time - prevTime)) / 60;
      }
      if (band) inBandS += timeInBand(prevT, T, time - prevTime, band);
      prevT = T;
      prevTime = time;
    }
  }
  return { curve, minC, maxC, timeToTargetMin: timeToTarget, minutesInBand: band ? inBandS / 60 : null };
}

/** Time a linear segment from Ta to Tb over dt spends inside [minC, maxC]. */
function timeInBand(Ta: number, Tb: number, dt: number, band: TargetBand): number {
  if (Ta === Tb) return Ta >= band.minC && Ta <= band.maxC ? dt : 0;
  const lo = Math.min(Ta, Tb);
  const hi = Math.max(Ta, Tb);
  const overlap = Math.max(0, Math.min(hi, band.maxC) - Math.max(lo, band.minC));
  return (overlap / (hi - lo)) * dt;
}
