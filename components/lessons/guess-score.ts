/**
 * How close a newcomer's guess of the nitrite peak was (pure). "Close" and "near" are teaching
 * thresholds of our own, not science: a test-day rhythm of 1–3 days (common practice) makes
 * ±2 days "close"; test kits read in coarse steps, so a height within ×1.5 is "close".
 */
export interface PeakPoint {
  day: number;
  /** mg N/L */
  value: number;
}

export type Closeness = 'close' | 'near' | 'far';

export interface GuessScore {
  closeness: Closeness;
  /** guess day − forecast day (negative: guessed too early) */
  dayError: number;
  /** guess height ÷ forecast height (1 = exact) */
  heightRatio: number;
  headline: string;
  detail: string;
}

export const CLOSE_DAYS = 2;
export const CLOSE_RATIO = 1.5;
export const NEAR_DAYS = 5;
export const NEAR_RATIO = 2.5;

const within = (ratio: number, limit: number) => ratio <= limit && ratio >= 1 / limit;

export function scoreGuess(guess: PeakPoint, peak: PeakPoint): GuessScore {
  if (!(peak.value > 0)) throw new RangeError('the forecast peak must be above 0');
  const dayError = Math.round(guess.day - peak.day);
  const heightRatio = Math.max(guess.value, 1e-6) / peak.value;
  const closeness: Closeness =
    Math.abs(dayError) <= CLOSE_DAYS && within(heightRatio, CLOSE_RATIO)
      ? 'close'
      : Math.abs(dayError) <= NEAR_DAYS && within(heightRatio, NEAR_RATIO)
        ? 'near'
        : 'far';
  const when =
    dayError === 0 ? 'on the right day' : `${Math.abs(dayError)} day${Math.abs(dayError) === 1 ? '' : 's'} ${dayError < 0 ? 'early' : 'late'}`;
  const height =
    within(heightRatio, 1.1) ? 'about the right height' : heightRatio > 1 ? `${heightRatio.toFixed(1)} times too high` : `${(1 / heightRatio).toFixed(1)} times too low`;
  const headline = closeness === 'close' ? 'Close guess!' : closeness === 'near' ? 'Not far off.' : 'The tank surprised you.';
  return { closeness, dayError, heightRatio, headline, detail: `You were ${when} and ${height}.` };
}

/** A value rounded for display, e.g. 0.64 → "0.64", 0.064 → "0.064" (the one plain-figure formatter). */
export { formatFigure as shortValue } from '@/simulation/format-number';
