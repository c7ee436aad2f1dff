import type { CurvePoint, TargetBand } from '../thermal/time-profile';

export interface MeasuredPoint {
  tSec: number;
  tempC: number;
}

export interface OverlayPoint {
  tMin: number;
  measuredC: number;
  predictedC: number;
  /** measured − predicted, K. */
  residualK: number;
}

export interface OverlayResult {
  points: OverlayPoint[];
  /** Root-mean-square residual, K: √(Σ r²/n). */
  rmseK: number;
  /** Mean residual, K (positive: the pack ran warmer than predicted). */
  biasK: number;
  maxAbsResidualK: number;
  /** Samples compared (those within the predicted curve's time span). */
  compared: number;
  /** Minutes inside the band over the compared span, measured and predicted; null without a band. */
  minutesInBand: { measured: number; predicted: number } | null;
  spanMin: number;
}

/**
 * Linear interpolation of a curve (sorted by tMin) at `tMin`; null outside its span.
 *
 * @example interpolateCurve([{ tMin: 0, tempC: 20 }, { tMin: 2, tempC: 10 }], 1) // → 15
 */
export function interpolateCurve(curve: readonly CurvePoint[], tMin: number, hint?: { k: number }): number | null {
  const n = curve.length;
  if (n === 0 || tMin < curve[0]!.tMin - 1e-9 || tMin > curve[n - 1]!.tMin + 1e-9) return null;
  if (n === 1) return curve[0]!.tempC;
  let k = hint ? Math.min(hint.k, n - 2) : 0;
  if (curve[k]!.tMin > tMin) k = 0;
  if (!hint) {
    // binary search
    let lo = 0;
    let hi = n - 1;
    while (hi - lo > 1) {
      const mid = (lo + hi) >> 1;
      if (curve[mid]!.tMin <= tMin) lo = mid;
      else hi = mid;
    }
    k = Math.min(lo, n - 2);
  } else {
    while (k < n - 2 && curve[k + 1]!.tMin < tMin) k++;
    hint.k = k;
  }
  const a = curve[k]!;
  const b = curve[k + 1]!;
  if (b.tMin === a.tMin) return a.tempC;
  const f = Math.min(1, Math.max(0, (tMin - a.tMin) / (b.tMin - a.tMin)));
  return a.tempC + f * (b.tempC - a.tempC);
}

/** Time a piecewise-linear series spends inside [minC, maxC], min (exact for linear segments). */
export function minutesInBandOf(points: readonly { tMin: number; tempC: number }[], band: TargetBand): number {
  let total = 0;
  for (let i = 0; i + 1 < points.length; i++) {
    const a = points[i]!;
    const b = points[i + 1]!;
    const dt = b.tMin - a.tMin;
    if (dt <= 0) continue;
    if (a.tempC === b.tempC) {
      if (a.tempC >= band.minC && a.tempC <= band.maxC) total += dt;
      continue;
    }
    const lo = Math.min(a.tempC, b.tempC);
    const hi = Math.max(a.tempC, b.tempC);
    const overlap = Math.max(0, Math.min(hi, band.maxC) - Math.max(lo, band.minC));
    total += (overlap / (hi - lo)) * dt;
  }
  return total;
}

/**
 * Measured against predicted: the predicted curve interpolated linearly at each measured time,
 * residual r = measured − predicted, RMSE = √(Σ r²/n), bias = Σ r/n, and the minutes each
 * series spends inside the band over the same span (both as piecewise-linear series through
 * the measured times, so the comparison is like for like).
 *
 * @example overlayCurves([{ tSec: 0, tempC: 25 }, { tSec: 60, tempC: 19 }], [{ tMin: 0, tempC: 25 }, { tMin: 1, tempC: 20 }]).rmseK // ≈ 0.71
 */
export function overlayCurves(measured: readonly MeasuredPoint[], predicted: readonly CurvePoint[], band?: TargetBand | null): OverlayResult {
  const points: OverlayPoint[] = [];
  const hint = { k: 0 };
  for (const m of measured) {
    const tMin = m.tSec / 60;
    const p = interpolateCurve(predicted, tMin, hint);
    if (p === null) continue;
    points.push({ tMin, measuredC: m.tempC, predictedC: p, residualK: m.tempC - p });
  }
  const n = points.length;
  let ss = 0;
  let sum = 0;
  let maxAbs = 0;
  for (const p of points) {
    ss += p.residualK * p.residualK;
    sum += p.residualK;
    maxAbs = Math.max(maxAbs, Math.abs(p.residualK));
  }
  return {
    points,
    rmseK: n ? Math.sqrt(ss / n) : NaN,
    biasK: n ? sum / n : NaN,
    maxAbsResidualK: maxAbs,
    compared: n,
    minutesInBand: band
      ? {
          measured: minutesInBandOf(points.map((p) => ({ tMin: p.tMin, tempC: p.measuredC })), band),
          predicted: minutesInBandOf(points.map((p) => ({ tMin: p.tMin, tempC: p.predictedC })), band),
        }
      : null,
    spanMin: n ? points[n - 1]!.tMin - points[0]!.tMin : 0,
  };
}

/** Thins a series to at most `max` points by even striding (first and last kept), for transfer and plotting. */
export function thin<T>(points: readonly T[], max: number): T[] {
  if (points.length <= max) return [...points];
  const out: T[] = [];
  const step = (points.length - 1) / (max - 1);
  for (let i = 0; i < max; i++) out.push(points[Math.round(i * step)]!);
  return out;
}
