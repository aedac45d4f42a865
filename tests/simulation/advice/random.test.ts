import { describe, expect, it } from 'vitest';
import { normalDraw, randomPermutation, seededRandom } from '../../../simulation/advice/random';

describe('seededRandom (mulberry32)', () => {
  it('gives the same sequence for the same seed', () => {
    const a = seededRandom(42);
    const b = seededRandom(42);
    for (let i = 0; i < 1000; i++) expect(a()).toBe(b());
  });

  it('gives different sequences for different seeds', () => {
    const a = seededRandom(1);
    const b = seededRandom(2);
    const same = Array.from({ length: 100 }, () => a() === b()).filter(Boolean).length;
    expect(same).toBeLessThan(3);
  });

  it('stays in [0, 1)', () => {
    const r = seededRandom(7);
    let outside = 0;
    for (let i = 0; i < 100_000; i++) {
      const x = r();
      if (!(x >= 0 && x < 1)) outside++;
    }
    expect(outside).toBe(0);
  });

  it('passes a chi-square test of uniformity over 20 bins', () => {
    // 19 degrees of freedom: the 99.9th percentile of χ² is 43.82 (standard χ² tables).
    const r = seededRandom(2024);
    const bins = new Array(20).fill(0);
    const n = 100_000;
    for (let i = 0; i < n; i++) bins[Math.floor(r() * 20)]++;
    const expected = n / 20;
    const chi2 = bins.reduce((s, c) => s + ((c - expected) ** 2) / expected, 0);
    expect(chi2).toBeLessThan(43.82);
  });

  it('rejects a seed that is not finite', () => {
    expect(() => seededRandom(Number.NaN)).toThrow(RangeError);
  });
});

describe('randomPermutation', () => {
  it('returns each index exactly once', () => {
    const p = randomPermutation(50, seededRandom(3));
    expect([...p].sort((a, b) => a - b)).toEqual(Array.from({ length: 50 }, (_, i) => i));
  });
});

describe('normalDraw', () => {
  it('has mean near 0 and standard deviation near 1', () => {
    // Standard error of the mean at n = 20 000 is 0.0071; 5 standard errors as the bound (common practice).
    const r = seededRandom(11);
    const xs = Array.from({ length: 20_000 }, () => normalDraw(r));
    const mean = xs.reduce((s, x) => s + x, 0) / xs.length;
    const sd = Math.sqrt(xs.reduce((s, x) => s + (x - mean) ** 2, 0) / (xs.length - 1));
    expect(Math.abs(mean)).toBeLessThan(0.036);
    expect(Math.abs(sd - 1)).toBeLessThan(0.03);
  });
});
