import { describe, expect, it } from 'vitest';
import {
  calendarDaysAgo,
  formatCelsius,
  formatLitres,
  formatMgPerL,
  formatWait,
  compactDate,
  relativeDayLabel,
  shortDate,
  stockingLabel,
} from '@/lib/format';

const local = (y: number, m: number, d: number, h = 12) => new Date(y, m - 1, d, h);

describe('calendarDaysAgo', () => {
  it('counts calendar days, not 24-hour spans', () => {
    expect(calendarDaysAgo(local(2025, 3, 1, 23), local(2025, 3, 2, 1))).toBe(1);
    expect(calendarDaysAgo(local(2025, 3, 2, 1), local(2025, 3, 2, 23))).toBe(0);
  });

  it('answers null for an unreadable date', () => {
    expect(calendarDaysAgo('not a date', local(2025, 3, 2))).toBeNull();
  });
});

describe('relativeDayLabel', () => {
  const now = local(2025, 3, 10);
  it.each([
    [local(2025, 3, 10, 8), 'today'],
    [local(2025, 3, 9), 'yesterday'],
    [local(2025, 3, 7), '3 days ago'],
    [local(2025, 3, 11), 'tomorrow'],
    [local(2025, 3, 13), 'in 3 days'],
  ])('labels %s as %s', (then, label) => {
    expect(relativeDayLabel(then, now)).toBe(label);
  });

  it('says the date is unknown rather than printing NaN', () => {
    expect(relativeDayLabel('garbage', now)).toBe('unknown date');
  });
});

describe('shortDate', () => {
  it('writes day, short month and year', () => {
    expect(shortDate(local(2025, 3, 12), 'en-GB')).toBe('12 Mar 2025');
  });

  it('says unknown for an unreadable date', () => {
    expect(shortDate('nope', 'en-GB')).toBe('unknown date');
  });
});

describe('formatMgPerL', () => {
  it.each([
    [0, '0'],
    [0.25, '0.25'],
    [0.5, '0.5'],
    [0.123, '0.12'],
    [2.04, '2'],
    [2.46, '2.5'],
    [12.4, '12'],
    [40, '40'],
  ])('writes %s as %s', (value, text) => {
    expect(formatMgPerL(value)).toBe(text);
  });

  it('writes a dash for a value that was not tested', () => {
    expect(formatMgPerL(null)).toBe('—');
    expect(formatMgPerL(Number.NaN)).toBe('—');
  });
});

describe('volume and temperature', () => {
  it('drops a trailing .0 and keeps one decimal otherwise', () => {
    expect(formatLitres(120)).toBe('120 L');
    expect(formatLitres(7.5)).toBe('7.5 L');
    expect(formatLitres(54.04)).toBe('54 L');
    expect(formatCelsius(25)).toBe('25 °C');
    expect(formatCelsius(24.46)).toBe('24.5 °C');
  });
});

describe('formatWait', () => {
  it.each([
    [0, '1 second'],
    [1, '1 second'],
    [30, '30 seconds'],
    [60, '1 minute'],
    [61, '2 minutes'],
    [900, '15 minutes'],
    [3600, '1 hour'],
    [3601, '2 hours'],
  ])('writes %i seconds as %s', (seconds, text) => {
    expect(formatWait(seconds)).toBe(text);
  });
});

describe('stockingLabel', () => {
  it('names fish and species, or says the tank is empty', () => {
    expect(stockingLabel(14, 3)).toBe('14 fish · 3 species');
    expect(stockingLabel(1, 1)).toBe('1 fish · 1 species');
    expect(stockingLabel(0, 0)).toBe('No animals');
  });

  it('does not count shrimp and snails as fish', () => {
    expect(stockingLabel(0, 2, 27)).toBe('27 shrimp or snails · 2 species');
    expect(stockingLabel(6, 3, 1)).toBe('6 fish and 1 shrimp or snail · 3 species');
  });
});

describe('compactDate', () => {
  const now = new Date(2025, 5, 1);
  it('leaves the year out within the current year', () => {
    expect(compactDate(new Date(2025, 2, 12), now, 'en-GB')).toBe('12 Mar');
  });

  it('keeps the year for other years', () => {
    expect(compactDate(new Date(2024, 11, 30), now, 'en-GB')).toBe('30 Dec 2024');
  });

  it('says unknown for an unreadable date', () => {
    expect(compactDate('x', now, 'en-GB')).toBe('unknown date');
  });
});
