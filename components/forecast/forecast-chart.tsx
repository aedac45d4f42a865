import { memo, useLayoutEffect, useMemo, useState } from 'react';
import { View, type LayoutChangeEvent } from 'react-native';
import Svg, { Circle, G, Line, Path, Text as SvgText } from 'react-native-svg';
import type { ColorToken } from '@/constants/theme';
import { useTheme } from '@/hooks/use-theme';
import { ChartGrid, ChartLimitLines } from '@/components/forecast/chart-frame';
import { eventMarkers, markedPadding, markerLegend, panelGeometry, xDomainFor, type ChartEvent, type EventMarker, type PanelGeometry } from '@/lib/chart-geometry';
import { forecastPanels, MAIN_PANELS, type ChartReading, type ForecastPanel, type PanelKey } from '@/lib/forecast-panels';
import type { ScenarioEvent } from '@/simulation/scenario';
import { describeEvent } from '@/components/plans/event-fields';
import { Button } from '@/components/ui/button';
import { PrintHint } from '@/components/ui/print-hint';
import type { ForecastView } from '@/shared/schemas/plan';
import type { NitrogenBasis } from '@/shared/schemas/preferences';
import { AppText } from '@/components/ui/text';

/** Performance names the bench reads (bench/web.ts): time from render start to commit of the chart. */
export const MARK_CHART_START = 'shoalshift:chart-render-start';
export const MEASURE_CHART = 'shoalshift:chart-redraw';

/** Colour and dash of each series: the dash tells series apart without colour. */
const SERIES_STYLE: Record<string, { color: ColorToken; dash?: string }> = {
  tan: { color: 'primary' },
  no2: { color: 'watchText', dash: '6 3' },
  freeNh3: { color: 'dangerText' },
  no3: { color: 'infoText' },
  ao: { color: 'primary' },
  no: { color: 'watchText', dash: '6 3' },
  load: { color: 'textMuted', dash: '2 3' },
};

const PANEL_HEIGHT = 150;

function EventMarks({ markers, g }: { markers: readonly EventMarker[]; g: PanelGeometry }) {
  const { colors, font } = useTheme();
  const fontFamily = (font.bold as { fontFamily?: string }).fontFamily;
  return (
    <>
      {markers.map((m) => (
        <G key={`event-${m.n}`}>
          <Line x1={m.x} x2={m.x} y1={g.plot.top} y2={g.plot.bottom} stroke={colors.textMuted} strokeWidth={1} strokeDasharray="1 3" />
          <SvgText x={m.x} y={m.row === 0 ? 12 : 25} fontSize={11} fontWeight="bold" fill={colors.text} textAnchor="middle" fontFamily={fontFamily}>
            {String(m.n)}
          </SvgText>
        </G>
      ))}
    </>
  );
}

function Panel({ panel, days, width, events }: { panel: ForecastPanel; days: readonly number[]; width: number; events: readonly ChartEvent[] }) {
  const { colors } = useTheme();
  const { g, markers } = useMemo(() => {
    const padding = markedPadding(events.length > 0);
    const geometry = panelGeometry({ days, series: panel.series, limits: panel.limits, points: panel.points, size: { width, height: PANEL_HEIGHT, padding }, minYMax: panel.minYMax });
    return { g: geometry, markers: eventMarkers(events, geometry) };
  }, [panel, days, width, events]);
  return (
    <PrintHint hint="keep" testID={`chart-panel-${panel.key}`} style={{ gap: 2 }}>
      <AppText variant="caption" weight="bold">
        {`${panel.title} (${panel.unit})`}
      </AppText>
      {panel.series.length > 1 || g.points.length > 0 ? (
        <View style={{ flexDirection: 'row', flexWrap: 'wrap', columnGap: 12 }}>
          {panel.series.map((s) => (
            <View key={s.key} style={{ flexDirection: 'row', alignItems: 'center', gap: 4 }}>
              <Svg width={22} height={8} aria-hidden>
                <Line x1={0} y1={4} x2={22} y2={4} stroke={colors[SERIES_STYLE[s.key]?.color ?? 'text']} strokeWidth={2.5} strokeDasharray={SERIES_STYLE[s.key]?.dash} />
              </Svg>
              <AppText variant="caption" tone="textMuted">
                {s.label}
              </AppText>
            </View>
          ))}
          {g.points.length > 0 ? (
            <View style={{ flexDirection: 'row', alignItems: 'center', gap: 4 }}>
              <Svg width={12} height={12} aria-hidden>
                <Circle cx={6} cy={6} r={4} fill={colors.surface} stroke={colors.text} strokeWidth={2} />
              </Svg>
              <AppText variant="caption" tone="textMuted">
                Your tests
              </AppText>
            </View>
          ) : null}
        </View>
      ) : null}
      <Svg width={g.width} height={g.height} aria-hidden testID={`chart-svg-${panel.key}`}>
        <ChartGrid g={g} />
        {g.bands.map((b) => (
          <Path key={`band-${b.key}`} d={b.d} fill={colors[SERIES_STYLE[b.key]?.color ?? 'text']} fillOpacity={0.15} stroke="none" />
        ))}
        <EventMarks markers={markers} g={g} />
        <ChartLimitLines g={g} />
        {g.lines.map((l) => (
          <Path
            key={`line-${l.key}`}
            testID={`chart-line-${l.key}`}
            d={l.d}
            fill="none"
            stroke={colors[SERIES_STYLE[l.key]?.color ?? 'text']}
            strokeWidth={2.5}
            strokeDasharray={SERIES_STYLE[l.key]?.dash}
          />
        ))}
        {g.points.map((pt, i) => (
          // Hollow rings over the lines: a test reads apart from the forecast without colour.
          <Circle key={`tested-${i}`} testID={`chart-tested-${panel.key}`} cx={pt.x} cy={pt.y} r={4.5} fill={colors.surface} stroke={colors.text} strokeWidth={2} />
        ))}
      </Svg>
    </PrintHint>
  );
}

