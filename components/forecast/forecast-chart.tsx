import { memo, useLayoutEffect, useMemo, useState } from 'react';
import { View, type LayoutChangeEvent } from 'react-native';
import Svg, { Line, Path } from 'react-native-svg';
import type { ColorToken } from '@/constants/theme';
import { useTheme } from '@/hooks/use-theme';
import { ChartGrid, ChartLimitLines } from '@/components/forecast/chart-frame';
import { panelGeometry } from '@/lib/chart-geometry';
import { forecastPanels, type ForecastPanel } from '@/lib/forecast-panels';
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

function Panel({ panel, days, width }: { panel: ForecastPanel; days: readonly number[]; width: number }) {
  const { colors } = useTheme();
  const g = useMemo(
    () => panelGeometry({ days, series: panel.series, limits: panel.limits, size: { width, height: PANEL_HEIGHT }, minYMax: panel.minYMax }),
    [panel, days, width],
  );
  return (
    <View testID={`chart-panel-${panel.key}`} style={{ gap: 2 }}>
      <AppText variant="caption" weight="bold">
        {`${panel.title} (${panel.unit})`}
      </AppText>
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
      </View>
      <Svg width={g.width} height={g.height} aria-hidden testID={`chart-svg-${panel.key}`}>
        <ChartGrid g={g} />
        {g.bands.map((b) => (
          <Path key={`band-${b.key}`} d={b.d} fill={colors[SERIES_STYLE[b.key]?.color ?? 'text']} fillOpacity={0.15} stroke="none" />
        ))}
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
      </Svg>
    </View>
  );
}

export interface ForecastChartProps {
  view: ForecastView;
  basis: NitrogenBasis;
  /** Draw the uncertainty band (only when it belongs to the forecast shown). */
  showBand: boolean;
  testID?: string;
}

/** The forecast as four small charts (ammonia and nitrite, free ammonia, nitrate, capacity vs load). */
export const ForecastChart = memo(function ForecastChart({ view, basis, showBand, testID = 'forecast-chart' }: ForecastChartProps) {
  const { space } = useTheme();
  const [width, setWidth] = useState(0);
  if (typeof performance !== 'undefined') performance.mark?.(MARK_CHART_START);
  const panels = useMemo(() => forecastPanels(view, basis, showBand), [view, basis, showBand]);

  useLayoutEffect(() => {
    try {
      performance.measure?.(MEASURE_CHART, MARK_CHART_START);
    } catch {
      // No start mark (first render on a platform without marks): nothing to measure.
    }
  }, [panels, width]);

  const onLayout = (e: LayoutChangeEvent) => setWidth(Math.round(e.nativeEvent.layout.width));
  return (
    <View testID={testID} onLayout={onLayout} style={{ gap: space.md }} accessibilityElementsHidden importantForAccessibility="no-hide-descendants">
      {width > 0 ? panels.map((p) => <Panel key={p.key} panel={p} days={view.days} width={width} />) : null}
      <AppText variant="caption" tone="textMuted">
        Across: days from the start (day 0). Dashed red lines: the limits.
      </AppText>
    </View>
  );
});
