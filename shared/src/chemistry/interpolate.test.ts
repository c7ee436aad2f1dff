import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { linear, pchip } from './interpolate';

const increasingXs = fc
  .uniqueArray(fc.double({ min: -100, max: 100, noNaN: true }), { minLength: 2, maxLength: 12 })
  .map((xs) => [...xs].sort((a, b) => a - b))
  .filter((xs) => xs.every((x, k) => k === 0 || x - (xs[k - 1] as number) > 1e-6));

describe('pchip', () => {
  it('passes through every data point', () => {
    fc.assert(
      fc.property(increasingXs, fc.array(fc.double({ min: -1e3, max: 1e3, noNaN: true }), { minLength: 12, maxLength: 12 }), (xs, ysAll) => {
        const ys = ysAll.slice(0, xs.length);
        const f = pchip(xs, ys);
        xs.forEach((x, k) => expect(f(x)).toBeCloseTo(ys[k] as number, 6));
      }),
    );
  });

  it('is monotone where the data are monotone (no overshoot)', () => {
    fc.assert(
      fc.property(increasingXs, fc.array(fc.double({ min: 0, max: 10, noNaN: true }), { minLength: 12, maxLength: 12 }), (xs, steps) => {
        let acc = 0;
        const ys = xs.map((_, k) => (acc += steps[k] as number));
        const f = pchip(xs, ys);
        let prev = -Infinity;
        const x0 = xs[0] as number;
        const x1 = xs[xs.length - 1] as number;
        for (let i = 0; i <= 200; i++) {
          const y = f(x0 + ((x1 - x0) * i) / 200);
          expect(y).toBeGreaterThanOrEqual(prev - 1e-9);
          prev = y;
        }
      }),
    );
  });

  it('rejects unsorted abscissae', () => {
    expect(() => pchip([0, 2, 1], [0, 1, 2])).toThrow(/strictly increasing/);
  });
});

describe('linear', () => {
  it('interpolates between and extrapolates beyond the end segments', () => {
    expect(linear([0, 10, 20], [0, 5, 25], 4)).toBeCloseTo(2, 12);
    expect(linear([0, 10, 20], [0, 5, 25], 25)).toBeCloseTo(35, 12);
    expect(linear([0, 10, 20], [0, 5, 25], -10)).toBeCloseTo(-5, 12);
  });
});
