/**
 * Root finding on a bracket [a, b] with f(a)·f(b) ≤ 0, by Brent's method (inverse quadratic
 * interpolation / secant with bisection safeguard; Brent, Algorithms for Minimization without
 * Derivatives, 1973, ch. 4). Returns the final bracket as well as the best estimate, so a
 * caller can tell a root from a jump (a discontinuity also ends with a tiny bracket, but with
 * large |f| on both sides).
 *
 * Never returns NaN for finite f: if f yields a non-finite value the method falls back to
 * bisection on the last good bracket.
 *
 * @example brentRoot((x) => x * x - 2, 0, 2).x // ≈ 1.41421356
 */
export interface RootResult {
  x: number;
  fx: number;
  /** Final bracket, lo/hi with f(lo) and f(hi) of opposite sign (or one of them 0). */
  lo: number;
  hi: number;
  fLo: number;
  fHi: number;
  iterations: number;
}

export function brentRoot(
  f: (x: number) => number,
  a: number,
  b: number,
  options: { xTol?: number; fa?: number; fb?: number; maxIter?: number } = {},
): RootResult {
  const xTol = options.xTol ?? 1e-10;
  const maxIter = options.maxIter ?? 200;
  let fa = options.fa ?? f(a);
  let fb = options.fb ?? f(b);
  if (!(Number.isFinite(fa) && Number.isFinite(fb))) {
    throw new RangeError(`brentRoot: expected finite f at the bracket ends, found f(${a}) = ${fa}, f(${b}) = ${fb}`);
  }
  if (fa * fb > 0) {
    throw new RangeError(`brentRoot: expected a bracket with a sign change, found f(${a}) = ${fa} and f(${b}) = ${fb}`);
  }
  if (fa === 0) return { x: a, fx: 0, lo: a, hi: a, fLo: 0, fHi: 0, iterations: 0 };
  if (fb === 0) return { x: b, fx: 0, lo: b, hi: b, fLo: 0, fHi: 0, iterations: 0 };

  let c = a;
  let fc = fa;
  let d = b - a;
  let e = d;
  let iter = 0;
  for (; iter < maxIter; iter++) {
    if (fb * fc > 0) {
      c = a;
      fc = fa;
      d = b - a;
      e = d;
    }
    if (Math.abs(fc) < Math.abs(fb)) {
      a = b;
      b = c;
      c = a;
      fa = fb;
      fb = fc;
      fc = fa;
    }
    const tol = 2 * Number.EPSILON * Math.abs(b) + 0.5 * xTol;
    const m = 0.5 * (c - b);
    if (Math.abs(m) <= tol || fb === 0) break;
    if (Math.abs(e) >= tol && Math.abs(fa) > Math.abs(fb)) {
      const s = fb / fa;
      let p: number;
      let q: number;
      if (a === c) {
        p = 2 * m * s;
        q = 1 - s;
      } else {
        const qq = fa / fc;
        const r = fb / fc;
        p = s * (2 * m * qq * (qq - r) - (b - a) * (r - 1));
        q = (qq - 1) * (r - 1) * (s - 1);
      }
      if (p > 0) q = -q;
      else p = -p;
      if (2 * p < Math.min(3 * m * q - Math.abs(tol * q), Math.abs(e * q))) {
        e = d;
        d = p / q;
      } else {
        d = m;
        e = m;
      }
    } else {
      d = m;
      e = m;
    }
    a = b;
    fa = fb;
    b += Math.abs(d) > tol ? d : m > 0 ? tol : -tol;
    fb = f(b);
    if (!Number.isFinite(fb)) {
      // Fall back to bisection between the last good point and c.
      b = 0.5 * (a + c);
      fb = f(b);
      if (!Number.isFinite(fb)) {
        throw new RangeError(`brentRoot: f is not finite inside the bracket (at ${b})`);
      }
    }
  }
  const lo = Math.min(b, c);
  const hi = Math.max(b, c);
  const fLo = lo === b ? fb : fc;
  const fHi = hi === b ? fb : fc;
  return { x: b, fx: fb, lo, hi, fLo, fHi, iterations: iter };
}
