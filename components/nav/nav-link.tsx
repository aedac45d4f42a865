import { View } from 'react-native';
import type { Href } from 'expo-router';
import { PressableLink } from '@/components/ui/pressable-link';
import { useTheme } from '@/hooks/use-theme';
import { AppText } from '@/components/ui/text';
import { NavIcon } from '@/components/nav/nav-icons';
import type { NavKey } from '@/components/nav/nav-items';

export interface NavLinkProps {
  navKey: NavKey;
  label: string;
  a11y: string;
  href: Href;
  active: boolean;
  /** `stacked` puts the label under the icon (bottom bar, narrow rail); `inline` beside it. */
  layout: 'stacked' | 'inline';
}

/** One place in the bottom bar or side rail: icon plus a always-visible label. */
export function NavLink({ navKey, label, a11y, href, active, layout }: NavLinkProps) {
  const { colors, radii, space, layout: dims } = useTheme();
  const color = active ? colors.navActive : colors.navInactive;
  return (
    <PressableLink
      href={href}
      testID={`nav-${navKey}`}
      accessibilityRole="link"
      accessibilityLabel={a11y}
      accessibilityState={{ selected: active }}
      {...({ 'aria-current': active ? 'page' : undefined } as object)}
      style={({ pressed, hovered, focused }) => ({
        flex: layout === 'stacked' ? 1 : undefined,
        minHeight: dims.minTouchTarget + 12,
        borderRadius: radii.md,
        borderWidth: 2,
        borderColor: focused ? colors.focus : 'transparent',
        backgroundColor: active ? colors.navActiveSurface : pressed || hovered ? colors.surfaceRaised : 'transparent',
        justifyContent: 'center',
        paddingHorizontal: space.md,
        paddingVertical: space.xs,
      })}
    >
      <View
        style={{
          flexDirection: layout === 'stacked' ? 'column' : 'row',
          alignItems: 'center',
          gap: layout === 'stacked' ? space.xxs : space.md,
        }}
      >
        <NavIcon name={navKey} color={color} />
        <AppText variant={layout === 'stacked' ? 'caption' : 'label'} weight="bold" style={{ color }}>
          {label}
        </AppText>
      </View>
    </PressableLink>
  );
}
