import { expect } from 'vitest';

/** |actual − expected| ≤ rel·|expected| (+ abs). */
export function expectClose(actual: number, expected: number, rel: number, abs = 0): void {
  const tol = rel * Math.abs(expected) + abs;
  if (!(Math.abs(actual - expected) <= tol)) {
    expect.fail(`expected ${actual} to be within ${tol.toExponential(2)} of ${expected}`);
  }
}

/** Rounds to n significant digits, as published tables print. */
export function sig(x: number, n: number): number {
  return Number(x.toPrecision(n));
}
