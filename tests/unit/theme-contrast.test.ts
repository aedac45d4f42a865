import { describe, expect, it } from 'vitest';
import { palette, statusColorTokens, type ColorToken, type StatusTone } from '@/constants/theme';
import { contrastRatio } from '@/lib/contrast';

// Thresholds: WCAG 2.2 SC 1.4.3 (text 4.5:1) and SC 1.4.11 (UI component outlines 3:1).
const TEXT_MIN = 4.5;
const NON_TEXT_MIN = 3;

const textPairs: [ColorToken, ColorToken][] = [
  ['text', 'background'],
  ['text', 'surface'],
  ['text', 'surfaceRaised'],
  ['textMuted', 'background'],
  ['textMuted', 'surface'],
  ['textMuted', 'surfaceRaised'],
  ['onPrimary', 'primary'],
  ['onPrimary', 'primaryPressed'],
  ['link', 'background'],
  ['link', 'surface'],
  ['navActive', 'navActiveSurface'],
  ['navActive', 'navBackground'],
  ['navInactive', 'navBackground'],
];

const tones = Object.keys(statusColorTokens) as StatusTone[];

for (const scheme of ['light', 'dark'] as const) {
  const colors = palette[scheme];
  describe(`${scheme} palette`, () => {
    it.each(textPairs)('shows %s on %s at 4.5:1 or more', (fg, bg) => {
      expect(contrastRatio(colors[fg], colors[bg])).toBeGreaterThanOrEqual(TEXT_MIN);
    });

    it.each(tones)('shows the %s status text on its own tint and on a plain card at 4.5:1 or more', (tone) => {
      const { text, surface } = statusColorTokens[tone];
      expect(contrastRatio(colors[text], colors[surface])).toBeGreaterThanOrEqual(TEXT_MIN);
      expect(contrastRatio(colors[text], colors.surface)).toBeGreaterThanOrEqual(TEXT_MIN);
    });

    it('draws field outlines and the focus ring at 3:1 or more against the surface', () => {
      expect(contrastRatio(colors.fieldBorder, colors.surface)).toBeGreaterThanOrEqual(NON_TEXT_MIN);
      expect(contrastRatio(colors.focus, colors.surface)).toBeGreaterThanOrEqual(NON_TEXT_MIN);
      expect(contrastRatio(colors.focus, colors.background)).toBeGreaterThanOrEqual(NON_TEXT_MIN);
    });

    it('fills primary buttons at 3:1 or more against the page', () => {
      expect(contrastRatio(colors.primary, colors.background)).toBeGreaterThanOrEqual(NON_TEXT_MIN);
    });
  });
}

describe('palette shape', () => {
  it('gives light and dark the same token names', () => {
    expect(Object.keys(palette.dark).sort()).toEqual(Object.keys(palette.light).sort());
  });
});
