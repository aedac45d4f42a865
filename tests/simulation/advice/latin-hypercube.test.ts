import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { latinHypercube, rangeScale, scaleUnit } from '../../../simulation/advice/latin-hypercube';
import { seededRandom } from '../../../simulation/advice/random';

describe('latinHypercube', () => {
  it('puts exactly one sample in each of the n strata of every dimension (McKay et al. 1979)', () => {
    fc.assert(
      fc.property(fc.integer({ min: 1, max: 80 }), fc.integer({ min: 1, max: 12 }), fc.integer(), (n, d, seed) => {
        const rows = latinHypercube(n, d, seededRandom(seed));
        expect(rows).toHaveLength(n);
        for (let j = 0; j < d; j++) {
          const strata = rows.map((r) => Math.floor(r[j] * n)).sort((a, b) => a - b);
          expect(strata).toEqual(Array.from({ length: n }, (_, i) => i));
        }
      }),
      { numRuns: 60 },
    );
  });

  it('is the same for the same seed', () => {
    expect(latinHypercube(16, 5, seededRandom(9))).toEqual(latinHypercube(16, 5, seededRandom(9)));
  });

  it('rejects a sample count below one', () => {
    expect(() => latinHypercube(0, 3, seededRandom(1))).toThrow(RangeError);
  });
});

describe('scaleUnit and rangeScale', () => {
  it('maps the middle of a log range to the geometric mean', () => {
    expect(scaleUnit(0.5, 0.01, 1, 'log')).toBeCloseTo(0.1, 12);
  });

  it('maps linearly when asked', () => {
    expect(scaleUnit(0.25, 2, 6, 'linear')).toBe(3);
  });

  it('uses a log scale only for positive ranges spanning ten times or more', () => {
    expect(rangeScale(1e-5, 1e-3)).toBe('log');
    expect(rangeScale(0.2, 1.0)).toBe('linear');
    expect(rangeScale(0, 0.3)).toBe('linear');
  });
});
