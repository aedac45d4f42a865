import { View } from 'react-native';
import { statusColorTokens, type StatusTone } from '@/constants/theme';
import { useTheme } from '@/hooks/use-theme';
import { forecastVerdict, spareCapacitySentence, type ForecastLevel } from '@/shared/forecast-view';
import { acuteAmmoniaLine, forecastLimitRows, overText } from '@/lib/forecast-limits';
import type { ForecastView } from '@/shared/schemas/plan';
import type { NitrogenBasis } from '@/shared/schemas/preferences';
import { AppText } from '@/components/ui/text';

const LEVEL: Record<ForecastLevel, { tone: StatusTone; label: string }> = {
  ok: { tone: 'ok', label: 'Under the limits' },
  watch: { tone: 'watch', label: 'Close to a limit' },
  over: { tone: 'danger', label: 'Goes over a limit' },
};

/**
 * The forecast's verdict, shown above its chart: one sentence (shared/forecast-view.ts
 * `forecastVerdict`), then each value's peak and its days over the limit, with the limit's
 * value and basis. It is also the chart's numbers as text for screen readers.
 */
export function ForecastVerdict({
  view,
  basis,
  compact = false,
  testID = 'forecast-summary',
}: {
  view: ForecastView;
  basis: NitrogenBasis;
  /** The sentence only (views that give their own figures beside it, like a lesson). */
  compact?: boolean;
  testID?: string;
}) {
  const { space, colors, radii } = useTheme();
  const verdict = forecastVerdict(view);
  const level = LEVEL[verdict.level];
  const tint = statusColorTokens[level.tone];
  const acute = acuteAmmoniaLine(view, basis);
  const spare = spareCapacitySentence(view);
  return (
    <View testID={testID} style={{ gap: space.sm }} accessibilityRole="summary">
      <View
        testID={`${testID}-verdict`}
        accessibilityLiveRegion="polite"
        style={{ backgroundColor: colors[tint.surface], borderLeftWidth: 4, borderLeftColor: colors[tint.text], borderRadius: radii.md, padding: space.md, gap: space.xxs }}
      >
        <AppText variant="caption" weight="bold" tone={tint.text} testID={`${testID}-level`}>
          {level.label}
        </AppText>
        <AppText weight="bold" testID={`${testID}-sentence`}>
          {verdict.sentence}
        </AppText>
        {spare && !compact ? <AppText testID={`${testID}-spare`}>{spare}</AppText> : null}
      </View>
      {compact ? null : (
        // Two columns where the card is wide enough, one on a phone.
        <View style={{ flexDirection: 'row', flexWrap: 'wrap', columnGap: space.md, rowGap: space.sm }}>
          {forecastLimitRows(view, basis).map((r) => (
        <View key={r.key} testID={`forecast-row-${r.key}`} style={{ flexBasis: 210, flexGrow: 1, minWidth: 0, borderTopWidth: 1, borderTopColor: colors.border, paddingTop: space.xs, gap: space.xxs }}>
          <AppText weight="bold">{r.name}</AppText>
          <AppText testID={`forecast-peak-${r.key}`}>{`Peak ${r.peak} on day ${Math.round(r.peakDay)}`}</AppText>
          {r.limit ? (
            <>
              <AppText tone={r.limit.over.days > 0 ? 'dangerText' : 'text'} testID={`forecast-over-${r.key}`}>
                {overText(r.limit)}
              </AppText>
              <AppText variant="caption" tone="textMuted" testID={`forecast-basis-${r.key}`}>{`Limit: ${r.limit.basis}`}</AppText>
            </>
          ) : (
            <AppText variant="caption" tone="textMuted">No limit is set for nitrate here; regular water changes keep it down.</AppText>
          )}
        </View>
          ))}
        </View>
      )}
      {acute && !compact ? (
        <AppText tone="dangerText" testID="forecast-over-tanAcute">
          {acute}
        </AppText>
      ) : null}
    </View>
  );
}
