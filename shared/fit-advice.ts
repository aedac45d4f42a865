/**
 * Why a fit to the tank's tests is no better than it is, and which test would help most: the
 * words under "Fit to my tests" (empty when the fit is good and every capacity is pinned).
 * Pure: reads the tests the fit used and the fit's own quality figures.
 */
import { formatFigure } from '../simulation/format-number';

export interface FitTest {
  /** days from the first test used */
  day: number;
  tanMgN?: number;
  no2MgN?: number;
}

export interface FitQuality {
  verdict: 'good' | 'fair' | 'poor';
  /** log-parameter standard errors (null: not fitted) */
  standardErrors: { ao: number | null; no: number | null; growth: number | null };
}

/** Shortest span of tests that shows the nitrifiers change (common practice: test every 2–3 days for two weeks). */
export const FIT_MIN_SPAN_DAYS = 7;
/** A log standard error above this leaves a capacity uncertain by more than e ≈ 2.7 times either way. */
export const FIT_LOOSE_LOG_ERROR = 1;

const CAPACITY_TEST = 'A capacity test (the Capacity test tab: dose a known amount of ammonia, test a few hours apart) measures what the filter clears.';

export function fitAdvice(tests: readonly FitTest[], quality: FitQuality): string[] {
  const out: string[] = [];
  const tan = tests.filter((t) => t.tanMgN !== undefined).map((t) => t.tanMgN!);
  const no2 = tests.filter((t) => t.no2MgN !== undefined).map((t) => t.no2MgN!);
  const span = tests.length > 0 ? Math.max(...tests.map((t) => t.day)) - Math.min(...tests.map((t) => t.day)) : 0;
  const allZero = [...tan, ...no2].every((v) => v <= 0);
  if (quality.verdict === 'poor') {
    out.push(
      'Your tests sit further from the model than colour-chart kits explain. Check the tank settings (volume, filter, fish), the dates of water changes and doses, and whether your kit reads as N or as the ion.',
    );
  }
  if (allZero && tests.length > 0) {
    out.push(`Every test used reads 0: the filter clears all the fish give it, so the tests show only that it could clear more, not how much more. ${CAPACITY_TEST}`);
  } else {
    const se = quality.standardErrors;
    const loose = [se.ao !== null && se.ao > FIT_LOOSE_LOG_ERROR ? 'ammonia-eating' : null, se.no !== null && se.no > FIT_LOOSE_LOG_ERROR ? 'nitrite-eating' : null].filter(Boolean);
    if (loose.length > 0) out.push(`The tests leave the ${loose.join(' and the ')} capacity uncertain by more than about 3 times either way. ${CAPACITY_TEST}`);
  }
  if (no2.length === 0) out.push('None of the tests used has a nitrite value: test nitrite with ammonia, it is what pins the nitrite-eating nitrifiers.');
  if (tan.length === 0) out.push('None of the tests used has an ammonia value: test total ammonia with nitrite.');
  if (span < FIT_MIN_SPAN_DAYS) {
    out.push(`The tests span only ${formatFigure(span)} days; nitrifiers change over weeks: test every 2–3 days for two weeks and fit again.`);
  }
  return quality.verdict === 'good' && out.length === 0 ? [] : out;
}