const NO_EVENTS: readonly ChartEvent[] = [];
const NO_READINGS: readonly ChartReading[] = [];

export interface ForecastChartProps {
  view: ForecastView;
  basis: NitrogenBasis;
  /** Draw the uncertainty band (only when it belongs to the forecast shown). */
  showBand: boolean;
  /** The plan's events, marked on the time axis and listed under the charts. */
  events?: readonly ScenarioEvent[];
  /** The keeper's tests since the plan started, drawn as rings beside the forecast lines. */
  readings?: readonly ChartReading[];
  /** Only these panels, without the "more charts" toggle (the printed plan). */
  only?: readonly PanelKey[];
  testID?: string;
}

/**
 * The forecast as small charts over the same days: total ammonia and nitrite each on its own
 * scale first; free ammonia, nitrate and the filter's capacity behind a toggle.
 */
export const ForecastChart = memo(function ForecastChart({ view, basis, showBand, events, readings = NO_READINGS, only, testID = 'forecast-chart' }: ForecastChartProps) {
  const { space } = useTheme();
  const [width, setWidth] = useState(0);
  const [more, setMore] = useState(false);
  if (typeof performance !== 'undefined') performance.mark?.(MARK_CHART_START);
  const panels = useMemo(() => forecastPanels(view, basis, showBand, readings), [view, basis, showBand, readings]);
  const chartEvents = useMemo(() => (events ? events.map((e) => ({ day: e.day, label: describeEvent(e) })) : NO_EVENTS), [events]);
  // The legend's numbers are the markers' numbers: the same function numbers both.
  const legend = useMemo(() => eventMarkers(chartEvents, { plot: { left: 0, top: 0, right: 1, bottom: 1 }, xDomain: xDomainFor(view.days) }), [chartEvents, view.days]);
  const shown = panels.filter((p) => (only ? only.includes(p.key) : more || MAIN_PANELS.includes(p.key)));

  useLayoutEffect(() => {
    try {
      performance.measure?.(MEASURE_CHART, MARK_CHART_START);
    } catch {
      // No start mark (first render on a platform without marks): nothing to measure.
    }
  }, [panels, width]);

  const onLayout = (e: LayoutChangeEvent) => setWidth(Math.round(e.nativeEvent.layout.width));
  return (
    <View testID={testID} style={{ gap: space.sm }}>
      <View onLayout={onLayout} style={{ gap: space.md }} accessibilityElementsHidden importantForAccessibility="no-hide-descendants">
        {width > 0 ? shown.map((p) => <Panel key={p.key} panel={p} days={view.days} width={width} events={chartEvents} />) : null}
      </View>
      {legend.length > 0 ? (
        <View testID={`${testID}-events`} style={{ gap: space.xxs }} aria-label="Plan events on the charts" role="list">
          {legend.map((m) => (
            <AppText key={m.n} variant="caption" role="listitem">
              <AppText variant="caption" weight="bold">{`${m.n}  `}</AppText>
              {markerLegend(m)}
            </AppText>
          ))}
        </View>
      ) : null}
      <AppText variant="caption" tone="textMuted">
        {`Across: days from the start (day 0). Red dashed lines: the limits.${legend.length > 0 ? ' Dotted lines with a number: the events listed above.' : ''}${readings.length > 0 ? ' Rings: your tests.' : ''}`}
      </AppText>
      {only ? null : (
        <Button
          label={more ? 'Show fewer charts' : 'Show free ammonia, nitrate and filter charts'}
          variant="quiet"
          onPress={() => setMore((m) => !m)}
          accessibilityState={{ expanded: more }}
          testID={`${testID}-more`}
        />
      )}
    </View>
  );
});
