import { describe, expect, it } from 'vitest';
import { contrastRatio, parseHexColor, relativeLuminance } from '@/lib/contrast';

const close = (a: number, b: number, tol = 0.01) => Math.abs(a - b) <= tol;

describe('relativeLuminance', () => {
  it('is 0 for black and 1 for white (WCAG 2.2 glossary, relative luminance)', () => {
    expect(relativeLuminance('#000000')).toBe(0);
    expect(relativeLuminance('#ffffff')).toBe(1);
  });

  it('weights green most, then red, then blue (coefficients 0.7152, 0.2126, 0.0722, WCAG 2.2 glossary)', () => {
    expect(close(relativeLuminance('#00ff00'), 0.7152, 1e-9)).toBe(true);
    expect(close(relativeLuminance('#ff0000'), 0.2126, 1e-9)).toBe(true);
    expect(close(relativeLuminance('#0000ff'), 0.0722, 1e-9)).toBe(true);
  });

  it('accepts the three-digit short form', () => {
    expect(relativeLuminance('#fff')).toBe(relativeLuminance('#ffffff'));
  });
});

describe('contrastRatio', () => {
  it('is 21 for black on white (WCAG 2.2 glossary, contrast ratio range 1–21)', () => {
    expect(contrastRatio('#000', '#fff')).toBeCloseTo(21, 10);
  });

  it('is 1 for a colour against itself', () => {
    expect(contrastRatio('#0A5F5A', '#0A5F5A')).toBe(1);
  });

  it('is symmetric', () => {
    expect(contrastRatio('#102422', '#F3F6F5')).toBe(contrastRatio('#F3F6F5', '#102422'));
  });

  it('puts #767676 on white just above 4.5:1 and #777777 just below (from memory: the usual "lightest grey for body text" example)', () => {
    expect(contrastRatio('#767676', '#ffffff')).toBeGreaterThan(4.5);
    expect(contrastRatio('#777777', '#ffffff')).toBeLessThan(4.5);
  });
});

describe('parseHexColor', () => {
  it('reads six-digit colours in either case', () => {
    expect(parseHexColor('#0a5F5a')).toEqual([10, 95, 90]);
  });

  it('rejects names and malformed strings with a RangeError', () => {
    expect(() => parseHexColor('teal')).toThrow(RangeError);
    expect(() => parseHexColor('#12345')).toThrow(RangeError);
  });
});
