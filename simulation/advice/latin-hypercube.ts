/**
 * Latin hypercube sampling (McKay, Beckman & Conover 1979, Technometrics 21:239): each of
 * the d dimensions is cut into n equal-probability strata, and every stratum of every
 * dimension holds exactly one of the n samples; strata are paired across dimensions by
 * independent random permutations, and each point sits at a random place inside its stratum.
 */
import { randomPermutation, type Random } from './random';

/** n points in the unit hypercube [0, 1)^d, as n rows of d coordinates. */
export function latinHypercube(n: number, d: number, random: Random): number[][] {
  if (!Number.isInteger(n) || n < 1) throw new RangeError(`sample count must be a positive integer, got ${n}`);
  if (!Number.isInteger(d) || d < 0) throw new RangeError(`dimension must be a non-negative integer, got ${d}`);
  const rows = Array.from({ length: n }, () => new Array<number>(d));
  for (let j = 0; j < d; j++) {
    const strata = randomPermutation(n, random);
    for (let i = 0; i < n; i++) rows[i][j] = (strata[i] + random()) / n;
  }
  return rows;
}

/** How a unit coordinate maps onto a parameter's range. */
export type RangeScale = 'linear' | 'log';

/**
 * Maps u ∈ [0, 1) onto [min, max]: linearly, or log-uniformly (equal weight to each factor of
 * ten) for ranges spanning an order of magnitude or more — a K of 0.05–1.3 mg N/L is as
 * likely to be near 0.1 as near 1.
 */
export function scaleUnit(u: number, min: number, max: number, scale: RangeScale): number {
  if (scale === 'log') return min * Math.pow(max / min, u);
  return min + u * (max - min);
}

/** The scale the ensemble uses for a range: log when it spans ≥ 10× and is positive. */
export function rangeScale(min: number, max: number): RangeScale {
  return min > 0 && max / min >= 10 ? 'log' : 'linear';
}
