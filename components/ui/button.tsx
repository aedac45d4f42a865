import { ActivityIndicator, Pressable, StyleSheet, View, type PressableProps } from 'react-native';
import { useTheme } from '@/hooks/use-theme';
import { AppText } from '@/components/ui/text';

export type ButtonVariant = 'primary' | 'secondary' | 'quiet';

export interface ButtonProps extends Omit<PressableProps, 'children' | 'style'> {
  label: string;
  /** Read by screen readers; defaults to the visible label. */
  accessibilityLabel?: string;
  variant?: ButtonVariant;
  /** Shows a spinner and `busyLabel`, and ignores presses, while work is under way. */
  busy?: boolean;
  busyLabel?: string;
  disabled?: boolean;
  fullWidth?: boolean;
}

// react-native-web adds hovered/focused to the state; React Native's type lists only pressed.
type InteractionState = { pressed: boolean; hovered?: boolean; focused?: boolean };

export function Button({
  label,
  accessibilityLabel,
  variant = 'primary',
  busy = false,
  busyLabel,
  disabled = false,
  fullWidth = false,
  ...rest
}: ButtonProps) {
  const { colors, radii, space, layout } = useTheme();
  const inactive = disabled || busy;
  const fg = variant === 'primary' ? colors.onPrimary : colors.link;

  return (
    <Pressable
      accessibilityRole="button"
      accessibilityLabel={accessibilityLabel ?? label}
      accessibilityState={{ disabled: inactive, busy }}
      disabled={inactive}
      style={(state) => {
        const { pressed, hovered, focused } = state as InteractionState;
        return [
          styles.base,
          {
            minHeight: layout.minTouchTarget,
            minWidth: layout.minTouchTarget,
            borderRadius: radii.md,
            paddingHorizontal: variant === 'quiet' ? space.sm : space.xl,
            alignSelf: fullWidth ? 'stretch' : 'flex-start',
            borderColor: focused ? colors.focus : variant === 'secondary' ? colors.fieldBorder : 'transparent',
          },
          variant === 'primary' && { backgroundColor: pressed ? colors.primaryPressed : colors.primary },
          variant === 'secondary' && { backgroundColor: pressed || hovered ? colors.surfaceRaised : colors.surface },
          variant === 'quiet' && (pressed || hovered) && { backgroundColor: colors.surfaceRaised },
          disabled && !busy && styles.disabled,
        ];
      }}
      {...rest}
    >
      <View style={[styles.row, { gap: space.sm }]}>
        {busy ? <ActivityIndicator size="small" color={fg} accessibilityLabel="Working" /> : null}
        <AppText variant="label" weight="bold" style={{ color: fg }}>
          {busy && busyLabel ? busyLabel : label}
        </AppText>
      </View>
    </Pressable>
  );
}

const styles = StyleSheet.create({
  base: { justifyContent: 'center', alignItems: 'center', borderWidth: 2 },
  row: { flexDirection: 'row', alignItems: 'center' },
  disabled: { opacity: 0.5 },
});
