import { describe, expect, it } from 'vitest';
import { quantileSorted, seriesQuantiles } from '../../../simulation/advice/quantiles';

describe('quantileSorted (Hyndman & Fan 1996, definition 7)', () => {
  it('interpolates between order statistics like R quantile(type = 7)', () => {
    // R: quantile(c(1, 2, 3, 4), c(0.1, 0.5, 0.9)) gives 1.3, 2.5, 3.7 (definition 7 by hand: h = (n − 1)q).
    expect(quantileSorted([1, 2, 3, 4], 0.1)).toBeCloseTo(1.3, 12);
    expect(quantileSorted([1, 2, 3, 4], 0.5)).toBeCloseTo(2.5, 12);
    expect(quantileSorted([1, 2, 3, 4], 0.9)).toBeCloseTo(3.7, 12);
  });

  it('returns the extremes at 0 and 1', () => {
    expect(quantileSorted([2, 5, 9], 0)).toBe(2);
    expect(quantileSorted([2, 5, 9], 1)).toBe(9);
  });

  it('rejects an empty sample and a quantile outside [0, 1]', () => {
    expect(() => quantileSorted([], 0.5)).toThrow(RangeError);
    expect(() => quantileSorted([1], 1.5)).toThrow(RangeError);
  });
});

describe('seriesQuantiles', () => {
  it('takes quantiles across members at each time point', () => {
    const members = [
      [0, 10],
      [1, 30],
      [2, 20],
    ];
    const [p50, p100] = seriesQuantiles(members, [0.5, 1]);
    expect(p50).toEqual([1, 20]);
    expect(p100).toEqual([2, 30]);
  });

  it('rejects members of unequal length', () => {
    expect(() => seriesQuantiles([[1, 2], [1]], [0.5])).toThrow(RangeError);
  });
});
