import { levenbergMarquardt } from 'ml-levenberg-marquardt';
import type { ChemistryPort } from '../thermal/chemistry-port';
import type { TimeProfileResult } from '../thermal/time-profile';
import { interpolateCurve, thin, type MeasuredPoint } from './overlay';
import { NOMINAL_PARAMETERS, nominalRateConstantPerMin, scenarioExchange, simulateScenario, type LabScenario, type ModelParameters } from './scenario';

export type FittedParameter = 'ua' | 'enthalpy' | 'rate';
export const FITTED_PARAMETERS: readonly FittedParameter[] = ['ua', 'enthalpy', 'rate'];

export const CALIBRATION_METHOD =
  'Levenberg–Marquardt least squares (ml-levenberg-marquardt 5.1.0; K. Levenberg 1944, D. W. Marquardt, J. SIAM 11 (1963) 431; Press et al., Numerical Recipes, 3rd ed., §15.5), standard errors from (JᵀJ)⁻¹·s² with s² = SSR/(n − p)';

export interface FittedValue {
  value: number;
  standardError: number;
}

export interface CalibrationFit {
  method: string;
  fitted: FittedParameter[];
  /** UA multiplier (measured ÷ modelled exchange) and the UA it gives, W/K. */
  uaMultiplier: FittedValue;
  uaWPerK: FittedValue;
  enthalpyFactor: FittedValue;
  rateMultiplier: FittedValue;
  /** Fitted rate constant of the mixture's processes, 1/min (null when none has one). */
  rateConstantPerMin: FittedValue | null;
  nominal: { uaWPerK: number; rateConstantPerMin: number | null };
  /** Fit quality. */
  rmseK: number;
  nominalRmseK: number;
  rSquared: number;
  ssrK2: number;
  points: number;
  degreesOfFreedom: number;
  iterations: number;
  /** Correlation of the fitted parameters, in `fitted` order (|ρ| near 1: not separately identifiable). */
  correlation: number[][];
  warnings: string[];
}

export interface CalibrateOptions {
  fit?: readonly FittedParameter[];
  /** Points fitted at most (the log is thinned evenly beyond this). */
  maxPoints?: number;
  maxIterations?: number;
  rtol?: number;
}

const BOUNDS: Record<FittedParameter, [number, number]> = { ua: [0.05, 20], enthalpy: [0.2, 3], rate: [0.02, 50] };

function toParameters(fit: readonly FittedParameter[], v: readonly number[]): ModelParameters {
  const p = { ...NOMINAL_PARAMETERS };
  fit.forEach((name, i) => {
    const x = v[i]!;
    if (name === 'ua') p.uaMultiplier = x;
    else if (name === 'enthalpy') p.enthalpyFactor = x;
    else p.rateMultiplier = x;
  });
  return p;
}

/**
 * Fits the model's UA multiplier, effective enthalpy factor and rate multiplier (any subset) to
 * a recorded curve: minimise Σ (T_measured(t_i) − T_model(t_i; p))² by Levenberg–Marquardt
 * (ml-levenberg-marquardt, central-difference Jacobian), every parameter a multiplier on its
 * nominal value starting at 1 and kept inside broad physical bounds. The model is the
 * lumped-capacitance time profile of the scenario ({@link simulateScenario}), one simulation
 * per parameter vector, interpolated at the measured times.
 *
 * At the optimum the Jacobian J (n × p) is taken again by central differences and the
 * covariance is C = (JᵀJ)⁻¹·s², s² = SSR/(n − p) (Press et al., Numerical Recipes §15.5–15.6);
 * standard errors are √C_ii. Also R² = 1 − SSR/SST and RMSE = √(SSR/n).
 *
 * @example calibrateToLog(port, scenario, samples).uaMultiplier.value // ≈ 1.3 when the pack lost heat 30 % faster than modelled
 */
