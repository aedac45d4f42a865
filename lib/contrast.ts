/**
 * Colour contrast per WCAG 2.x: "relative luminance" and "contrast ratio" as defined in the
 * WCAG 2.2 glossary (sRGB channel linearisation with the 0.04045 threshold).
 */

/** Parses `#rgb` or `#rrggbb` into 0–255 channels; throws a RangeError on anything else. */
export function parseHexColor(hex: string): [number, number, number] {
  const m = /^#([0-9a-f]{3}|[0-9a-f]{6})$/i.exec(hex.trim());
  if (!m) throw new RangeError(`Not a #rgb or #rrggbb colour: ${JSON.stringify(hex)}`);
  const digits = m[1].length === 3 ? [...m[1]].map((c) => c + c).join('') : m[1];
  return [0, 2, 4].map((i) => parseInt(digits.slice(i, i + 2), 16)) as [number, number, number];
}

function linearChannel(channel255: number): number {
  const c = channel255 / 255;
  return c <= 0.04045 ? c / 12.92 : ((c + 0.055) / 1.055) ** 2.4;
}

/** Relative luminance in [0, 1] (0 = black, 1 = white). */
export function relativeLuminance(hex: string): number {
  const [r, g, b] = parseHexColor(hex).map(linearChannel);
  return 0.2126 * r + 0.7152 * g + 0.0722 * b;
}

/** Contrast ratio in [1, 21]; symmetric in its arguments. */
export function contrastRatio(a: string, b: string): number {
  const la = relativeLuminance(a);
  const lb = relativeLuminance(b);
  const [hi, lo] = la >= lb ? [la, lb] : [lb, la];
  return (hi + 0.05) / (lo + 0.05);
}
