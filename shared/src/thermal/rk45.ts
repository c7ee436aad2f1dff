/**
 * Adaptive Runge–Kutta integration, Dormand–Prince 5(4) with first-same-as-last (Dormand &
 * Prince, J. Comput. Appl. Math. 6 (1980) 19; step control as in Hairer, Nørsett & Wanner,
 * Solving ODEs I, §II.4), with a per-component error norm
 *   err = sqrt(mean((e_i / (atol_i + rtol·max(|y_i|, |y_new,i|)))²)).
 *
 * Why not mathjs `solveODE`: it implements the same tableau, but its error test uses the
 * largest absolute error over all components (no relative or per-component tolerance, and our
 * states mix kelvin, moles and joules), and its generic typed arithmetic costs about 0.2 ms per
 * step here (measured: 41 steps of a 6-state system in 7.8 ms), two orders of magnitude above
 * this loop. A unit test checks this integrator against `solveODE` on the same problem.
 *
 * @example integrateDormandPrince((t, y, dy) => { dy[0] = -y[0]!; }, 0, 1, [1]).y.at(-1) // ≈ [0.3679]
 */
export type OdeRhs = (t: number, y: readonly number[], dydt: number[]) => void;

export interface OdeOptions {
  rtol?: number;
  /** Absolute tolerance, one value or one per component. */
  atol?: number | readonly number[];
  firstStep?: number;
  maxStep?: number;
  maxSteps?: number;
}

export interface OdeSolution {
  /** Accepted step times, starting at t0. */
  t: number[];
  y: number[][];
  /** dy/dt at each accepted time (for Hermite dense output). */
  dydt: number[][];
  status: 'done' | 'max-steps';
  rhsEvaluations: number;
  rejectedSteps: number;
}

const C2 = 1 / 5, C3 = 3 / 10, C4 = 4 / 5, C5 = 8 / 9;
const A21 = 1 / 5;
const A31 = 3 / 40, A32 = 9 / 40;
const A41 = 44 / 45, A42 = -56 / 15, A43 = 32 / 9;
const A51 = 19372 / 6561, A52 = -25360 / 2187, A53 = 64448 / 6561, A54 = -212 / 729;
const A61 = 9017 / 3168, A62 = -355 / 33, A63 = 46732 / 5247, A64 = 49 / 176, A65 = -5103 / 18656;
const B1 = 35 / 384, B3 = 500 / 1113, B4 = 125 / 192, B5 = -2187 / 6784, B6 = 11 / 84;
// Error coefficients b − b̂.
const E1 = 71 / 57600, E3 = -71 / 16695, E4 = 71 / 1920, E5 = -17253 / 339200, E6 = 22 / 525, E7 = -1 / 40;

