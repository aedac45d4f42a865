/**
 * Forecast chart geometry (pure): scales, SVG paths, band polygons, limit lines and ticks for
 * one chart panel. The react-native-svg components only draw what this returns. Scales and
 * path generators are d3-scale's scaleLinear and d3-shape's line/area (Bostock, d3).
 */
import { scaleLinear } from 'd3-scale';
import { area, line } from 'd3-shape';

export interface PanelSize {
  width: number;
  height: number;
  /** Space for axis labels, px. */
  padding?: { top: number; right: number; bottom: number; left: number };
}

export interface PanelSeries {
  key: string;
  values: readonly number[];
  /** 10–90 % band around the series, same length as `values`. */
  band?: { lo: readonly number[]; hi: readonly number[] };
}

export interface PanelLimit {
  key: string;
  value: number;
  label: string;
}

/** Measured values to mark on a panel (the keeper's tests), each at its own plan day. */
export interface PanelPoints {
  key: string;
  at: readonly { day: number; value: number }[];
}

export interface PanelInput {
  days: readonly number[];
  series: readonly PanelSeries[];
  limits?: readonly PanelLimit[];
  points?: readonly PanelPoints[];
  size: PanelSize;
  /** Least y-axis top, so a flat-zero forecast still shows a scale (default 1). */
  minYMax?: number;
}

export interface Tick {
  value: number;
  /** px along the axis */
  at: number;
  label: string;
}

export interface LimitGeometry {
  key: string;
  y: number;
  x1: number;
  x2: number;
  label: string;
  labelX: number;
  labelY: number;
}

export interface PanelGeometry {
  width: number;
  height: number;
  plot: { left: number; top: number; right: number; bottom: number };
  xDomain: [number, number];
  yDomain: [number, number];
  lines: { key: string; d: string }[];
  bands: { key: string; d: string }[];
  limits: LimitGeometry[];
  /** The measured points inside the chart's days, in px. */
  points: { key: string; x: number; y: number; day: number; value: number }[];
  xTicks: Tick[];
  yTicks: Tick[];
}

export const DEFAULT_PADDING = { top: 10, right: 10, bottom: 24, left: 44 } as const;
/** Headroom above the highest value or limit, so a peak never touches the top edge. */
export const HEADROOM = 1.1;

const finite = (x: number) => Number.isFinite(x);

/** Largest finite number of the lists; 0 when there is none. */
export function finiteMax(lists: readonly (readonly number[])[]): number {
  let m = 0;
  for (const xs of lists) for (const x of xs) if (finite(x) && x > m) m = x;
  return m;
}

/** [0, top] for the y axis: the highest value, band edge or limit with headroom, made nice. */
export function yDomainFor(series: readonly PanelSeries[], limits: readonly PanelLimit[] = [], minYMax = 1, points: readonly PanelPoints[] = []): [number, number] {
  const top = finiteMax([...series.map((s) => s.values), ...series.map((s) => s.band?.hi ?? []), limits.map((l) => l.value), ...points.map((p) => p.at.map((a) => a.value))]);
  const wanted = Math.max(top * HEADROOM, minYMax > 0 ? minYMax : 1);
  const nice = scaleLinear().domain([0, wanted]).nice(4).domain();
  return [0, nice[1]];
}

/** [first, last] day; a single day or none gets a one-day span so the scale is never empty. */
export function xDomainFor(days: readonly number[]): [number, number] {
  const xs = days.filter(finite);
  if (xs.length === 0) return [0, 1];
  const lo = Math.min(...xs);
  const hi = Math.max(...xs);
  return hi > lo ? [lo, hi] : [lo, lo + 1];
}

/** A tick label: whole numbers plain, small numbers with enough decimals to tell ticks apart. */
export function tickLabel(value: number, step: number): string {
  if (value === 0) return '0';
  const decimals = step >= 1 ? 0 : Math.min(4, Math.ceil(-Math.log10(step) - 1e-9));
  return value.toFixed(decimals);
}

function ticksOf(domain: [number, number], count: number, toPx: (v: number) => number): Tick[] {
  const values = scaleLinear().domain(domain).ticks(count);
  const step = values.length > 1 ? values[1] - values[0] : Math.abs(domain[1] - domain[0]) || 1;
  return values.map((v) => ({ value: v, at: toPx(v), label: tickLabel(v, step) }));
}

