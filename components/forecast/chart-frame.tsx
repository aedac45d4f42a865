import { G, Line, Text as SvgText } from 'react-native-svg';
import { useTheme } from '@/hooks/use-theme';
import type { PanelGeometry } from '@/lib/chart-geometry';

/** The grid and axis labels of a chart panel (inside an <Svg>); geometry from lib/chart-geometry. */
export function ChartGrid({ g }: { g: PanelGeometry }) {
  const { colors, font } = useTheme();
  // react-native-svg's <Text> ignores the app font unless given it.
  const fontFamily = (font.regular as { fontFamily?: string }).fontFamily;
  return (
    <>
      {g.yTicks.map((t) => (
        <G key={`y${t.value}`}>
          <Line x1={g.plot.left} x2={g.plot.right} y1={t.at} y2={t.at} stroke={colors.border} strokeWidth={1} />
          <SvgText x={g.plot.left - 4} y={t.at + 4} fontSize={11} fill={colors.textMuted} textAnchor="end" fontFamily={fontFamily}>
            {t.label}
          </SvgText>
        </G>
      ))}
      {g.xTicks.map((t) => (
        <SvgText key={`x${t.value}`} x={t.at} y={g.plot.bottom + 16} fontSize={11} fill={colors.textMuted} textAnchor="middle" fontFamily={fontFamily}>
          {t.label}
        </SvgText>
      ))}
    </>
  );
}

/** A panel's limit lines, dashed and labelled (inside an <Svg>). */
export function ChartLimitLines({ g }: { g: PanelGeometry }) {
  const { colors, font } = useTheme();
  const fontFamily = (font.regular as { fontFamily?: string }).fontFamily;
  return (
    <>
      {g.limits.map((l) => (
        <G key={`limit-${l.key}`}>
          <Line x1={l.x1} x2={l.x2} y1={l.y} y2={l.y} stroke={colors.dangerText} strokeWidth={1.5} strokeDasharray="4 4" />
          <SvgText x={l.labelX} y={l.labelY} fontSize={11} fill={colors.dangerText} textAnchor="end" fontFamily={fontFamily}>
            {l.label}
          </SvgText>
        </G>
      ))}
    </>
  );
}
