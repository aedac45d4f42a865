import { View } from 'react-native';
import { useTheme } from '@/hooks/use-theme';
import { nitrogenIn, nitrogenUnit } from '@/lib/units-format';
import { plainNumber } from '@/shared/forecast-view';
import type { ForecastView } from '@/shared/schemas/plan';
import type { NitrogenBasis } from '@/shared/schemas/preferences';
import { AppText } from '@/components/ui/text';
import { StatusPill } from '@/components/ui/status-pill';

type Row = { key: string; name: string; peak: string; day: number; over: { days: number; firstDay: number | null } | null; limit: string | null };

/** The chart's numbers as text: each value's peak and day, and days over each limit (read by screen readers). */
export function ForecastSummary({ view, basis, testID = 'forecast-summary' }: { view: ForecastView; basis: NitrogenBasis; testID?: string }) {
  const { space, colors } = useTheme();
  const n = (mgN: number, key: 'tanMgN' | 'no2MgN' | 'no3MgN') => `${plainNumber(nitrogenIn(mgN, key, basis))} ${nitrogenUnit(key, basis)}`;
  const rows: Row[] = [
    { key: 'tan', name: 'Total ammonia', peak: n(view.peaks.tan.value, 'tanMgN'), day: view.peaks.tan.day, over: view.daysOver.tanChronic, limit: n(view.limits.tanChronicMgN, 'tanMgN') },
    {
      key: 'freeNh3',
      name: 'Free ammonia',
      peak: `${plainNumber(view.peaks.freeNh3.value)} mg NH3/L`,
      day: view.peaks.freeNh3.day,
      over: view.daysOver.freeNh3,
      limit: `${plainNumber(view.limits.freeNh3MgNH3)} mg NH3/L`,
    },
    { key: 'no2', name: 'Nitrite', peak: n(view.peaks.no2.value, 'no2MgN'), day: view.peaks.no2.day, over: view.daysOver.no2, limit: n(view.limits.no2MgN, 'no2MgN') },
    { key: 'no3', name: 'Nitrate', peak: n(view.peaks.no3.value, 'no3MgN'), day: view.peaks.no3.day, over: null, limit: null },
  ];
  const anyOver = rows.some((r) => r.over && r.over.days > 0) || view.daysOver.tanAcute.days > 0;
  return (
    <View testID={testID} style={{ gap: space.sm }} accessibilityRole="summary">
      <StatusPill tone={anyOver ? 'danger' : 'ok'} label={anyOver ? 'Goes over a limit' : 'Stays under the limits'} testID="forecast-verdict" />
      {rows.map((r) => (
        <View key={r.key} testID={`forecast-row-${r.key}`} style={{ borderTopWidth: 1, borderTopColor: colors.border, paddingTop: space.xs }}>
          <AppText weight="bold">{r.name}</AppText>
          <AppText testID={`forecast-peak-${r.key}`}>{`Peak ${r.peak} on day ${Math.round(r.day)}`}</AppText>
          {r.over && r.limit ? (
            <AppText tone={r.over.days > 0 ? 'dangerText' : 'textMuted'} testID={`forecast-over-${r.key}`}>
              {r.over.days > 0
                ? `Over the limit (${r.limit}) for ${plainNumber(r.over.days)} days, from day ${Math.round(r.over.firstDay ?? 0)}`
                : `Stays under the limit (${r.limit})`}
            </AppText>
          ) : null}
        </View>
      ))}
      {view.daysOver.tanAcute.days > 0 ? (
        <AppText tone="dangerText" testID="forecast-over-tanAcute">{`Total ammonia is over the short-term limit (${n(view.limits.tanAcuteMgN, 'tanMgN')}) for ${plainNumber(view.daysOver.tanAcute.days)} days.`}</AppText>
      ) : null}
    </View>
  );
}
