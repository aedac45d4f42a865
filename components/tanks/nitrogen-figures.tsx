import { View } from 'react-native';
import { usePreferences } from '@/hooks/use-preferences';
import { useTheme } from '@/hooks/use-theme';
import { basisWords, formatNitrogen, nitrogenUnit } from '@/lib/units-format';
import { AppText } from '@/components/ui/text';
import { NITROGEN_FIGURES } from '@/components/tanks/tank-labels';

type Values = { tanMgN: number | null; no2MgN: number | null; no3MgN: number | null };

/** Total ammonia, nitrite and nitrate side by side in large figures, in the person's basis. */
export function NitrogenFigures({ values, testID }: { values: Values; testID?: string }) {
  const { colors, radii, space } = useTheme();
  const { nitrogenBasis: b } = usePreferences();
  return (
    <View testID={testID} style={{ gap: space.xs }}>
      <View style={{ flexDirection: 'row', gap: space.sm }}>
        {NITROGEN_FIGURES.map(({ key, label }) => {
          const value = values[key];
          return (
            <View
              key={key}
              accessible
              accessibilityLabel={`${label}: ${value === null ? 'not tested' : `${formatNitrogen(value, key, b)} ${nitrogenUnit(key, b)}`}`}
              // Values sit at the bottom so they line up when a label wraps to two lines.
              style={{ flex: 1, justifyContent: 'space-between', backgroundColor: colors.surfaceRaised, borderRadius: radii.md, padding: space.sm, gap: space.xxs }}
            >
              <AppText variant="caption" tone="textMuted" numberOfLines={2}>
                {label}
              </AppText>
              <AppText variant="figure" weight="bold" testID={testID ? `${testID}-${key}` : undefined}>
                {formatNitrogen(value, key, b)}
              </AppText>
            </View>
          );
        })}
      </View>
      <AppText variant="caption" tone="textMuted">
        {`All in mg/L ${basisWords(b)}. A dash means not tested.`}
      </AppText>
    </View>
  );
}
