import { describe, expect, it } from 'vitest';
import { fitWindowWords, fittingLabel, testsToFit } from '../../lib/calibration-progress';

const now = new Date('2026-12-03T12:00:00Z');
const daysAgo = (d: number) => new Date(now.getTime() - d * 86_400_000).toISOString();
const test = (d: number, tan: number | null = 0.1, no2: number | null = 0) => ({ takenAt: daysAgo(d), tanMgN: tan, no2MgN: no2 });

describe('what "Fit to my tests" says while it runs', () => {
  it('counts the ammonia or nitrite tests of the last eight weeks, as the server picks them', () => {
    const readings = [test(1), test(10, null, null), test(20, null, 0.1), test(55), test(60)];
    expect(testsToFit(readings, now)).toEqual({ count: 3, exact: true });
    expect(fittingLabel(readings, now)).toBe('Fitting your 3 tests…');
  });

  it('says "at least" when the tank page’s list is full and may have left older tests of the window out', () => {
    const readings = Array.from({ length: 50 }, (_, i) => test(i * 0.5));
    expect(testsToFit(readings, now)).toEqual({ count: 50, exact: false });
    expect(fittingLabel(readings, now)).toBe('Fitting your 50+ tests…');
  });

  it('is exact when the full list already reaches back past the window', () => {
    const readings = [...Array.from({ length: 49 }, (_, i) => test(i)), test(70)];
    expect(testsToFit(readings, now)).toEqual({ count: 49, exact: true });
  });

  it('keeps a plain label without tests to count, and names the window in words', () => {
    expect(fittingLabel([], now)).toBe('Fitting…');
    expect(fittingLabel([test(2)], now)).toBe('Fitting your 1 test…');
    expect(fitWindowWords()).toBe('the last eight weeks');
  });
});
