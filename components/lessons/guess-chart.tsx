import { useMemo, useRef, useState } from 'react';
import { PanResponder, View, type LayoutChangeEvent } from 'react-native';
import Svg, { Circle, G, Line, Path } from 'react-native-svg';
import { useTheme } from '@/hooks/use-theme';
import { ChartGrid, ChartLimitLines } from '@/components/forecast/chart-frame';
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
  const { colors, space } = useTheme();
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
              <ChartGrid g={g} />
              <ChartLimitLines g={g} />
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
