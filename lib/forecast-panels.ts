/**
 * The forecast chart's panels (pure): which series, bands and limit lines each panel shows, in
 * the person's nitrogen basis ("as N" or "as the ion"; free ammonia is always mg NH3/L).
 */
import type { ForecastView } from '@/shared/schemas/plan';
import type { NitrogenBasis } from '@/shared/schemas/preferences';
import { nitrogenIn, nitrogenUnit } from '@/lib/units-format';
import { plainNumber } from '@/shared/forecast-view';
import type { PanelLimit, PanelPoints, PanelSeries } from '@/lib/chart-geometry';

export type PanelKey = 'ammonia' | 'nitrite' | 'free-ammonia' | 'nitrate' | 'capacity';

/** The panels shown first (and printed): the two values a keeper tests during a change. */
export const MAIN_PANELS: readonly PanelKey[] = ['ammonia', 'nitrite'];

export interface ForecastPanel {
  key: PanelKey;
  title: string;
  unit: string;
  series: (PanelSeries & { label: string })[];
  limits: PanelLimit[];
  /** The keeper's tests on this panel (none on the free-ammonia and capacity panels). */
  points: PanelPoints[];
  minYMax: number;
}

/** A logged test on the forecast's day axis, values as stored (mg N/L). */
export interface ChartReading {
  day: number;
  tanMgN: number | null;
  no2MgN: number | null;
  no3MgN: number | null;
}

function pointsOf(readings: readonly ChartReading[], key: 'tanMgN' | 'no2MgN' | 'no3MgN', f: (x: number) => number): PanelPoints[] {
  const at = readings.flatMap((r) => (r[key] === null ? [] : [{ day: r.day, value: f(r[key]) }]));
  return at.length > 0 ? [{ key: 'tested', at }] : [];
}

type Spread = { p10: number[]; p90: number[] } | undefined;
const band = (b: Spread, f: (x: number) => number) => (b ? { lo: b.p10.map(f), hi: b.p90.map(f) } : undefined);

/**
 * Panels for a forecast; the band is drawn only when `showBand` (it belongs to the saved plan).
 * Total ammonia and nitrite each get their own scale: nitrite's limit is a tenth of ammonia's
 * peak in a typical change, and on a shared axis it would read as a flat line.
 */
export function forecastPanels(v: ForecastView, basis: NitrogenBasis, showBand = true, readings: readonly ChartReading[] = []): ForecastPanel[] {
  const tan = (x: number) => nitrogenIn(x, 'tanMgN', basis);
  const no2 = (x: number) => nitrogenIn(x, 'no2MgN', basis);
  const no3 = (x: number) => nitrogenIn(x, 'no3MgN', basis);
  const b = showBand ? v.band : null;
  return [
    {
      key: 'ammonia',
      title: 'Total ammonia',
      unit: nitrogenUnit('tanMgN', basis),
      series: [{ key: 'tan', label: 'Total ammonia', values: v.tanMgN.map(tan), band: band(b?.tanMgN, tan) }],
      limits: [{ key: 'tanChronic', value: tan(v.limits.tanChronicMgN), label: `limit ${plainNumber(tan(v.limits.tanChronicMgN))}` }],
      points: pointsOf(readings, 'tanMgN', tan),
      minYMax: 0.2,
    },
    {
      key: 'nitrite',
      title: 'Nitrite',
      unit: nitrogenUnit('no2MgN', basis),
      series: [{ key: 'no2', label: 'Nitrite', values: v.no2MgN.map(no2), band: band(b?.no2MgN, no2) }],
      limits: [{ key: 'no2', value: no2(v.limits.no2MgN), label: `limit ${plainNumber(no2(v.limits.no2MgN))}` }],
      points: pointsOf(readings, 'no2MgN', no2),
      // The limit line itself sets the scale when nitrite stays low (yDomainFor includes limits).
      minYMax: no2(v.limits.no2MgN) * 0.5,
    },
    {
      key: 'free-ammonia',
      title: 'Free ammonia (NH3)',
      unit: 'mg NH3/L',
      series: [{ key: 'freeNh3', label: 'Free ammonia', values: v.freeNh3MgL, band: band(b?.freeNh3MgL, (x) => x) }],
      limits: [{ key: 'freeNh3', value: v.limits.freeNh3MgNH3, label: `limit ${plainNumber(v.limits.freeNh3MgNH3)}` }],
      points: [],
      minYMax: 0.005,
    },
    {
      key: 'nitrate',
      title: 'Nitrate',
      unit: nitrogenUnit('no3MgN', basis),
      series: [{ key: 'no3', label: 'Nitrate', values: v.no3MgN.map(no3), band: band(b?.no3MgN, no3) }],
      limits: [],
      points: pointsOf(readings, 'no3MgN', no3),
      minYMax: 5,
    },
    {
      key: 'capacity',
      title: 'What the filter can clear, and what the fish put in',
      unit: 'mg N a day',
      series: [
        { key: 'ao', label: 'Ammonia the filter can clear', values: v.aoMgNPerDay },
        { key: 'no', label: 'Nitrite the filter can clear', values: v.noMgNPerDay },
        { key: 'load', label: 'Ammonia from fish and food', values: v.loadMgNPerDay },
      ],
      limits: [],
      points: [],
      minYMax: 1,
    },
  ];
}
