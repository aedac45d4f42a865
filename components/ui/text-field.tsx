import { useId, useState, type Ref } from 'react';
import { StyleSheet, TextInput, View, type TextInputProps } from 'react-native';
import { useTheme } from '@/hooks/use-theme';
import { AppText } from '@/components/ui/text';

export interface TextFieldProps extends Omit<TextInputProps, 'style'> {
  label: string;
  /** Shown under the field in the danger colour, prefixed by a word so colour is not the only cue. */
  error?: string;
  /** Short help shown under the label, e.g. password rules. */
  hint?: string;
  testID: string;
  ref?: Ref<TextInput>;
}

/** A labelled text input with its error message directly below it. */
export function TextField({ label, error, hint, testID, ref, onFocus, onBlur, ...rest }: TextFieldProps) {
  const { colors, radii, space, type, font, layout } = useTheme();
  const [focused, setFocused] = useState(false);
  const id = useId();
  const hintId = `${id}-hint`;
  const errorId = `${id}-error`;
  const describedBy = [hint ? hintId : null, error ? errorId : null].filter(Boolean).join(' ');
  // Web-only ARIA wiring; react-native-web passes these through, native ignores them.
  const aria = {
    'aria-invalid': error ? true : undefined,
    'aria-describedby': describedBy || undefined,
  } as object;

  return (
    <View style={{ gap: space.xs }}>
      <AppText variant="label" weight="bold" nativeID={`${id}-label`}>
        {label}
      </AppText>
      {hint ? (
        <AppText variant="caption" tone="textMuted" nativeID={hintId}>
          {hint}
        </AppText>
      ) : null}
      <TextInput
        ref={ref}
        testID={testID}
        accessibilityLabel={label}
        placeholderTextColor={colors.textMuted}
        onFocus={(e) => {
          setFocused(true);
          onFocus?.(e);
        }}
        onBlur={(e) => {
          setFocused(false);
          onBlur?.(e);
        }}
        style={[
          styles.input,
          type.body,
          font.regular,
          {
            minHeight: layout.minTouchTarget + 4,
            borderRadius: radii.md,
            paddingHorizontal: space.md,
            color: colors.text,
            backgroundColor: colors.surface,
            borderColor: error ? colors.dangerText : focused ? colors.focus : colors.fieldBorder,
            borderWidth: focused || error ? 2 : 1,
            // Keep the text from shifting when the border thickens.
            margin: focused || error ? 0 : 1,
          },
        ]}
        {...aria}
        {...rest}
      />
      {error ? (
        <AppText
          variant="caption"
          weight="bold"
          tone="dangerText"
          nativeID={errorId}
          testID={`${testID}-error`}
          accessibilityLiveRegion="polite"
          aria-live="polite"
        >
          {`Error: ${error}`}
        </AppText>
      ) : null}
    </View>
  );
}

const styles = StyleSheet.create({
  // Web draws its own focus outline on inputs; the border above already shows focus.
  input: { outlineStyle: 'none' } as object,
});
