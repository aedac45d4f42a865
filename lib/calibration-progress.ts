/**
 * What "Fit to my tests" says while the fit runs: how many tests it is fitting, counted from the
 * tank page's recent readings the same way the server picks them (ammonia or nitrite logged in
 * the last CALIBRATION_DEFAULT_DAYS). The tank page carries only the newest
 * TANK_DETAIL_READING_LIMIT readings, so when that list may be cut short inside the window the
 * count is given as "at least".
 */
import { CALIBRATION_DEFAULT_DAYS } from '@/shared/schemas/plan';
import { TANK_DETAIL_READING_LIMIT } from '@/shared/schemas/tank';

const DAY_MS = 86_400_000;

export interface LoggedTest {
  takenAt: string;
  tanMgN: number | null;
  no2MgN: number | null;
}

/** Tests the fit will use, and whether the count is exact. */
export function testsToFit(readings: readonly LoggedTest[], now: Date, limit = TANK_DETAIL_READING_LIMIT): { count: number; exact: boolean } {
  const since = now.getTime() - CALIBRATION_DEFAULT_DAYS * DAY_MS;
  const inWindow = readings.filter((r) => Date.parse(r.takenAt) >= since);
  const count = inWindow.filter((r) => r.tanMgN !== null || r.no2MgN !== null).length;
  // A full list whose oldest reading is still inside the window may have left older ones out.
  const exact = readings.length < limit || inWindow.length < readings.length;
  return { count, exact };
}

/** The busy label of the fit button. */
export function fittingLabel(readings: readonly LoggedTest[], now: Date): string {
  const { count, exact } = testsToFit(readings, now);
  if (count === 0) return 'Fitting…';
  return `Fitting your ${count}${exact ? '' : '+'} test${count === 1 && exact ? '' : 's'}…`;
}

/** "the last eight weeks" from the window's length. */
export function fitWindowWords(): string {
  const weeks = CALIBRATION_DEFAULT_DAYS / 7;
  const words = ['', 'one', 'two', 'three', 'four', 'five', 'six', 'seven', 'eight', 'nine', 'ten'];
  if (weeks === 1) return 'the last week';
  return Number.isInteger(weeks) && weeks < words.length ? `the last ${words[weeks]} weeks` : `the last ${CALIBRATION_DEFAULT_DAYS} days`;
}
