/**
 * Shape-preserving piecewise cubic Hermite interpolation (PCHIP), Fritsch & Carlson, SIAM J. Numer.
 * Anal. 17 (1980) 238, with the derivative rules of Fritsch & Butland (1984) as used by SciPy's
 * PchipInterpolator and MATLAB's pchip: interior slopes are weighted harmonic means of the adjacent
 * secant slopes (zero where they change sign), end slopes by the shape-preserving three-point
 * formula. The interpolant passes through every point, is monotone wherever the data are, and
 * does not overshoot at local extrema.
 *
 * `xs` must be strictly increasing and of the same length as `ys` (at least 2 points).
 * Inside [xs[0], xs[n−1]] the cubic is used; outside, the caller decides (see `inRange`).
 *
 * @example const f = pchip([0, 1, 2], [0, 1, 4]); f(1) // → 1
 */
export function pchip(xs: readonly number[], ys: readonly number[]): (x: number) => number {
  const n = xs.length;
  if (n !== ys.length || n < 2) {
    throw new RangeError(`pchip needs at least 2 points and equal lengths; found ${n} x and ${ys.length} y values.`);
  }
  const h: number[] = [];
  const delta: number[] = [];
  for (let k = 0; k < n - 1; k++) {
    const dx = (xs[k + 1] as number) - (xs[k] as number);
    if (!(dx > 0)) throw new RangeError(`pchip needs strictly increasing x; found ${xs[k]} then ${xs[k + 1]}.`);
    h.push(dx);
    delta.push(((ys[k + 1] as number) - (ys[k] as number)) / dx);
  }
  const d: number[] = new Array<number>(n).fill(0);
  if (n === 2) {
    d[0] = delta[0] as number;
    d[1] = delta[0] as number;
  } else {
    for (let k = 1; k < n - 1; k++) {
      const a = delta[k - 1] as number;
      const b = delta[k] as number;
      if (a === 0 || b === 0 || Math.sign(a) !== Math.sign(b)) d[k] = 0;
      else {
        const w1 = 2 * (h[k] as number) + (h[k - 1] as number);
        const w2 = (h[k] as number) + 2 * (h[k - 1] as number);
        d[k] = (w1 + w2) / (w1 / a + w2 / b);
      }
    }
    d[0] = endSlope(h[0] as number, h[1] as number, delta[0] as number, delta[1] as number);
    d[n - 1] = endSlope(h[n - 2] as number, h[n - 3] as number, delta[n - 2] as number, delta[n - 3] as number);
  }
  return (x: number): number => {
    let k: number;
    if (x <= (xs[0] as number)) k = 0;
    else if (x >= (xs[n - 1] as number)) k = n - 2;
    else {
      let lo = 0;
      let hi = n - 1;
      while (hi - lo > 1) {
        const mid = (lo + hi) >> 1;
        if ((xs[mid] as number) <= x) lo = mid;
        else hi = mid;
      }
      k = lo;
    }
    const hk = h[k] as number;
    const t = (x - (xs[k] as number)) / hk;
    const t2 = t * t;
    const t3 = t2 * t;
    const h00 = 2 * t3 - 3 * t2 + 1;
    const h10 = t3 - 2 * t2 + t;
    const h01 = -2 * t3 + 3 * t2;
    const h11 = t3 - t2;
    return h00 * (ys[k] as number) + h10 * hk * (d[k] as number) + h01 * (ys[k + 1] as number) + h11 * hk * (d[k + 1] as number);
  };
}

function endSlope(h0: number, h1: number, m0: number, m1: number): number {
  let d = ((2 * h0 + h1) * m0 - h0 * m1) / (h0 + h1);
  if (Math.sign(d) !== Math.sign(m0)) d = 0;
  else if (Math.sign(m0) !== Math.sign(m1) && Math.abs(d) > Math.abs(3 * m0)) d = 3 * m0;
  return d;
}

/**
 * Straight-line interpolation between the two points around x, and straight-line extrapolation
 * from the end segment outside the data. `xs` strictly increasing, at least 2 points.
 *
 * @example linear([0, 10], [0, 5], 4) // → 2
 */
export function linear(xs: readonly number[], ys: readonly number[], x: number): number {
  const n = xs.length;
  if (n !== ys.length || n < 2) throw new RangeError(`linear needs at least 2 points and equal lengths; found ${n} and ${ys.length}.`);
  let k = 0;
  while (k < n - 2 && x > (xs[k + 1] as number)) k++;
  const x0 = xs[k] as number;
  const x1 = xs[k + 1] as number;
  const y0 = ys[k] as number;
  const y1 = ys[k + 1] as number;
  return y0 + ((y1 - y0) * (x - x0)) / (x1 - x0);
}
