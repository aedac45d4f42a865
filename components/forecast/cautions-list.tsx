import { View } from 'react-native';
import { useTheme } from '@/hooks/use-theme';
import { AppText } from '@/components/ui/text';
import { Banner } from '@/components/ui/banner';

/** Cautions every forecast and advice screen shows (product brief point 10). */
export const SCREEN_CAUTIONS: readonly string[] = [
  'This forecast is an estimate from a model; your water tests decide.',
  'If total ammonia or nitrite reads high: change 25–50 % of the water with treated, temperature-matched water, feed less, and test again the next day.',
  'Rehoming fish never means releasing them into the wild: pass them to another keeper, a club or a shop, and follow your local rules.',
  'For questions about fish health, ask a qualified aquatic veterinarian.',
];

/** The cautions as a quiet banner; `extra` adds the ones a response carried, without repeats. */
export function CautionsList({ extra = [], testID = 'cautions' }: { extra?: readonly string[]; testID?: string }) {
  const { space } = useTheme();
  const all = [...new Set([...SCREEN_CAUTIONS, ...extra])];
  return (
    <Banner tone="info" title="Before you act" testID={testID}>
      <View style={{ gap: space.xs }}>
        {all.map((c) => (
          <AppText key={c} variant="caption">{`• ${c}`}</AppText>
        ))}
      </View>
    </Banner>
  );
}
