import { describe, expect, it } from 'vitest';
import { eventMarkers, markedPadding, markerLegend, panelGeometry, DEFAULT_PADDING, MARKER_STRIP } from '@/lib/chart-geometry';
import { forecastPanels, MAIN_PANELS } from '@/lib/forecast-panels';
import { fixtureView } from './forecast-fixture';

const g = { plot: { left: 40, top: 30, right: 340, bottom: 120 }, xDomain: [0, 30] as [number, number] };

describe('eventMarkers', () => {
  it('puts one numbered marker per whole day at that day, in day order', () => {
    const m = eventMarkers(
      [
        { day: 14, label: 'Add 6 Neon tetra' },
        { day: 0, label: 'Add 6 Neon tetra' },
        { day: 14, label: 'Change 25 % of the water' },
      ],
      g,
    );
    expect(m.map((x) => [x.n, x.day])).toEqual([
      [1, 0],
      [2, 14],
    ]);
    expect(m[0].x).toBe(40);
    expect(m[1].x).toBeCloseTo(40 + (14 / 30) * 300, 10);
    expect(markerLegend(m[1])).toBe('day 14: Add 6 Neon tetra; Change 25 % of the water');
  });

  it('leaves out events before the first or after the last day of the chart, and NaN days', () => {
    const m = eventMarkers(
      [
        { day: -3, label: 'a' },
        { day: 31, label: 'b' },
        { day: Number.NaN, label: 'c' },
        { day: 30, label: 'd' },
      ],
      g,
    );
    expect(m.map((x) => x.labels)).toEqual([['d']]);
  });

  it('moves a marker to the second row when its number would touch its neighbour', () => {
    // 300 px over 30 days: 10 px a day, closer than the 16 px gap for neighbouring days.
    const m = eventMarkers([0, 1, 2, 10].map((day) => ({ day, label: `e${day}` })), g);
    expect(m.map((x) => x.row)).toEqual([0, 1, 0, 0]);
  });

  it('makes room above the plot for the marker numbers only when there are markers', () => {
    expect(markedPadding(false)).toEqual(DEFAULT_PADDING);
    expect(markedPadding(true).top).toBe(DEFAULT_PADDING.top + MARKER_STRIP - 8);
    expect(markedPadding(true).top).toBeGreaterThan(25); // the second row's baseline (25 px) stays above the plot
  });
});

describe('forecastPanels: nitrite on its own scale', () => {
  const geometry = (basis: 'N' | 'ion', no2Peak: number) => {
    const v = fixtureView({ tanPeak: 1.4, no2Peak });
    const p = forecastPanels(v, basis).find((x) => x.key === 'nitrite')!;
    return { p, g: panelGeometry({ days: v.days, series: p.series, limits: p.limits, size: { width: 340, height: 150 }, minYMax: p.minYMax }) };
  };

  it('shows total ammonia and nitrite first, each in its own panel', () => {
    expect(MAIN_PANELS).toEqual(['ammonia', 'nitrite']);
    const keys = forecastPanels(fixtureView(), 'N').map((p) => p.key);
    expect(keys.slice(0, 2)).toEqual(['ammonia', 'nitrite']);
    expect(forecastPanels(fixtureView(), 'N')[0].series.map((s) => s.key)).toEqual(['tan']);
  });

  it('scales nitrite to its 0.1 mg N/L limit, not to ammonia: the limit line sits in the top half and a 0.03 peak is a visible bump', () => {
    const { p, g: geo } = geometry('N', 0.03);
    expect(p.limits[0].value).toBe(0.1);
    expect(geo.yDomain[1]).toBeLessThanOrEqual(0.2);
    const plotH = geo.plot.bottom - geo.plot.top;
    const limitY = geo.limits[0].y;
    expect(geo.plot.bottom - limitY).toBeGreaterThan(plotH / 2);
    // The peak stands at least a fifth of the plot above the axis.
    expect(0.03 / geo.yDomain[1]).toBeGreaterThan(0.2);
  });

  it('draws the nitrite limit in the keeper basis: 0.33 mg/L as the ion', () => {
    const { p, g: geo } = geometry('ion', 0.03);
    expect(p.unit).toBe('mg/L NO2−');
    expect(p.limits[0].label).toBe('limit 0.33');
    expect(geo.yDomain[1]).toBeGreaterThanOrEqual(0.33 * 1.1);
    expect(geo.yDomain[1]).toBeLessThanOrEqual(0.6);
  });

  it('grows the nitrite scale with a high peak, keeping the limit line on the chart', () => {
    const { g: geo } = geometry('N', 2);
    expect(geo.yDomain[1]).toBeGreaterThanOrEqual(2.2);
    expect(geo.limits[0].y).toBeLessThan(geo.plot.bottom);
  });
});
