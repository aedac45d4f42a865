/**
 * One formatter per kind of figure, for every layer (the engine's sentences, the screens, the
 * e-mails). Pure; knows nothing of units: lib/units-format.ts converts to the person's units
 * and then formats here.
 */

/** At most `digits` decimals, trailing zeros dropped: 31.70 → "31.7", 77.00 → "77". */
export function trimDecimals(value: number, digits: number): string {
  const fixed = value.toFixed(digits);
  return fixed.includes('.') ? fixed.replace(/0+$/, '').replace(/\.$/, '') : fixed;
}

/**
 * A concentration as a test kit reads it (mg/L): two decimals below 1 (kits step in 0.25 mg/L
 * there), one decimal below 10, whole numbers above. Null means "not tested": "—".
 */
export function formatConcentration(value: number | null): string {
  if (value === null || !Number.isFinite(value)) return '—';
  const abs = Math.abs(value);
  return trimDecimals(value, abs < 1 ? 2 : abs < 10 ? 1 : 0);
}

/**
 * A plain figure in a sentence (a peak, a limit, a dose, a count of days, a computed free
 * ammonia): two significant digits below 10, whole numbers from 10.
 */
export function formatFigure(x: number): string {
  if (!Number.isFinite(x)) return '–';
  if (Math.abs(x) >= 10) return String(Math.round(x));
  if (x === 0) return '0';
  return String(Number(x.toPrecision(2)));
}

/** A volume's number (any volume unit): at most one decimal, "120", "7.5". */
export function formatVolumeFigure(v: number): string {
  return trimDecimals(v, 1);
}

/** A temperature's number (°C or °F): at most one decimal, "25", "24.5". */
export function formatTemperatureFigure(t: number): string {
  return trimDecimals(t, 1);
}

/** "120 L", "7.5 L". */
export function formatLitres(v: number): string {
  return `${formatVolumeFigure(v)} L`;
}

/** "25 °C", "24.5 °C". */
export function formatCelsius(t: number): string {
  return `${formatTemperatureFigure(t)} °C`;
}
