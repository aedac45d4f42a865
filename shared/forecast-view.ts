/**
 * forecastView(forecast, band): the engine's forecast reduced to what the chart and its text
 * summary show (shared/schemas/plan.ts `ForecastView`). Pure; runs on the server (saved
 * plans) and in the browser (live drafts), so both draw the same numbers.
 */
import type { Forecast } from '../simulation/forecast';
import type { EnsembleBand } from '../simulation/advice/ensemble';
import type { ForecastView } from './schemas/plan';

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
  };
}

// ---- words ------------------------------------------------------------------------------

/** A number as a keeper reads it: 2 significant digits below 10, whole numbers above. */
export function plainNumber(x: number): string {
  if (!Number.isFinite(x)) return '–';
  if (Math.abs(x) >= 10) return String(Math.round(x));
  if (x === 0) return '0';
  return String(Number(x.toPrecision(2)));
}

const dayWord = (d: number) => `day ${Math.round(d)}`;
const daysWord = (d: number) => (Math.round(d) === 1 ? '1 day' : `${plainNumber(d)} days`);

export const START_SENTENCES: Record<'given' | 'mature-present-load' | 'new-unseeded' | 'new-no-fish', string> = {
  given: 'Starts from the state you chose for the tank.',
  'mature-present-load': 'Starts as a settled tank: its nitrifiers match the fish it holds now.',
  'new-unseeded': 'Starts as a new tank with hardly any nitrifiers (no fish and no water tests yet).',
  'new-no-fish': 'Starts with hardly any nitrifiers: the tank holds no fish, so nothing is known to have fed its biofilter.',
};

/** The chart in sentences: peaks with their days, and time over each limit (mg/L as N). */
export function forecastSentences(v: ForecastView): string[] {
  const out = [
    `Total ammonia peaks at ${plainNumber(v.peaks.tan.value)} mg N/L on ${dayWord(v.peaks.tan.day)}; free ammonia at ${plainNumber(v.peaks.freeNh3.value)} mg NH3/L.`,
    `Nitrite peaks at ${plainNumber(v.peaks.no2.value)} mg N/L on ${dayWord(v.peaks.no2.day)}; nitrate reaches ${plainNumber(v.peaks.no3.value)} mg N/L.`,
  ];
  const over: [string, { days: number; firstDay: number | null }, string][] = [
    ['free ammonia', v.daysOver.freeNh3, `${plainNumber(v.limits.freeNh3MgNH3)} mg NH3/L`],
    ['total ammonia (long-term limit)', v.daysOver.tanChronic, `${plainNumber(v.limits.tanChronicMgN)} mg N/L`],
    ['total ammonia (short-term limit)', v.daysOver.tanAcute, `${plainNumber(v.limits.tanAcuteMgN)} mg N/L`],
    ['nitrite', v.daysOver.no2, `${plainNumber(v.limits.no2MgN)} mg N/L`],
  ];
  const crossings = over.filter(([, e]) => e.days > 0);
  if (crossings.length === 0) out.push('Nothing goes over its limit in this forecast.');
  for (const [name, e, limit] of crossings) {
    out.push(`${name[0].toUpperCase()}${name.slice(1)} is over its limit (${limit}) for ${daysWord(e.days)}, from ${dayWord(e.firstDay ?? 0)}.`);
  }
  return out;
}
