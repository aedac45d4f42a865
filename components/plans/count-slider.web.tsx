import { View } from 'react-native';
import { useTheme } from '@/hooks/use-theme';
import { AppText } from '@/components/ui/text';
import { MARK_INPUT } from '@/hooks/use-forecast';
import type { CountSliderProps } from './count-slider';

/** A whole-number slider (the browser's range input: keyboard, pointer and touch for free). */
export function CountSlider({ label, value, min, max, onChange, testID }: CountSliderProps) {
  const { space, colors } = useTheme();
  return (
    <View style={{ gap: space.xs }}>
      <AppText variant="label" weight="bold">{`${label}: ${value}`}</AppText>
      <input
        type="range"
        data-testid={testID}
        aria-label={label}
        aria-valuetext={`${value}`}
        min={min}
        max={max}
        step={1}
        value={value}
        onChange={(e) => {
          performance.mark(MARK_INPUT);
          onChange(Number(e.currentTarget.value));
        }}
        style={{ width: '100%', minHeight: 44, accentColor: colors.primary }}
      />
      <View style={{ flexDirection: 'row', justifyContent: 'space-between' }}>
        <AppText variant="caption" tone="textMuted">{String(min)}</AppText>
        <AppText variant="caption" tone="textMuted">{String(max)}</AppText>
      </View>
    </View>
  );
}
