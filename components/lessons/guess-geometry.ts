/**
 * Geometry of the "guess the nitrite peak" chart (pure): the shared panel geometry
 * (lib/chart-geometry) plus the pixel ↔ (day, mg N/L) mapping the draggable marker needs.
 */
import { panelGeometry, type PanelGeometry } from '@/lib/chart-geometry';
import type { PeakPoint } from './guess-score';

/**
 * Before the reveal the y axis is fixed (it must not hint at the answer): 0–1 mg N/L covers the
 * starter lessons' peaks and sits well above the 0.1 mg N/L nitrite limit (simulation/limits.ts).
 */
export const GUESS_Y_MAX = 1;
export const GUESS_HEIGHT = 220;

export interface GuessChartInput {
  horizonDays: number;
  width: number;
  limitMgN: number;
  /** The forecast nitrite series, once revealed. */
  revealed?: { days: readonly number[]; no2MgN: readonly number[] };
}

export function guessGeometry({ horizonDays, width, limitMgN, revealed }: GuessChartInput): PanelGeometry {
  return panelGeometry({
    days: revealed ? revealed.days : [0, horizonDays],
    series: revealed ? [{ key: 'no2', values: revealed.no2MgN }] : [],
    limits: [{ key: 'no2-limit', value: limitMgN, label: `limit ${limitMgN}` }],
    size: { width, height: GUESS_HEIGHT },
    minYMax: GUESS_Y_MAX,
  });
}

const clamp = (v: number, lo: number, hi: number) => Math.min(hi, Math.max(lo, v));

/** Pixel position of a (day, value) point. */
export function toPixels(p: PeakPoint, g: Pick<PanelGeometry, 'plot' | 'xDomain' | 'yDomain'>): { x: number; y: number } {
  const fx = (p.day - g.xDomain[0]) / (g.xDomain[1] - g.xDomain[0]);
  const fy = clamp(p.value / g.yDomain[1], 0, 1);
  return { x: g.plot.left + fx * (g.plot.right - g.plot.left), y: g.plot.bottom - fy * (g.plot.bottom - g.plot.top) };
}

/** The (whole day, value to 0.01 mg N/L) under a pixel, kept inside the plot. */
export function fromPixels(x: number, y: number, g: Pick<PanelGeometry, 'plot' | 'xDomain' | 'yDomain'>): PeakPoint {
  const fx = clamp((x - g.plot.left) / Math.max(1, g.plot.right - g.plot.left), 0, 1);
  const fy = clamp((g.plot.bottom - y) / Math.max(1, g.plot.bottom - g.plot.top), 0, 1);
  return {
    day: Math.round(g.xDomain[0] + fx * (g.xDomain[1] - g.xDomain[0])),
    value: Math.round(fy * g.yDomain[1] * 100) / 100,
  };
}