/** The geometry of one panel; empty or non-finite input gives empty paths, never NaN. */
export function panelGeometry(input: PanelInput): PanelGeometry {
  const pad = input.size.padding ?? DEFAULT_PADDING;
  const width = Math.max(0, input.size.width);
  const height = Math.max(0, input.size.height);
  const plot = { left: pad.left, top: pad.top, right: Math.max(pad.left, width - pad.right), bottom: Math.max(pad.top, height - pad.bottom) };
  const xDomain = xDomainFor(input.days);
  const yDomain = yDomainFor(input.series, input.limits, input.minYMax, input.points);
  const x = scaleLinear().domain(xDomain).range([plot.left, plot.right]);
  const y = scaleLinear().domain(yDomain).range([plot.bottom, plot.top]).clamp(true);
  const days = input.days;
  const ok = (v: number | undefined, i: number): v is number => v !== undefined && finite(v) && finite(days[i]);

  const lines = input.series.map((s) => {
    const gen = line<number>()
      .defined((v, i) => ok(v, i))
      .x((_, i) => x(days[i]))
      .y((v) => y(v));
    return { key: s.key, d: gen(s.values.slice(0, days.length)) ?? '' };
  });
  const bands = input.series
    .filter((s) => s.band)
    .map((s) => {
      const lo = s.band!.lo;
      const hi = s.band!.hi;
      const idx = days.map((_, i) => i);
      const gen = area<number>()
        .defined((i) => ok(lo[i], i) && ok(hi[i], i))
        .x((i) => x(days[i]))
        .y0((i) => y(lo[i]))
        .y1((i) => y(hi[i]));
      return { key: s.key, d: gen(idx) ?? '' };
    });
  const limits = (input.limits ?? [])
    .filter((l) => finite(l.value) && l.value > 0)
    .map((l) => {
      const ly = y(l.value);
      // The label sits just above the line, inside the plot; below it when the line is at the top.
      const labelY = ly - 4 < plot.top + 10 ? ly + 12 : ly - 4;
      return { key: l.key, y: ly, x1: plot.left, x2: plot.right, label: l.label, labelX: plot.right - 4, labelY };
    });
  const points = (input.points ?? []).flatMap((p) =>
    p.at.filter((a) => finite(a.day) && finite(a.value) && a.day >= xDomain[0] && a.day <= xDomain[1]).map((a) => ({ key: p.key, x: x(a.day), y: y(a.value), day: a.day, value: a.value })),
  );
  return {
    width,
    height,
    plot,
    xDomain,
    yDomain,
    lines,
    bands,
    limits,
    points,
    xTicks: ticksOf(xDomain, Math.max(2, Math.floor((plot.right - plot.left) / 60)), x),
    yTicks: ticksOf(yDomain, 4, y),
  };
}

/** Index of the sample nearest to pixel x (reading values under a finger or pointer); null without days. */
export function indexAtX(px: number, g: Pick<PanelGeometry, 'plot' | 'xDomain'>, days: readonly number[]): number | null {
  if (days.length === 0) return null;
  const x = scaleLinear().domain(g.xDomain).range([g.plot.left, g.plot.right]);
  const target = x.invert(px);
  let best = 0;
  for (let i = 1; i < days.length; i++) if (Math.abs(days[i] - target) < Math.abs(days[best] - target)) best = i;
  return best;
}

// ---- event markers ----------------------------------------------------------------------

/** A plan event to mark on the time axis: its day and its sentence ("Add 12 Neon tetra"). */
export interface ChartEvent {
  day: number;
  label: string;
}

/** One numbered marker: every event of one whole day, at that day's x. */
export interface EventMarker {
  /** 1, 2, 3… in day order; the legend repeats the number. */
  n: number;
  day: number;
  x: number;
  /** 0 or 1: markers closer than `minGapPx` alternate rows so their numbers never overlap. */
  row: 0 | 1;
  labels: string[];
}

/** Room above the plot for two rows of marker numbers, px. */
export const MARKER_STRIP = 30;

/** The padding of a panel that carries event markers: the default with the marker strip on top. */
export function markedPadding(hasMarkers: boolean): NonNullable<PanelSize['padding']> {
  return hasMarkers ? { ...DEFAULT_PADDING, top: DEFAULT_PADDING.top + MARKER_STRIP - 8 } : DEFAULT_PADDING;
}

/**
 * Markers for the events inside the chart's days (events past either end are left out):
 * one per whole day, numbered in day order, with the x of that day.
 */
export function eventMarkers(events: readonly ChartEvent[], g: Pick<PanelGeometry, 'plot' | 'xDomain'>, minGapPx = 16): EventMarker[] {
  const byDay = new Map<number, string[]>();
  for (const e of events) {
    if (!finite(e.day)) continue;
    const d = Math.round(e.day);
    if (d < g.xDomain[0] || d > g.xDomain[1]) continue;
    byDay.set(d, [...(byDay.get(d) ?? []), e.label]);
  }
  const x = scaleLinear().domain(g.xDomain).range([g.plot.left, g.plot.right]);
  const out: EventMarker[] = [];
  const lastX: [number, number] = [-Infinity, -Infinity];
  for (const [day, labels] of [...byDay.entries()].sort((a, b) => a[0] - b[0])) {
    const px = x(day);
    // The top row when there is room; else the second; else whichever row leaves more room.
    const row: 0 | 1 = px - lastX[0] >= minGapPx ? 0 : px - lastX[1] >= minGapPx ? 1 : lastX[0] <= lastX[1] ? 0 : 1;
    lastX[row] = px;
    out.push({ n: out.length + 1, day, x: px, row, labels });
  }
  return out;
}

/** A marker's legend line: "day 7: Add 12 Neon tetra; Change 25 % of the water". */
export function markerLegend(m: Pick<EventMarker, 'day' | 'labels'>): string {
  return `day ${m.day}: ${m.labels.join('; ')}`;
}
