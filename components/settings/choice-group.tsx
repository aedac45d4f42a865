import { Pressable, View } from 'react-native';
import { useTheme } from '@/hooks/use-theme';
import { AppText } from '@/components/ui/text';

export interface Choice<V extends string> {
  value: V;
  label: string;
  /** Read by screen readers when the short label needs more words ("US gallons"). */
  a11y?: string;
}

type InteractionState = { pressed: boolean; hovered?: boolean; focused?: boolean };

/**
 * A labelled row of radio buttons (units, basis, filter kind). The chosen one is filled and
 * carries a check mark, so the choice never rests on colour alone. Each target is ≥ 44 px.
 */
export function ChoiceGroup<V extends string>({
  label,
  hint,
  choices,
  value,
  onChange,
  testID,
  disabled = false,
}: {
  label: string;
  hint?: string;
  choices: readonly Choice<V>[];
  value: V;
  onChange: (value: V) => void;
  testID: string;
  disabled?: boolean;
}) {
  const { colors, radii, space, layout } = useTheme();
  return (
    <View style={{ gap: space.xs }} testID={testID}>
      <AppText variant="label" weight="bold">
        {label}
      </AppText>
      {hint ? (
        <AppText variant="caption" tone="textMuted">
          {hint}
        </AppText>
      ) : null}
      <View accessibilityRole="radiogroup" accessibilityLabel={label} style={{ flexDirection: 'row', flexWrap: 'wrap', gap: space.sm }}>
        {choices.map((c) => {
          const selected = c.value === value;
          return (
            <Pressable
              key={c.value}
              testID={`${testID}-${c.value}`}
              accessibilityRole="radio"
              accessibilityLabel={c.a11y ?? c.label}
              accessibilityState={{ checked: selected, disabled }}
              aria-checked={selected}
              disabled={disabled}
              onPress={() => onChange(c.value)}
              style={(state) => {
                const { pressed, hovered, focused } = state as InteractionState;
                return {
                  minHeight: layout.minTouchTarget,
                  minWidth: layout.minTouchTarget,
                  paddingHorizontal: space.md,
                  borderRadius: radii.md,
                  justifyContent: 'center',
                  alignItems: 'center',
                  borderWidth: focused ? 2 : 1,
                  margin: focused ? 0 : 1,
                  borderColor: focused ? colors.focus : selected ? colors.primary : colors.fieldBorder,
                  backgroundColor: selected ? colors.primary : pressed || hovered ? colors.surfaceRaised : colors.surface,
                };
              }}
            >
              <AppText weight={selected ? 'bold' : 'regular'} tone={selected ? 'onPrimary' : 'text'}>
                {selected ? `✓ ${c.label}` : c.label}
              </AppText>
            </Pressable>
          );
        })}
      </View>
    </View>
  );
}