export function integrateDormandPrince(f: OdeRhs, t0: number, tEnd: number, y0: readonly number[], options: OdeOptions = {}): OdeSolution {
  const n = y0.length;
  const rtol = options.rtol ?? 1e-6;
  const atolOpt = options.atol ?? 1e-9;
  const atol = typeof atolOpt === 'number' ? new Array<number>(n).fill(atolOpt) : [...atolOpt];
  if (atol.length !== n) throw new RangeError(`expected ${n} absolute tolerances, found ${atol.length}`);
  if (!(tEnd > t0)) throw new RangeError(`expected tEnd > t0, found t0 = ${t0}, tEnd = ${tEnd}`);
  const maxStep = options.maxStep ?? tEnd - t0;
  const maxSteps = options.maxSteps ?? 20000;
  let h = Math.min(options.firstStep ?? (tEnd - t0) / 100, maxStep);

  const k1 = new Array<number>(n), k2 = new Array<number>(n), k3 = new Array<number>(n), k4 = new Array<number>(n);
  const k5 = new Array<number>(n), k6 = new Array<number>(n), k7 = new Array<number>(n);
  const yt = new Array<number>(n);
  const yNew = new Array<number>(n);
  let y = [...y0];
  let t = t0;
  f(t, y, k1);
  let evals = 1;
  let rejected = 0;
  const sol: OdeSolution = { t: [t], y: [[...y]], dydt: [[...k1]], status: 'done', rhsEvaluations: 0, rejectedSteps: 0 };
  let steps = 0;
  while (t < tEnd) {
    if (steps >= maxSteps) {
      sol.status = 'max-steps';
      break;
    }
    if (t + h > tEnd || tEnd - (t + h) < 1e-12 * (tEnd - t0)) h = tEnd - t;
    for (let i = 0; i < n; i++) yt[i] = y[i]! + h * A21 * k1[i]!;
    f(t + C2 * h, yt, k2);
    for (let i = 0; i < n; i++) yt[i] = y[i]! + h * (A31 * k1[i]! + A32 * k2[i]!);
    f(t + C3 * h, yt, k3);
    for (let i = 0; i < n; i++) yt[i] = y[i]! + h * (A41 * k1[i]! + A42 * k2[i]! + A43 * k3[i]!);
    f(t + C4 * h, yt, k4);
    for (let i = 0; i < n; i++) yt[i] = y[i]! + h * (A51 * k1[i]! + A52 * k2[i]! + A53 * k3[i]! + A54 * k4[i]!);
    f(t + C5 * h, yt, k5);
    for (let i = 0; i < n; i++) yt[i] = y[i]! + h * (A61 * k1[i]! + A62 * k2[i]! + A63 * k3[i]! + A64 * k4[i]! + A65 * k5[i]!);
    f(t + h, yt, k6);
    for (let i = 0; i < n; i++) yNew[i] = y[i]! + h * (B1 * k1[i]! + B3 * k3[i]! + B4 * k4[i]! + B5 * k5[i]! + B6 * k6[i]!);
    f(t + h, yNew, k7);
    evals += 6;
    let errSq = 0;
    let finite = true;
    for (let i = 0; i < n; i++) {
      const e = h * (E1 * k1[i]! + E3 * k3[i]! + E4 * k4[i]! + E5 * k5[i]! + E6 * k6[i]! + E7 * k7[i]!);
      const sc = atol[i]! + rtol * Math.max(Math.abs(y[i]!), Math.abs(yNew[i]!));
      const r = e / sc;
      errSq += r * r;
      if (!Number.isFinite(yNew[i]!)) finite = false;
    }
    const err = finite ? Math.sqrt(errSq / n) : Infinity;
    if (err <= 1) {
      t += h;
      y = [...yNew];
      for (let i = 0; i < n; i++) k1[i] = k7[i]!;
      sol.t.push(t);
      sol.y.push(y);
      sol.dydt.push([...k7]);
      steps++;
      const factor = err === 0 ? 5 : Math.min(5, Math.max(0.2, 0.9 * err ** -0.2));
      h = Math.min(maxStep, h * factor);
    } else {
      rejected++;
      h *= Number.isFinite(err) ? Math.max(0.1, 0.9 * err ** -0.25) : 0.1;
      if (h < 1e-12 * (tEnd - t0)) {
        throw new RangeError(`integrateDormandPrince: step size underflow at t = ${t} (the equations are not finite or too stiff here)`);
      }
    }
  }
  sol.rhsEvaluations = evals;
  sol.rejectedSteps = rejected;
  return sol;
}

/**
 * Cubic Hermite interpolation of component `i` inside accepted step `k` (between t[k] and
 * t[k+1]), from the values and derivatives at both ends: third order, continuous.
 */
export function hermiteAt(sol: OdeSolution, k: number, i: number, t: number): number {
  const t0 = sol.t[k]!;
  const t1 = sol.t[k + 1]!;
  const h = t1 - t0;
  const s = (t - t0) / h;
  const y0 = sol.y[k]![i]!;
  const y1 = sol.y[k + 1]![i]!;
  const d0 = sol.dydt[k]![i]! * h;
  const d1 = sol.dydt[k + 1]![i]! * h;
  const s2 = s * s;
  const s3 = s2 * s;
  return (2 * s3 - 3 * s2 + 1) * y0 + (s3 - 2 * s2 + s) * d0 + (-2 * s3 + 3 * s2) * y1 + (s3 - s2) * d1;
}
