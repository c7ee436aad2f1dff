import { describe, expect, it } from 'vitest';
import { brentRoot } from './root';

describe('brentRoot', () => {
  it('finds √2 as the root of x² − 2 on [0, 2]', () => {
    expect(brentRoot((x) => x * x - 2, 0, 2).x).toBeCloseTo(Math.SQRT2, 10);
  });

  it('closes on a jump with a tiny bracket and opposite signs either side', () => {
    const r = brentRoot((x) => (x < 1 ? -1 : 1), 0, 3, { xTol: 1e-12 });
    expect(r.hi - r.lo).toBeLessThan(1e-9);
    expect(r.fLo * r.fHi).toBeLessThan(0);
    expect(r.lo).toBeLessThanOrEqual(1);
    expect(r.hi).toBeGreaterThanOrEqual(1 - 1e-9);
  });

  it('refuses a bracket without a sign change, saying what it found', () => {
    expect(() => brentRoot((x) => x * x + 1, -1, 1)).toThrow(/sign change/);
  });
});
