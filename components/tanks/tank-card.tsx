import { View } from 'react-native';
import { PressableLink } from '@/components/ui/pressable-link';
import type { TankSummaryWithStatus } from '@/shared/schemas/tank';
import type { Preferences } from '@/shared/schemas/preferences';
import { useTheme } from '@/hooks/use-theme';
import { relativeDayLabel, shortDate, stockingLabel } from '@/lib/format';
import { formatNitrogen, formatTemperature, formatVolume, nitrogenUnit } from '@/lib/units-format';
import { AppText } from '@/components/ui/text';
import { StatusPill } from '@/components/ui/status-pill';
import { NitrogenFigures } from '@/components/tanks/nitrogen-figures';
import { NITROGEN_FIGURES, OVER_LIMIT_ADVICE, nextTestLabel, overallStatusLabel } from '@/components/tanks/tank-labels';

const LEVEL_WORDS = { ok: 'below', watch: 'at least half of', over: 'over' } as const;
const LEVEL_TONE = { ok: 'okText', watch: 'watchText', over: 'dangerText' } as const;

/** One tank on the home screen: status in words, size, stock, the latest test, the next test day. */
export function TankCard({ tank, now, units }: { tank: TankSummaryWithStatus; now: Date; units: Preferences }) {
  const { colors, radii, space } = useTheme();
  const reading = tank.latestReading;
  const status = overallStatusLabel[tank.status.overall ?? 'none'];
  const next = nextTestLabel(tank.status.nextTest, now);
  const testedWhen = reading ? `${relativeDayLabel(reading.takenAt, now)} (${shortDate(reading.takenAt)})` : null;
  const facts = [formatVolume(tank.volumeL, units.volumeUnit), formatTemperature(tank.temperatureC, units.temperatureUnit), `pH ${tank.ph}`].join(' · ');
  const b = units.nitrogenBasis;
  const judgedLines = tank.status.judged.map((j) => {
    const name = NITROGEN_FIGURES.find((f) => f.key === j.key)!.label;
    const unit = nitrogenUnit(j.key, b);
    return {
      key: j.key,
      level: j.level,
      text: `${name} ${formatNitrogen(j.valueMgN, j.key, b)} ${unit}: ${LEVEL_WORDS[j.level]} the limit of ${formatNitrogen(j.limit.value, j.key, b)}`,
    };
  });
  const a11y = [
    `${tank.name}.`,
    `${status.label}.`,
    ...judgedLines.map((l) => `${l.text}.`),
    `${facts}.`,
    `${stockingLabel(tank.fishCount, tank.speciesCount, tank.invertebrateCount)}.`,
    reading ? `Last water test ${testedWhen}.` : '',
    `${next.text}.`,
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
        <View style={{ flexDirection: 'row', justifyContent: 'space-between', alignItems: 'flex-start', gap: space.sm }}>
          <AppText variant="title" weight="bold" style={{ flex: 1 }}>
            {tank.name}
          </AppText>
          <StatusPill tone={status.tone} label={status.label} testID={`tank-card-${tank.id}-status`} />
        </View>
        <AppText tone="textMuted" testID={`tank-card-${tank.id}-facts`}>
          {facts}
        </AppText>
        <AppText>{stockingLabel(tank.fishCount, tank.speciesCount, tank.invertebrateCount)}</AppText>
      </View>

      {reading ? (
        <View style={{ gap: space.xs }}>
          <AppText variant="caption" weight="bold" tone="textMuted">
            {`Last water test: ${testedWhen}`}
          </AppText>
          <NitrogenFigures values={reading} testID={`tank-card-${tank.id}-reading`} />
          {judgedLines
            .filter((l) => l.level !== 'ok')
            .map((l) => (
              <AppText key={l.key} weight="bold" tone={LEVEL_TONE[l.level]} testID={`tank-card-${tank.id}-${l.key}-judged`}>
                {`${l.level === 'over' ? 'Over limit' : 'Watch'} — ${l.text}`}
              </AppText>
            ))}
          {tank.status.overall === 'over' ? (
            <AppText variant="caption" testID={`tank-card-${tank.id}-advice`}>
              {OVER_LIMIT_ADVICE}
            </AppText>
          ) : null}
        </View>
      ) : (
        <AppText tone="textMuted" testID={`tank-card-${tank.id}-no-reading`}>
          No water test logged yet.
        </AppText>
      )}

      <AppText weight={next.overdue ? 'bold' : 'regular'} tone={next.overdue ? 'watchText' : 'text'} testID={`tank-card-${tank.id}-next-test`}>
        {next.text}
      </AppText>

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
