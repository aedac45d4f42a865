import { forwardRef, type ReactNode } from 'react';
import { Pressable, View } from 'react-native';
import { useTheme } from '@/hooks/use-theme';
import { Card } from '@/components/ui/card';
import { AppText } from '@/components/ui/text';
import type { InteractionState } from '@/components/ui/pressable-link';

export interface TankSectionProps {
  title: string;
  /** One line under the title while folded: what is inside ("8 fish · 1 species"). */
  summary: string;
  open: boolean;
  onToggle(): void;
  /** `testID` on the section; its header button is `${testID}-toggle`. */
  testID: string;
  children: ReactNode;
}

/** A labelled part of the tank page below its first screen, folded to one line until opened. */
export const TankSection = forwardRef<View, TankSectionProps>(function TankSection({ title, summary, open, onToggle, testID, children }, ref) {
  const { colors, space, radii, layout } = useTheme();
  return (
    <View ref={ref}>
      <Card testID={testID} style={{ gap: space.md }}>
        {/* The accordion pattern: a heading holding the button, so the page outline lists the sections. */}
        <View role="heading" aria-level={2}>
          <Pressable
            testID={`${testID}-toggle`}
            accessibilityRole="button"
            accessibilityLabel={`${title}. ${summary}`}
            accessibilityState={{ expanded: open }}
            onPress={onToggle}
            style={(state) => {
              const { focused, hovered } = state as InteractionState;
              return {
                minHeight: layout.minTouchTarget,
                flexDirection: 'row',
                alignItems: 'center',
                gap: space.md,
                margin: -space.sm,
                padding: space.sm,
                borderRadius: radii.md,
                borderWidth: 2,
                borderColor: focused ? colors.focus : 'transparent',
                backgroundColor: hovered ? colors.surfaceRaised : 'transparent',
              };
            }}
          >
            <View style={{ flex: 1, gap: space.xxs }}>
              <AppText variant="title" weight="bold">
                {title}
              </AppText>
              <AppText tone="textMuted">{summary}</AppText>
            </View>
            <AppText weight="bold" tone="link" aria-hidden>
              {open ? 'Hide' : 'Show'}
            </AppText>
          </Pressable>
        </View>
        {open ? children : null}
      </Card>
    </View>
  );
});
