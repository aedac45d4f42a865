import { View } from 'react-native';
import { statusColorTokens, type StatusTone } from '@/constants/theme';
import { useTheme } from '@/hooks/use-theme';
import { AppText } from '@/components/ui/text';

/** A small tinted label. The word carries the meaning; the tint only repeats it. */
export function StatusPill({ tone, label, testID }: { tone: StatusTone; label: string; testID?: string }) {
  const { colors, radii, space } = useTheme();
  const { text, surface } = statusColorTokens[tone];
  return (
    <View
      testID={testID}
      style={{
        alignSelf: 'flex-start',
        backgroundColor: colors[surface],
        borderRadius: radii.pill,
        paddingHorizontal: space.sm,
        paddingVertical: space.xxs,
      }}
    >
      <AppText variant="caption" weight="bold" tone={text}>
        {label}
      </AppText>
    </View>
  );
}