export function calibrateToLog(port: ChemistryPort, scenario: LabScenario, measured: readonly MeasuredPoint[], options: CalibrateOptions = {}): CalibrationFit {
  const fit = [...(options.fit ?? FITTED_PARAMETERS)];
  if (fit.length === 0) throw new Error('expected at least one parameter to fit (ua, enthalpy, rate), found none');
  const horizonMin = measured.at(-1)!.tSec / 60;
  const data = thin(measured.filter((m) => m.tSec / 60 <= horizonMin + 1e-9), options.maxPoints ?? 400);
  if (data.length < fit.length + 2) throw new Error(`expected at least ${fit.length + 2} samples to fit ${fit.length} parameters, found ${data.length}`);
  const xs = data.map((d) => d.tSec / 60);
  const ys = data.map((d) => d.tempC);
  const s: LabScenario = { ...scenario, horizonMin: Math.max(horizonMin, 0.1) };
  const rtol = options.rtol ?? 1e-6;
  const warnings: string[] = [];

  const cache = new Map<string, TimeProfileResult>();
  const simulate = (v: readonly number[]): TimeProfileResult => {
    const key = v.map((x) => x.toPrecision(12)).join(',');
    let r = cache.get(key);
    if (!r) {
      r = simulateScenario(port, s, toParameters(fit, v), { rtol, curveStepMin: Math.max(0.02, s.horizonMin / 600) });
      if (cache.size > 200) cache.clear();
      cache.set(key, r);
    }
    return r;
  };
  const predictAt = (v: readonly number[]): number[] => {
    const curve = simulate(v).curve;
    const hint = { k: 0 };
    return xs.map((x) => interpolateCurve(curve, x, hint) ?? curve.at(-1)!.tempC);
  };

  const result = levenbergMarquardt(
    { x: xs.map((_, i) => i), y: ys },
    (v) => {
      const pred = predictAt(v);
      return (i: number) => pred[i]!;
    },
    {
      initialValues: fit.map(() => 1),
      minValues: fit.map((f) => BOUNDS[f][0]),
      maxValues: fit.map((f) => BOUNDS[f][1]),
      gradientDifference: 1e-3,
      centralDifference: true,
      damping: 1e-2,
      maxIterations: options.maxIterations ?? 60,
      errorTolerance: 1e-8,
    },
  );
  const best = result.parameterValues;
  const pred = predictAt(best);
  const residuals = ys.map((y, i) => y - pred[i]!);
  const n = ys.length;
  const p = fit.length;
  const ssr = residuals.reduce((a, r) => a + r * r, 0);
  const mean = ys.reduce((a, y) => a + y, 0) / n;
  const sst = ys.reduce((a, y) => a + (y - mean) ** 2, 0);
  const nominalPred = predictAt(fit.map(() => 1));
  const nominalSsr = ys.reduce((a, y, i) => a + (y - nominalPred[i]!) ** 2, 0);

  // Jacobian at the optimum, central differences with a relative step.
  const J: number[][] = ys.map(() => new Array<number>(p).fill(0));
  for (let j = 0; j < p; j++) {
    const h = 1e-3 * Math.max(Math.abs(best[j]!), 1e-3);
    const up = [...best];
    const dn = [...best];
    up[j] = best[j]! + h;
    dn[j] = best[j]! - h;
    const a = predictAt(up);
    const b = predictAt(dn);
    for (let i = 0; i < n; i++) J[i]![j] = (a[i]! - b[i]!) / (2 * h);
  }
  const JtJ: number[][] = Array.from({ length: p }, (_, r) => Array.from({ length: p }, (_, c) => J.reduce((acc, row) => acc + row[r]! * row[c]!, 0)));
  const dof = Math.max(1, n - p);
  const s2 = ssr / dof;
  const inv = invert(JtJ);
  const se = new Array<number>(p).fill(Number.POSITIVE_INFINITY);
  const correlation: number[][] = Array.from({ length: p }, () => new Array<number>(p).fill(NaN));
  if (inv) {
    for (let j = 0; j < p; j++) se[j] = Math.sqrt(Math.max(0, inv[j]![j]! * s2));
    for (let r = 0; r < p; r++) for (let c = 0; c < p; c++) correlation[r]![c] = inv[r]![c]! / Math.sqrt(inv[r]![r]! * inv[c]![c]!);
  } else warnings.push('the parameters cannot be told apart from this curve (JᵀJ is singular): fit fewer of them');
  for (let r = 0; r < p; r++) {
    for (let c = r + 1; c < p; c++) {
      if (Math.abs(correlation[r]![c]!) > 0.95) warnings.push(`${fit[r]} and ${fit[c]} are strongly correlated (ρ = ${correlation[r]![c]!.toFixed(2)}): the curve fixes their combination better than each`);
    }
  }
  fit.forEach((f, j) => {
    const [lo, hi] = BOUNDS[f];
    if (best[j]! <= lo * 1.0001 || best[j]! >= hi * 0.9999) warnings.push(`${f} stopped at its bound (${best[j]!.toPrecision(3)}): the model may not describe this test`);
  });

  const val = (name: FittedParameter): FittedValue => {
    const j = fit.indexOf(name);
    return j < 0 ? { value: 1, standardError: 0 } : { value: best[j]!, standardError: se[j]! };
  };
  const ua0 = scenarioExchange(s).uaWPerK;
  const k0 = nominalRateConstantPerMin(s);
  const ua = val('ua');
  const rate = val('rate');
  return {
    method: CALIBRATION_METHOD,
    fitted: fit,
    uaMultiplier: ua,
    uaWPerK: { value: ua.value * ua0, standardError: ua.standardError * ua0 },
    enthalpyFactor: val('enthalpy'),
    rateMultiplier: rate,
    rateConstantPerMin: k0 === null ? null : { value: rate.value * k0, standardError: rate.standardError * k0 },
    nominal: { uaWPerK: ua0, rateConstantPerMin: k0 },
    rmseK: Math.sqrt(ssr / n),
    nominalRmseK: Math.sqrt(nominalSsr / n),
    rSquared: sst > 0 ? 1 - ssr / sst : 0,
    ssrK2: ssr,
    points: n,
    degreesOfFreedom: dof,
    iterations: result.iterations,
    correlation,
    warnings,
  };
}

/** Inverse of a small symmetric matrix by Gauss–Jordan elimination with partial pivoting; null when singular. */
export function invert(a: readonly (readonly number[])[]): number[][] | null {
  const n = a.length;
  const m = a.map((row, i) => [...row, ...Array.from({ length: n }, (_, j) => (i === j ? 1 : 0))]);
  const scale = Math.max(...a.map((row) => Math.max(...row.map(Math.abs))), 1e-300);
  for (let c = 0; c < n; c++) {
    let piv = c;
    for (let r = c + 1; r < n; r++) if (Math.abs(m[r]![c]!) > Math.abs(m[piv]![c]!)) piv = r;
    if (Math.abs(m[piv]![c]!) < 1e-12 * scale) return null;
    [m[c], m[piv]] = [m[piv]!, m[c]!];
    const d = m[c]![c]!;
    for (let k = 0; k < 2 * n; k++) m[c]![k]! /= d;
    for (let r = 0; r < n; r++) {
      if (r === c) continue;
      const f = m[r]![c]!;
      if (f === 0) continue;
      for (let k = 0; k < 2 * n; k++) m[r]![k]! -= f * m[c]![k]!;
    }
  }
  return m.map((row) => row.slice(n));
}
