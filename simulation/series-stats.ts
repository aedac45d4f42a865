/** Small statistics over forecast series: peaks, time over a limit, clearing day. */

export interface Peak {
  value: number;
  day: number;
}

export interface Excursion {
  /** time spent above the limit, days (crossings located by linear interpolation) */
  days: number;
  /** first day above the limit, or null */
  firstDay: number | null;
}

/** Largest value and its day (the first, if tied). Empty input → { value: NaN, day: NaN }. */
export function peakOf(days: readonly number[], values: readonly number[]): Peak {
  let best = -Infinity;
  let day = NaN;
  for (let i = 0; i < values.length; i++) {
    if (values[i] > best) {
      best = values[i];
      day = days[i];
    }
  }
  return { value: values.length ? best : NaN, day };
}

/**
 * Time above a (possibly time-varying) limit. Between samples the excess value − limit is
 * taken as linear, so a crossing between days counts the right fraction of the interval.
 */
export function daysOver(days: readonly number[], values: readonly number[], limits: readonly number[]): Excursion {
  let total = 0;
  let firstDay: number | null = null;
  for (let i = 0; i < values.length; i++) {
    const e1 = values[i] - limits[i];
    if (e1 > 0 && firstDay === null) {
      if (i === 0) firstDay = days[0];
      else {
        const e0 = values[i - 1] - limits[i - 1];
        firstDay = days[i - 1] + ((days[i] - days[i - 1]) * -e0) / (e1 - e0);
      }
    }
    if (i === 0) continue;
    const e0 = values[i - 1] - limits[i - 1];
    const h = days[i] - days[i - 1];
    if (e0 > 0 && e1 > 0) total += h;
    else if (e0 > 0 !== e1 > 0) total += (h * Math.max(e0, e1)) / Math.abs(e1 - e0);
  }
  return { days: total, firstDay };
}

/**
 * First sampled day from which every given series stays below `threshold` until the end,
 * searching after `afterDay`; null when that never happens.
 */
export function settledBelowDay(days: readonly number[], series: readonly (readonly number[])[], threshold: number, afterDay = 0): number | null {
  let candidate: number | null = null;
  for (let i = 0; i < days.length; i++) {
    const below = series.every((s) => s[i] < threshold);
    if (!below) candidate = null;
    else if (candidate === null && days[i] >= afterDay) candidate = days[i];
  }
  return candidate;
}
