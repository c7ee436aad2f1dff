import { describe, expect, it } from 'vitest';
import { paretoFlags, rankCandidates, type RankItem } from './rank';

const item = (key: string, o: Partial<RankItem>): RankItem => ({
  key,
  objectiveValue: 1,
  unitCostValue: 1,
  massG: 100,
  holdMarginMin: 0,
  hazardScore: 0,
  verificationStatus: 'passed',
  activeCount: 1,
  setSize: 1,
  ingredientCount: 2,
  ...o,
});

describe('rankCandidates', () => {
  it('orders least cost ascending and most hold margin descending', () => {
    const xs = [item('b', { objectiveValue: 2 }), item('a', { objectiveValue: 1 }), item('c', { objectiveValue: 3 })];
    expect(rankCandidates(xs, 'least-cost').map((x) => x.key)).toEqual(['a', 'b', 'c']);
    expect(rankCandidates(xs, 'most-hold-margin').map((x) => x.key)).toEqual(['c', 'b', 'a']);
  });

  it('ranks a candidate that misses in simulation below every one that passes, whatever its objective', () => {
    const xs = [item('cheap-miss', { objectiveValue: 0.1, verificationStatus: 'missed' }), item('dear-pass', { objectiveValue: 5 }), item('unverified', { objectiveValue: 9, verificationStatus: 'not-verified' })];
    expect(rankCandidates(xs, 'least-cost').map((x) => x.key)).toEqual(['dear-pass', 'unverified', 'cheap-miss']);
  });

  it('breaks ties within 1e-9 towards the simpler mixture: fewer actives in use, then a smaller set, then fewer ingredients', () => {
    const xs = [
      item('three', { objectiveValue: 1 + 1e-12, activeCount: 3, setSize: 3 }),
      item('two-degenerate', { objectiveValue: 1, activeCount: 1, setSize: 2 }),
      item('one', { objectiveValue: 1 - 1e-12, activeCount: 1, setSize: 1, ingredientCount: 3 }),
      item('one-lean', { objectiveValue: 1, activeCount: 1, setSize: 1, ingredientCount: 2 }),
    ];
    expect(rankCandidates(xs, 'least-cost').map((x) => x.key)).toEqual(['one-lean', 'one', 'two-degenerate', 'three']);
  });
});

describe('paretoFlags', () => {
  it('keeps exactly the candidates no other beats on cost, mass, hold margin and hazard score together', () => {
    const xs = [
      item('cheap', { unitCostValue: 1, massG: 200, holdMarginMin: 5 }),
      item('light', { unitCostValue: 2, massG: 100, holdMarginMin: 5 }),
      item('long', { unitCostValue: 2, massG: 200, holdMarginMin: 30 }),
      item('dominated', { unitCostValue: 2, massG: 200, holdMarginMin: 5 }),
      item('hazardous-twin', { unitCostValue: 1, massG: 200, holdMarginMin: 5, hazardScore: 2 }),
    ];
    expect(paretoFlags(xs)).toEqual([true, true, true, false, false]);
  });

  it('treats an unknown hold margin as the worst and equal figures as no improvement', () => {
    const xs = [item('known', { holdMarginMin: 1 }), item('unknown', { holdMarginMin: null }), item('twin', { holdMarginMin: 1 })];
    expect(paretoFlags(xs)).toEqual([true, false, true]);
  });
});
