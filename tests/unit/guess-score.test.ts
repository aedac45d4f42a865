import { describe, expect, it } from 'vitest';
import { scoreGuess, shortValue } from '@/components/lessons/guess-score';

// Thresholds are the lesson's own teaching rule (common practice: tests every 1–3 days).
describe('scoreGuess', () => {
  it('calls a guess within 2 days and ×1.5 of the peak close', () => {
    const s = scoreGuess({ day: 7, value: 0.5 }, { day: 6, value: 0.64 });
    expect(s.closeness).toBe('close');
    expect(s.detail).toBe('You were 1 day late and 1.3 times too low.');
  });

  it('calls a guess within 5 days and ×2.5 near, and anything else far', () => {
    expect(scoreGuess({ day: 2, value: 0.3 }, { day: 6, value: 0.64 }).closeness).toBe('near');
    expect(scoreGuess({ day: 20, value: 0.3 }, { day: 6, value: 0.64 }).closeness).toBe('far');
    expect(scoreGuess({ day: 6, value: 2 }, { day: 6, value: 0.64 }).detail).toBe('You were on the right day and 3.1 times too high.');
  });

  it('refuses a peak of zero instead of dividing by it', () => {
    expect(() => scoreGuess({ day: 1, value: 1 }, { day: 1, value: 0 })).toThrow(RangeError);
  });

  it('keeps two significant digits below 1', () => {
    expect(shortValue(0.064)).toBe('0.064');
    expect(shortValue(0.6355)).toBe('0.64');
    expect(shortValue(1.234)).toBe('1.2');
  });
});

describe('guess chart geometry', () => {
  it('maps a point to pixels and back to the same whole day and 0.01 mg/L', async () => {
    const { guessGeometry, toPixels, fromPixels, GUESS_Y_MAX } = await import('@/components/lessons/guess-geometry');
    const g = guessGeometry({ horizonDays: 30, width: 360, limitMgN: 0.1 });
    expect(g.yDomain).toEqual([0, GUESS_Y_MAX]);
    const px = toPixels({ day: 12, value: 0.4 }, g);
    expect(fromPixels(px.x, px.y, g)).toEqual({ day: 12, value: 0.4 });
    // Outside the plot, the marker stays on its edge.
    expect(fromPixels(-50, 10_000, g)).toEqual({ day: 0, value: 0 });
  });
});
