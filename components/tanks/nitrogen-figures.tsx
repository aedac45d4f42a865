import { View } from 'react-native';
import { useTheme } from '@/hooks/use-theme';
import { formatMgPerL } from '@/lib/format';
import { AppText } from '@/components/ui/text';
import { NITROGEN_FIGURES, NITROGEN_UNIT } from '@/components/tanks/tank-labels';

type Values = { tanMgN: number | null; no2MgN: number | null; no3MgN: number | null };

/** Total ammonia, nitrite and nitrate side by side in large figures, with the unit stated once. */
export function NitrogenFigures({ values, testID }: { values: Values; testID?: string }) {
  const { colors, radii, space } = useTheme();
  return (
    <View testID={testID} style={{ gap: space.xs }}>
      <View style={{ flexDirection: 'row', gap: space.sm }}>
        {NITROGEN_FIGURES.map(({ key, label }) => {
          const value = values[key];
          return (
            <View
              key={key}
              accessible
              accessibilityLabel={`${label}: ${value === null ? 'not tested' : `${formatMgPerL(value)} ${NITROGEN_UNIT}`}`}
              // Values sit at the bottom so they line up when a label wraps to two lines.
              style={{ flex: 1, justifyContent: 'space-between', backgroundColor: colors.surfaceRaised, borderRadius: radii.md, padding: space.sm, gap: space.xxs }}
            >
              <AppText variant="caption" tone="textMuted" numberOfLines={2}>
                {label}
              </AppText>
              <AppText variant="figure" weight="bold">
                {formatMgPerL(value)}
              </AppText>
            </View>
          );
        })}
      </View>
      <AppText variant="caption" tone="textMuted">
        {`All in ${NITROGEN_UNIT}. A dash means not tested.`}
      </AppText>
    </View>
  );
}
