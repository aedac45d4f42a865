import { View } from 'react-native';
import type { NitrogenBasis } from '@/shared/schemas/preferences';
import type { ReadingBesideForecast } from '@/lib/plan-progress';
import { formatNitrogen, nitrogenUnit } from '@/lib/units-format';
import { NITROGEN_FIGURES } from '@/components/tanks/tank-labels';
import { useTheme } from '@/hooks/use-theme';
import { AppText, Heading } from '@/components/ui/text';

const shown = NITROGEN_FIGURES.filter((f) => f.key !== 'no3MgN');

/**
 * Each test of the running (or finished) plan beside what the forecast expected at that
 * moment, in words: the chart draws the same tests as rings, this list is what a screen
 * reader and a printout get.
 */
export function ReadingsBesideForecast({ rows, basis, total, finished }: { rows: readonly ReadingBesideForecast[]; basis: NitrogenBasis; total: number; finished: boolean }) {
  const { space, colors, radii } = useTheme();
  return (
    <View testID="plan-readings" style={{ gap: space.sm }}>
      <Heading level={3}>{finished ? 'Your tests against the forecast' : 'Your tests so far, beside the forecast'}</Heading>
      {rows.length === 0 ? (
        <AppText tone="textMuted" testID="plan-readings-none">
          {finished ? 'No test was logged while this plan ran.' : 'No test logged since day 0 yet. Log one on each test day: it appears here and on the chart.'}
        </AppText>
      ) : null}
      <View role="list" style={{ gap: space.xs }}>
        {rows.map((r) => (
          <View
            key={r.id}
            role="listitem"
            testID={`plan-reading-${r.id}`}
            style={{ borderWidth: 1, borderColor: colors.border, borderRadius: radii.md, padding: space.sm, gap: space.xxs }}
          >
            <AppText weight="bold">{`Day ${Math.floor(r.day)} · ${new Date(r.takenAt).toLocaleString(undefined, { day: 'numeric', month: 'short', hour: '2-digit', minute: '2-digit' })}`}</AppText>
            {shown.map(({ key, short }) => {
              const pair = r[key];
              if (pair.measured === null) return null;
              const unit = nitrogenUnit(key, basis);
              const forecast = pair.forecast === null ? 'outside the forecast' : `forecast ${formatNitrogen(pair.forecast, key, basis)}`;
              return <AppText key={key}>{`${short}: tested ${formatNitrogen(pair.measured, key, basis)} ${unit} (${forecast})`}</AppText>;
            })}
          </View>
        ))}
      </View>
      {total > rows.length ? <AppText tone="textMuted">{`Showing the first ${rows.length} of ${total} tests.`}</AppText> : null}
      {rows.length > 0 && !finished ? (
        <AppText variant="caption" tone="textMuted">
          Tests well above the forecast mean the filter clears less than the forecast assumed: “Fit to my tests” under the advice adjusts the forecast to this tank.
        </AppText>
      ) : null}
    </View>
  );
}
