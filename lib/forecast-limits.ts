/**
 * A forecast's figures beside its limits, in the keeper's nitrogen basis (pure): each value's
 * peak and day, the limit it is held to with that limit's basis in plain words, and the days
 * over it. The forecast view and the printed plan show the same rows.
 */
import type { ForecastView } from '@/shared/schemas/plan';
import type { NitrogenBasis } from '@/shared/schemas/preferences';
import type { NitrogenKey } from '@/shared/schemas/reading';
import { plainNumber, type ForecastLimitKey } from '@/shared/forecast-view';
import { nitrogenIn, nitrogenUnit } from '@/lib/units-format';

/**
 * Where each default limit comes from, for a keeper (simulation/limits.ts `defaultLimits` holds
 * the values and full sources; plan forecasts use those defaults at the tank's pH and temperature).
 */
export const LIMIT_BASIS: Record<ForecastLimitKey, string> = {
  freeNh3: 'Canadian guideline (CCME) for free ammonia, the part of ammonia that harms fish most.',
  tanChronic: "US EPA (2013) long-term limit at your water's pH and temperature; set for sensitive wild fish, so on the careful side.",
  tanAcute: "US EPA (2013) short-term (1-hour) limit at your water's pH and temperature.",
  no2: 'Common fish-farming practice (Boyd, Global Seafood Alliance).',
};

export interface LimitRow {
  key: 'tan' | 'freeNh3' | 'no2' | 'no3';
  name: string;
  /** "0.42 mg/L as N" */
  peak: string;
  peakDay: number;
  /** The limit this value is held to; null for nitrate (no default limit). */
  limit: { key: ForecastLimitKey; value: string; basis: string; over: { days: number; firstDay: number | null } } | null;
}

/** "0.1 mg/L as N" or "0.33 mg/L NO2−" for a value stored as mg N/L. */
export function nitrogenText(mgN: number, key: NitrogenKey, basis: NitrogenBasis): string {
  return `${plainNumber(nitrogenIn(mgN, key, basis))} ${nitrogenUnit(key, basis)}`;
}

/** Total ammonia, free ammonia, nitrite, nitrate: peak, limit with basis, days over. */
export function forecastLimitRows(v: ForecastView, basis: NitrogenBasis): LimitRow[] {
  const n = (mgN: number, key: NitrogenKey) => nitrogenText(mgN, key, basis);
  const limit = (key: ForecastLimitKey, value: string) => ({ key, value, basis: LIMIT_BASIS[key], over: v.daysOver[key] });
  return [
    { key: 'tan', name: 'Total ammonia', peak: n(v.peaks.tan.value, 'tanMgN'), peakDay: v.peaks.tan.day, limit: limit('tanChronic', n(v.limits.tanChronicMgN, 'tanMgN')) },
    {
      key: 'freeNh3',
      name: 'Free ammonia',
      peak: `${plainNumber(v.peaks.freeNh3.value)} mg NH3/L`,
      peakDay: v.peaks.freeNh3.day,
      limit: limit('freeNh3', `${plainNumber(v.limits.freeNh3MgNH3)} mg NH3/L`),
    },
    { key: 'no2', name: 'Nitrite', peak: n(v.peaks.no2.value, 'no2MgN'), peakDay: v.peaks.no2.day, limit: limit('no2', n(v.limits.no2MgN, 'no2MgN')) },
    { key: 'no3', name: 'Nitrate', peak: n(v.peaks.no3.value, 'no3MgN'), peakDay: v.peaks.no3.day, limit: null },
  ];
}

/** The short-term ammonia limit, shown only when the forecast goes over it. */
export function acuteAmmoniaLine(v: ForecastView, basis: NitrogenBasis): string | null {
  const over = v.daysOver.tanAcute;
  if (over.days <= 0) return null;
  return `Total ammonia is over the short-term limit (${nitrogenText(v.limits.tanAcuteMgN, 'tanMgN', basis)}) for ${plainNumber(over.days)} days, from day ${Math.round(over.firstDay ?? 0)}.`;
}

/** "Over the limit (0.1 mg/L as N) for 6 days, from day 9" or "Stays under the limit (…)". */
export function overText(limit: NonNullable<LimitRow['limit']>): string {
  return limit.over.days > 0
    ? `Over the limit (${limit.value}) for ${plainNumber(limit.over.days)} days, from day ${Math.round(limit.over.firstDay ?? 0)}`
    : `Stays under the limit (${limit.value})`;
}
