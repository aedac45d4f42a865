import { View } from 'react-native';
import { PressableLink } from '@/components/ui/pressable-link';
import type { TankSummary } from '@/shared/schemas/tank';
import { useTheme } from '@/hooks/use-theme';
import { formatCelsius, formatLitres, relativeDayLabel, shortDate, stockingLabel } from '@/lib/format';
import { AppText } from '@/components/ui/text';
import { StatusPill } from '@/components/ui/status-pill';
import { NitrogenFigures } from '@/components/tanks/nitrogen-figures';

/** One tank on the home screen: size, stock, the latest water test and the running plan. */
export function TankCard({ tank, now }: { tank: TankSummary; now: Date }) {
  const { colors, radii, space } = useTheme();
  const reading = tank.latestReading;
  const testedWhen = reading ? `${relativeDayLabel(reading.takenAt, now)} (${shortDate(reading.takenAt)})` : null;
  const facts = [formatLitres(tank.volumeL), formatCelsius(tank.temperatureC), `pH ${tank.ph}`].join(' · ');
  const a11y = [
    `${tank.name}.`,
    `${facts}.`,
    `${stockingLabel(tank.fishCount, tank.speciesCount)}.`,
    reading ? `Last water test ${testedWhen}.` : 'No water test yet.',
    tank.activePlan ? `Plan in progress: ${tank.activePlan.name}.` : '',
    'Opens the tank.',
  ]
    .filter(Boolean)
    .join(' ');

  return (
    <PressableLink
      href={{ pathname: '/tanks/[id]', params: { id: tank.id } }}
      testID={`tank-card-${tank.id}`}
      accessibilityRole="link"
      accessibilityLabel={a11y}
      style={({ pressed, hovered, focused }) => ({
        flexGrow: 1,
        flexBasis: 320,
        backgroundColor: pressed ? colors.surfaceRaised : colors.surface,
        borderColor: focused ? colors.focus : hovered ? colors.fieldBorder : colors.border,
        borderWidth: focused ? 2 : 1,
        margin: focused ? 0 : 1,
        borderRadius: radii.lg,
        padding: space.lg,
        gap: space.md,
      })}
    >
      <View style={{ gap: space.xxs }}>
        <AppText variant="title" weight="bold">
          {tank.name}
        </AppText>
        <AppText tone="textMuted">{facts}</AppText>
        <AppText>{stockingLabel(tank.fishCount, tank.speciesCount)}</AppText>
      </View>

      {reading ? (
        <View style={{ gap: space.xs }}>
          <AppText variant="caption" weight="bold" tone="textMuted">
            {`Last water test: ${testedWhen}`}
          </AppText>
          <NitrogenFigures values={reading} testID={`tank-card-${tank.id}-reading`} />
        </View>
      ) : (
        <AppText tone="textMuted" testID={`tank-card-${tank.id}-no-reading`}>
          No water test logged yet.
        </AppText>
      )}

      {tank.activePlan ? (
        <View style={{ gap: space.xxs }}>
          <StatusPill tone="ok" label="Plan in progress" />
          <AppText weight="bold">{tank.activePlan.name}</AppText>
        </View>
      ) : (
        <AppText variant="caption" tone="textMuted">
          No plan running.
        </AppText>
      )}
    </PressableLink>
  );
}
