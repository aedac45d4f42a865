import { useMemo, useRef, useState } from 'react';
import { PanResponder, View, type LayoutChangeEvent } from 'react-native';
import Svg, { Circle, G, Line, Path, Text as SvgText } from 'react-native-svg';
import { useTheme } from '@/hooks/use-theme';
import { AppText } from '@/components/ui/text';
import { Button } from '@/components/ui/button';
import { fromPixels, guessGeometry, toPixels } from './guess-geometry';
import { shortValue, type PeakPoint } from './guess-score';

export interface GuessChartProps {
  horizonDays: number;
  limitMgN: number;
  guess: PeakPoint;
  onGuess?: (p: PeakPoint) => void;
  /** After the reveal: the forecast nitrite and its peak; the marker is then fixed. */
  revealed?: { days: readonly number[]; no2MgN: readonly number[]; peak: PeakPoint };
  testID?: string;
}

/**
 * The nitrite chart of a lesson: drag (or tap) to place the guess of the peak; buttons move it
 * for keyboards and screen readers. After the reveal it shows the forecast and both points.
 */
export function GuessChart({ horizonDays, limitMgN, guess, onGuess, revealed, testID = 'guess-chart' }: GuessChartProps) {
  const { colors, font, space } = useTheme();
  const [width, setWidth] = useState(0);
  const g = useMemo(() => guessGeometry({ horizonDays, width, limitMgN, revealed }), [horizonDays, width, limitMgN, revealed]);
  const geometry = useRef(g);
  geometry.current = g;
  const onGuessRef = useRef(onGuess);
  onGuessRef.current = onGuess;
  const locked = revealed !== undefined || !onGuess;

  const responder = useMemo(
    () =>
      PanResponder.create({
        onStartShouldSetPanResponder: () => true,
        onMoveShouldSetPanResponder: () => true,
        // The drag belongs to the chart, not to the page's scroll view.
        onPanResponderTerminationRequest: () => false,
        onPanResponderGrant: (e) => onGuessRef.current?.(fromPixels(e.nativeEvent.locationX, e.nativeEvent.locationY, geometry.current)),
        onPanResponderMove: (e) => onGuessRef.current?.(fromPixels(e.nativeEvent.locationX, e.nativeEvent.locationY, geometry.current)),
      }),
    [],
  );

  const fontFamily = (font.regular as { fontFamily?: string }).fontFamily;
  const mark = toPixels(guess, g);
  const peak = revealed ? toPixels(revealed.peak, g) : null;
  const nudge = (dDay: number, dValue: number) =>
    onGuess?.({
      day: Math.min(horizonDays, Math.max(0, guess.day + dDay)),
      value: Math.max(0, Math.round((guess.value + dValue) * 100) / 100),
    });

  return (
    <View style={{ gap: space.sm }} testID={testID}>
      <View
        onLayout={(e: LayoutChangeEvent) => setWidth(Math.round(e.nativeEvent.layout.width))}
        // Web: no text selection or page scroll while dragging the marker.
        style={{ height: g.height, width: '100%', cursor: locked ? undefined : 'crosshair', touchAction: 'none', userSelect: 'none' } as object}
        testID={`${testID}-area`}
        accessibilityLabel={`Nitrite chart. Your guess: day ${guess.day}, ${shortValue(guess.value)} milligrams per litre as nitrogen.`}
        {...(locked ? {} : responder.panHandlers)}
      >
        {width > 0 ? (
          <View pointerEvents="none">
            <Svg width={g.width} height={g.height} aria-hidden>
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
              {g.limits.map((l) => (
                <G key={l.key}>
                  <Line x1={l.x1} x2={l.x2} y1={l.y} y2={l.y} stroke={colors.dangerText} strokeWidth={1.5} strokeDasharray="4 4" />
                  <SvgText x={l.labelX} y={l.labelY} fontSize={11} fill={colors.dangerText} textAnchor="end" fontFamily={fontFamily}>
                    {l.label}
                  </SvgText>
                </G>
              ))}
              {g.lines.map((l) => (
                <Path key={l.key} testID="guess-forecast-line" d={l.d} fill="none" stroke={colors.watchText} strokeWidth={2.5} />
              ))}
              {peak ? (
                <G testID="guess-peak">
                  <Line x1={mark.x} y1={mark.y} x2={peak.x} y2={peak.y} stroke={colors.textMuted} strokeWidth={1.5} strokeDasharray="3 3" />
                  <Circle cx={peak.x} cy={peak.y} r={9} fill="none" stroke={colors.watchText} strokeWidth={3} />
                </G>
              ) : null}
              <Circle testID="guess-marker" cx={mark.x} cy={mark.y} r={10} fill={colors.primary} stroke={colors.surface} strokeWidth={3} />
            </Svg>
          </View>
        ) : null}
      </View>
      <AppText variant="caption" tone="textMuted">
        Days from the start →   ↑ nitrite, mg/L as N
      </AppText>
      {!locked ? (
        <View style={{ flexDirection: 'row', flexWrap: 'wrap', gap: space.sm }}>
          <Button variant="secondary" label="◀ Day" accessibilityLabel="Move the guess one day earlier" onPress={() => nudge(-1, 0)} testID="guess-earlier" />
          <Button variant="secondary" label="Day ▶" accessibilityLabel="Move the guess one day later" onPress={() => nudge(1, 0)} testID="guess-later" />
          <Button variant="secondary" label="▼ Lower" accessibilityLabel="Lower the guess by 0.05" onPress={() => nudge(0, -0.05)} testID="guess-lower" />
          <Button variant="secondary" label="▲ Higher" accessibilityLabel="Raise the guess by 0.05" onPress={() => nudge(0, 0.05)} testID="guess-higher" />
        </View>
      ) : null}
    </View>
  );
}
