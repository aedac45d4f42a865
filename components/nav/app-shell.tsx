import type { ReactNode } from 'react';
import { View } from 'react-native';
import { usePathname } from 'expo-router';
import { SafeAreaView } from 'react-native-safe-area-context';
import { useTheme } from '@/hooks/use-theme';
import { useLayoutSize } from '@/hooks/use-breakpoint';
import { BrandMark } from '@/components/ui/brand-mark';
import { NavLink } from '@/components/nav/nav-link';
import { activeNavKey, navItems } from '@/components/nav/nav-items';

/**
 * The signed-in frame: a bottom bar on phones, a side rail from the tablet breakpoint up.
 * The choice follows window width only; touch and mouse work the same in both.
 */
export function AppShell({ children }: { children: ReactNode }) {
  const size = useLayoutSize();
  const { colors, space, layout } = useTheme();
  const active = activeNavKey(usePathname());

  const links = (linkLayout: 'stacked' | 'inline') =>
    navItems.map((item) => (
      <NavLink
        key={item.key}
        navKey={item.key}
        label={item.label}
        a11y={item.a11y}
        href={item.href}
        active={active === item.key}
        layout={linkLayout}
      />
    ));

  if (size === 'phone') {
    return (
      <View style={{ flex: 1 }}>
        <View style={{ flex: 1 }}>{children}</View>
        <SafeAreaView
          edges={['bottom', 'left', 'right']}
          style={{ backgroundColor: colors.navBackground, borderTopWidth: 1, borderTopColor: colors.border }}
        >
          <View
            testID="nav-bottom-bar"
            {...({ role: 'navigation', 'aria-label': 'Main' } as object)}
            style={{ flexDirection: 'row', gap: space.sm, paddingHorizontal: space.sm, paddingVertical: space.xs }}
          >
            {links('stacked')}
          </View>
        </SafeAreaView>
      </View>
    );
  }

  const wide = size === 'wide';
  return (
    <View style={{ flex: 1, flexDirection: 'row' }}>
      <SafeAreaView
        edges={['top', 'bottom', 'left']}
        style={{
          width: wide ? layout.sideRailWidth : 104,
          backgroundColor: colors.navBackground,
          borderRightWidth: 1,
          borderRightColor: colors.border,
        }}
      >
        <View
          testID="nav-side-rail"
          {...({ role: 'navigation', 'aria-label': 'Main' } as object)}
          style={{ padding: space.md, gap: space.sm }}
        >
          <View style={{ paddingVertical: space.md, alignItems: wide ? 'flex-start' : 'center' }}>
            <BrandMark showName={wide} />
          </View>
          {links(wide ? 'inline' : 'stacked')}
        </View>
      </SafeAreaView>
      <View style={{ flex: 1 }}>{children}</View>
    </View>
  );
}
