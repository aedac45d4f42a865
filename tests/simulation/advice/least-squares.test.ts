import { describe, expect, it } from 'vitest';
import { inv } from 'mathjs';
import { invertSpd, leastSquares } from '../../../simulation/advice/least-squares';

// y = a·e^(b·t) sampled exactly at t = 0…9 with a = 2, b = −0.3: a zero-residual optimum.
const ts = Array.from({ length: 10 }, (_, i) => i);
const data = ts.map((t) => 2 * Math.exp(-0.3 * t));
const residuals = (x: readonly number[]) => ts.map((t, i) => x[0] * Math.exp(x[1] * t) - data[i]);
const wide = { lower: [-10, -5], upper: [10, 5] };

describe('leastSquares (box-bounded Levenberg–Marquardt, Madsen–Nielsen–Tingleff 2004 Alg. 3.16)', () => {
  it('finds an exponential decay from a poor start and stops by itself, well inside its iteration budget', () => {
    const r = leastSquares(residuals, [1, 0], { ...wide, difference: 1e-7 });
    expect(r.x[0]).toBeCloseTo(2, 4);
    expect(r.x[1]).toBeCloseTo(-0.3, 4);
    expect(r.stop).not.toBe('iterations');
    expect(r.iterations).toBeLessThan(30);
    // Each accepted step costs 1 + n residual vectors, a rejected one 1: counted as such.
    expect(r.evaluations).toBeLessThanOrEqual(1 + 2 + r.iterations * 3);
  });

  it('moves only to points that lower the sum of squares (a worse trial point is rejected, not taken)', () => {
    const h = 1e-6;
    const calls: { x: number[]; ssr: number }[] = [];
    const recorded = (x: readonly number[]) => {
      const r = residuals(x);
      calls.push({ x: [...x], ssr: r.reduce((s, v) => s + v * v, 0) });
      return r;
    };
    const r = leastSquares(recorded, [5, 1], { ...wide, difference: h });
    // A point the optimiser moved to is followed by its Jacobian column: the same point + h on the first unknown.
    const moved = calls.filter((c, i) => {
      const next = calls[i + 1];
      return next !== undefined && Math.abs(Math.abs(next.x[0] - c.x[0]) - h) < 1e-12 && next.x[1] === c.x[1];
    });
    expect(moved.length).toBeGreaterThan(3);
    for (let i = 1; i < moved.length; i++) expect(moved[i].ssr).toBeLessThan(moved[i - 1].ssr);
    // Some trial points were worse and left behind (the start is far off).
    expect(calls.some((c) => c.ssr > moved[0].ssr)).toBe(true);
    expect(r.x[0]).toBeCloseTo(2, 3);
    expect(r.x[1]).toBeCloseTo(-0.3, 3);
  });

  it('stays within the bounds and ends on the bound that cuts the optimum off', () => {
    const r = leastSquares(residuals, [1, 0], { lower: [0, -0.2], upper: [10, 5], difference: 1e-7 });
    expect(r.x[1]).toBe(-0.2);
    expect(r.x[0]).toBeGreaterThan(0);
    expect(r.stop).not.toBe('iterations');
  });

  it('stops at once when the residuals do not depend on the unknowns (nothing to fit)', () => {
    const r = leastSquares(() => [0.5, -0.5, 0], [0.3, 0.1], wide);
    expect(r.stop).toBe('gradient');
    expect(r.iterations).toBe(0);
    expect(r.evaluations).toBe(3);
    expect(r.x).toEqual([0.3, 0.1]);
  });
});

describe('invertSpd', () => {
  it('matches mathjs inv on a symmetric positive-definite 3×3 (the fit covariance shape)', () => {
    const a = [
      [4, 1.2, -0.5],
      [1.2, 3, 0.4],
      [-0.5, 0.4, 2],
    ];
    const want = inv(a) as number[][];
    const got = invertSpd(a);
    for (let i = 0; i < 3; i++) for (let j = 0; j < 3; j++) expect(got[i][j]).toBeCloseTo(want[i][j], 12);
  });
});
