import type { Href } from 'expo-router';
import { useTheme } from '@/hooks/use-theme';
import { AppText } from '@/components/ui/text';
import { PressableLink } from '@/components/ui/pressable-link';

/** A link (it opens another page) that looks like the primary button, at least 44 px tall. */
export function ButtonLink({ href, label, accessibilityLabel, testID }: { href: Href; label: string; accessibilityLabel?: string; testID?: string }) {
  const { colors, radii, space, layout } = useTheme();
  return (
    <PressableLink
      href={href}
      testID={testID}
      accessibilityRole="link"
      accessibilityLabel={accessibilityLabel ?? label}
      style={({ pressed, focused }) => ({
        alignSelf: 'flex-start',
        minHeight: layout.minTouchTarget,
        justifyContent: 'center',
        paddingHorizontal: space.xl,
        borderRadius: radii.md,
        borderWidth: 2,
        borderColor: focused ? colors.focus : 'transparent',
        backgroundColor: pressed ? colors.primaryPressed : colors.primary,
      })}
    >
      <AppText weight="bold" tone="onPrimary">
        {label}
      </AppText>
    </PressableLink>
  );
}
