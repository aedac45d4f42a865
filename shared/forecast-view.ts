/**
 * forecastView(forecast, band): the engine's forecast reduced to what the chart and its text
 * summary show (shared/schemas/plan.ts `ForecastView`). Pure; runs on the server (saved
 * plans) and in the browser (live drafts), so both draw the same numbers.
 */
import { spareSentence, type Forecast } from '../simulation/forecast';
import type { EnsembleBand } from '../simulation/advice/ensemble';
import type { ForecastView } from './schemas/plan';
import type { LimitLevel } from './schemas/tank';
import { levelFor } from './tank-status';

/** Values kept to 4 significant digits: well inside any test kit's resolution, half the JSON. */
export function round4(x: number): number {
  return Number.isFinite(x) ? Number(x.toPrecision(4)) : 0;
}

const r = (xs: readonly number[]) => xs.map(round4);

function sumZones(f: Forecast, key: 'ao' | 'no'): number[] {
  const out = new Array<number>(f.series.days.length).fill(0);
  for (const z of f.series.zones) for (let i = 0; i < out.length; i++) out[i] += z[key][i];
  return out;
}

export function forecastView(f: Forecast, band: EnsembleBand | null = null, members = 0): ForecastView {
  const { series: s, summary } = f;
  const spread = (b: { p10: number[]; p90: number[] }) => ({ p10: r(b.p10), p90: r(b.p90) });
  return {
    days: r(s.days),
    tanMgN: r(s.tanMgN),
    freeNh3MgL: r(s.freeNh3MgL),
    no2MgN: r(s.no2MgN),
    no3MgN: r(s.no3MgN),
    aoMgNPerDay: r(sumZones(f, 'ao')),
    noMgNPerDay: r(sumZones(f, 'no')),
    loadMgNPerDay: r(s.loadMgNPerDay),
    limits: {
      freeNh3MgNH3: summary.limits.freeNh3.value,
      tanChronicMgN: summary.limits.tanChronic.value,
      tanAcuteMgN: summary.limits.tanAcute.value,
      no2MgN: summary.limits.nitrite.value,
    },
    peaks: summary.peaks,
    daysOver: summary.daysOver,
    band: band
      ? { tanMgN: spread(band.tanMgN), freeNh3MgL: spread(band.freeNh3MgL), no2MgN: spread(band.no2MgN), no3MgN: spread(band.no3MgN), members }
      : null,
    spareCapacity: summary.spareCapacity
      ? {
          times: round4(summary.spareCapacity.times),
          showsFirst: summary.spareCapacity.showsFirst,
          // The range holds the forecast's own figure, and nothing below 1× (no room) is shown as less.
          low: band?.spareTimes ? round4(Math.max(1, Math.min(band.spareTimes.p10, summary.spareCapacity.times))) : null,
          high: band?.spareTimes ? round4(Math.max(1, band.spareTimes.p90, summary.spareCapacity.times)) : null,
        }
      : null,
  };
}

/** The spare capacity in one sentence (the engine's wording, simulation/forecast/spare-capacity.ts), or null. */
export function spareCapacitySentence(v: Pick<ForecastView, 'spareCapacity'>): string | null {
  return v.spareCapacity ? spareSentence(v.spareCapacity) : null;
}

// ---- words ------------------------------------------------------------------------------

/** A plain figure in a sentence (simulation/format-number.ts `formatFigure`, the engine's too). */
export { formatFigure as plainNumber } from '../simulation/format-number';
import { formatFigure as plainNumber } from '../simulation/format-number';

const dayWord = (d: number) => `day ${Math.round(d)}`;
const daysWord = (d: number) => (Math.round(d) === 1 ? '1 day' : `${plainNumber(d)} days`);

/** The four limits a forecast is checked against, in the order they are reported. */
export const FORECAST_LIMIT_KEYS = ['freeNh3', 'tanChronic', 'tanAcute', 'no2'] as const;
export type ForecastLimitKey = (typeof FORECAST_LIMIT_KEYS)[number];

const LIMIT_NAME: Record<ForecastLimitKey, string> = {
  freeNh3: 'free ammonia',
  tanChronic: 'total ammonia (long-term limit)',
  tanAcute: 'total ammonia (short-term limit)',
  no2: 'nitrite',
};
/** What each limit watches, as the headline names it (both ammonia limits watch total ammonia). */
const LIMIT_SUBJECT: Record<ForecastLimitKey, string> = { freeNh3: 'free ammonia', tanChronic: 'total ammonia', tanAcute: 'total ammonia', no2: 'nitrite' };

