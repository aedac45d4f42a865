import { View } from 'react-native';
import { useTheme } from '@/hooks/use-theme';
import { Card } from '@/components/ui/card';
import { AppText, Heading } from '@/components/ui/text';

const STEPS = [
  { title: 'Add a tank', body: 'Its volume, temperature, filter and the fish in it.' },
  { title: 'Log a water test', body: 'Total ammonia, nitrite and nitrate, as your kit reads them.' },
  { title: 'Plan a change', body: 'See whether new fish would cause an ammonia or nitrite spike, and how to stage them.' },
] as const;

/** The home screen of a keeper with no tanks: what Shoalshift needs first, and what follows. */
export function NoTanksYet() {
  const { colors, radii, space } = useTheme();
  return (
    <Card testID="home-empty" style={{ gap: space.lg, padding: space.xl }}>
      <Heading level={2}>No tanks yet</Heading>
      <AppText>Everything in Shoalshift starts from a tank. Here is what comes next:</AppText>
      <View style={{ gap: space.md }}>
        {STEPS.map((step, i) => (
          <View
            key={step.title}
            accessible
            accessibilityLabel={`Step ${i + 1}: ${step.title}. ${step.body}`}
            style={{ flexDirection: 'row', gap: space.md, alignItems: 'flex-start' }}
          >
            <View
              style={{
                width: 32,
                height: 32,
                borderRadius: radii.pill,
                backgroundColor: colors.navActiveSurface,
                alignItems: 'center',
                justifyContent: 'center',
              }}
              accessibilityElementsHidden
              importantForAccessibility="no-hide-descendants"
            >
              <AppText weight="bold" tone="navActive">
                {String(i + 1)}
              </AppText>
            </View>
            <View style={{ flex: 1, gap: space.xxs }}>
              <AppText weight="bold">{step.title}</AppText>
              <AppText tone="textMuted">{step.body}</AppText>
            </View>
          </View>
        ))}
      </View>
    </Card>
  );
}
