import * as math from 'mathjs';
import { describe, expect, it } from 'vitest';
import { hermiteAt, integrateDormandPrince } from './rk45';

describe('integrateDormandPrince', () => {
  it('integrates dy/dt = −y to e^(−t) within its tolerance', () => {
    const sol = integrateDormandPrince((_t, y, dy) => { dy[0] = -y[0]!; }, 0, 5, [1], { rtol: 1e-9, atol: 1e-12 });
    expect(sol.y.at(-1)![0]!).toBeCloseTo(Math.exp(-5), 9);
    expect(sol.t.at(-1)).toBe(5);
  });

  it('agrees with mathjs solveODE (same Dormand–Prince tableau) on a coupled linear system', () => {
    // Reference library: mathjs 15 solveODE, RK45 with a tight tolerance.
    const f = (_t: number, y: readonly number[]) => [-(y[0]! - 20) * 0.01 + 0.5 * (y[1]! - 0.5) * 0.02, 0.02 * (0.5 - y[1]!)];
    // mathjs 15 ships solveODE without a type declaration; narrow it here.
    const solveODE = (math as unknown as { solveODE: (f: (t: number, y: number[]) => number[], span: number[], y0: number[], o: object) => { y: number[][] } }).solveODE;
    const ref = solveODE((t, y) => f(t, y), [0, 300], [25, 0], { tol: 1e-10, maxIter: 1e6 });
    const mine = integrateDormandPrince((t, y, dy) => { const d = f(t, y); dy[0] = d[0]!; dy[1] = d[1]!; }, 0, 300, [25, 0], { rtol: 1e-10, atol: 1e-12 });
    const refEnd = ref.y.at(-1)!;
    expect(mine.y.at(-1)![0]!).toBeCloseTo(refEnd[0]!, 6);
    expect(mine.y.at(-1)![1]!).toBeCloseTo(refEnd[1]!, 6);
  });

  it('Hermite dense output matches the exact solution between steps', () => {
    const sol = integrateDormandPrince((_t, y, dy) => { dy[0] = -y[0]!; }, 0, 3, [1], { rtol: 1e-8, atol: 1e-12 });
    const k = Math.floor(sol.t.length / 2);
    const tm = 0.5 * (sol.t[k]! + sol.t[k + 1]!);
    expect(hermiteAt(sol, k, 0, tm)).toBeCloseTo(Math.exp(-tm), 5);
  });

  it('reports max-steps instead of running forever', () => {
    const sol = integrateDormandPrince((_t, y, dy) => { dy[0] = -1000 * y[0]!; }, 0, 100, [1], { maxSteps: 10 });
    expect(sol.status).toBe('max-steps');
  });
});
