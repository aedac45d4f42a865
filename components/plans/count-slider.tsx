import { View } from 'react-native';
import { useTheme } from '@/hooks/use-theme';
import { AppText } from '@/components/ui/text';
import { Button } from '@/components/ui/button';

export interface CountSliderProps {
  label: string;
  value: number;
  min: number;
  max: number;
  onChange(value: number): void;
  testID: string;
}

/** A whole-number chooser: on phones, step buttons large enough to tap (the web file draws a slider). */
export function CountSlider({ label, value, min, max, onChange, testID }: CountSliderProps) {
  const { space } = useTheme();
  const set = (v: number) => onChange(Math.min(max, Math.max(min, v)));
  return (
    <View testID={testID} style={{ gap: space.xs }}>
      <AppText variant="label" weight="bold">{`${label}: ${value}`}</AppText>
      <View style={{ flexDirection: 'row', gap: space.sm }}>
        <Button label="−5" variant="secondary" onPress={() => set(value - 5)} accessibilityLabel={`${label}: 5 fewer`} />
        <Button label="−1" variant="secondary" onPress={() => set(value - 1)} accessibilityLabel={`${label}: 1 fewer`} />
        <Button label="+1" variant="secondary" onPress={() => set(value + 1)} accessibilityLabel={`${label}: 1 more`} />
        <Button label="+5" variant="secondary" onPress={() => set(value + 5)} accessibilityLabel={`${label}: 5 more`} />
      </View>
    </View>
  );
}