export interface LimitCrossing {
  key: ForecastLimitKey;
  days: number;
  firstDay: number;
}

/** The forecast's one judgement: each limit it goes over, for how long and from which day. */
export function limitCrossings(v: ForecastView): LimitCrossing[] {
  return FORECAST_LIMIT_KEYS.filter((k) => v.daysOver[k].days > 0).map((k) => ({ key: k, days: v.daysOver[k].days, firstDay: v.daysOver[k].firstDay ?? 0 }));
}

const limitText = (v: ForecastView, k: ForecastLimitKey) =>
  k === 'freeNh3' ? `${plainNumber(v.limits.freeNh3MgNH3)} mg NH3/L` : `${plainNumber(v.limits[k === 'no2' ? 'no2MgN' : k === 'tanChronic' ? 'tanChronicMgN' : 'tanAcuteMgN'])} mg N/L`;

/** The chart in sentences: peaks with their days, and time over each limit (mg/L as N). */
export function forecastSentences(v: ForecastView): string[] {
  const out = [
    `Total ammonia peaks at ${plainNumber(v.peaks.tan.value)} mg N/L on ${dayWord(v.peaks.tan.day)}; free ammonia at ${plainNumber(v.peaks.freeNh3.value)} mg NH3/L.`,
    `Nitrite peaks at ${plainNumber(v.peaks.no2.value)} mg N/L on ${dayWord(v.peaks.no2.day)}; nitrate reaches ${plainNumber(v.peaks.no3.value)} mg N/L.`,
  ];
  const crossings = limitCrossings(v);
  if (crossings.length === 0) out.push('Nothing goes over its limit in this forecast.');
  for (const c of crossings) {
    const name = LIMIT_NAME[c.key];
    out.push(`${name[0].toUpperCase()}${name.slice(1)} is over its limit (${limitText(v, c.key)}) for ${daysWord(c.days)}, from ${dayWord(c.firstDay)}.`);
  }
  return out;
}

export type ForecastLevel = LimitLevel;

export interface ForecastVerdict {
  level: ForecastLevel;
  /** One plain sentence for the top of a forecast. */
  sentence: string;
}

const joinWords = (xs: readonly string[]) => (xs.length <= 1 ? (xs[0] ?? '') : `${xs.slice(0, -1).join(', ')} and ${xs[xs.length - 1]}`);
const capital = (s: string) => `${s[0].toUpperCase()}${s.slice(1)}`;

/**
 * The forecast in one sentence, from the same judgement as `forecastSentences`: over when a
 * limit is crossed; "watch" when a peak reaches the share of its limit a water test is
 * flagged at (shared/tank-status.ts `levelFor`); otherwise under every limit.
 */
export function forecastVerdict(v: ForecastView): ForecastVerdict {
  const crossings = limitCrossings(v);
  if (crossings.length > 0) {
    const subjects = [...new Set(crossings.map((c) => LIMIT_SUBJECT[c.key]))];
    const first = Math.min(...crossings.map((c) => c.firstDay));
    const longest = Math.max(...crossings.map((c) => c.days));
    const one = subjects.length === 1;
    return {
      level: 'over',
      sentence: `${capital(joinWords(subjects))} would go over ${one ? 'its limit' : 'their limits'} from ${dayWord(first)}, for ${one ? '' : 'up to '}${daysWord(longest)}: too much for the fish as planned.`,
    };
  }
  const near = (
    [
      ['total ammonia', v.peaks.tan, v.limits.tanChronicMgN],
      ['free ammonia', v.peaks.freeNh3, v.limits.freeNh3MgNH3],
      ['nitrite', v.peaks.no2, v.limits.no2MgN],
    ] as const
  ).filter(([, peak, limit]) => levelFor(peak.value, limit) === 'watch');
  if (near.length > 0) {
    const first = Math.min(...near.map(([, peak]) => peak.day));
    return {
      level: 'watch',
      sentence: `Stays under every limit, but ${joinWords(near.map(([name]) => name))} ${near.length === 1 ? 'comes' : 'come'} close around ${dayWord(first)}: test on the check days.`,
    };
  }
  return { level: 'ok', sentence: 'Stays well under every limit in this forecast.' };
}
