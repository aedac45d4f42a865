import { View } from 'react-native';
import type { TankDetail } from '@/shared/schemas/tank';
import type { TankOverview as Overview } from '@/lib/tank-next-action';
import { usePreferences } from '@/hooks/use-preferences';
import { useTheme } from '@/hooks/use-theme';
import { relativeDayLabel, shortDate, stockingLabel } from '@/lib/format';
import { formatNitrogen, formatTemperature, formatVolume, nitrogenUnit } from '@/lib/units-format';
import { Card } from '@/components/ui/card';
import { Banner } from '@/components/ui/banner';
import { Button } from '@/components/ui/button';
import { ButtonLink } from '@/components/ui/button-link';
import { StatusPill } from '@/components/ui/status-pill';
import { AppText, Heading } from '@/components/ui/text';
import { NitrogenFigures } from '@/components/tanks/nitrogen-figures';
import { NITROGEN_FIGURES, OVER_LIMIT_ADVICE, overallStatusLabel } from '@/components/tanks/tank-labels';

const LEVEL_WORDS = { watch: 'at least half of', over: 'over' } as const;

/**
 * The tank page's first screen: what state the tank is in (size, animals, the latest test
 * judged, the running plan) and the one thing to do next (lib/tank-next-action.ts).
 */
export function TankOverview({ tank, overview, now, onLogTest }: { tank: TankDetail; overview: Overview; now: Date; onLogTest(): void }) {
  const { space } = useTheme();
  const units = usePreferences();
  const latest = tank.readings[0] ?? null;
  const status = overallStatusLabel[overview.overall ?? 'none'];
  const facts = [
    formatVolume(tank.volumeL, units.volumeUnit),
    formatTemperature(tank.temperatureC, units.temperatureUnit),
    `pH ${tank.ph}`,
    tank.khDkh === null ? null : `KH ${tank.khDkh} °dKH`,
  ].filter(Boolean);
  const flagged = overview.status.judged.filter((j) => j.level !== 'ok');
  const { running, action } = overview;

  return (
    <Card testID="tank-overview" style={{ flexDirection: 'row', flexWrap: 'wrap', gap: space.lg }}>
      {/* Wide: the state on the left, the plan and the next action on the right; a phone stacks them. */}
      <View style={{ flexGrow: 1, flexBasis: 320, gap: space.md }}>
        <View style={{ gap: space.xxs }}>
          <View style={{ flexDirection: 'row', justifyContent: 'space-between', alignItems: 'flex-start', gap: space.sm, flexWrap: 'wrap' }}>
            <Heading testID="tank-name" style={{ flexShrink: 1 }}>
              {tank.name}
            </Heading>
            <StatusPill tone={status.tone} label={status.label} testID="tank-status" />
          </View>
          <AppText tone="textMuted" testID="tank-facts">
            {facts.join(' · ')}
          </AppText>
          <AppText testID="tank-stock">{stockingLabel(overview.stock.fish, overview.stock.species, overview.stock.invertebrates)}</AppText>
        </View>

        <View testID="tank-latest" style={{ gap: space.xs }}>
          {latest ? (
            <>
              <AppText variant="caption" weight="bold" tone="textMuted">{`Last water test: ${relativeDayLabel(latest.takenAt, now)} (${shortDate(latest.takenAt)})`}</AppText>
              <NitrogenFigures values={latest} testID="tank-latest-figures" />
              {flagged.map((j) => {
                const b = units.nitrogenBasis;
                const name = NITROGEN_FIGURES.find((f) => f.key === j.key)!.label;
                return (
                  <AppText key={j.key} weight="bold" tone={j.level === 'over' ? 'dangerText' : 'watchText'} testID={`tank-latest-${j.key}-judged`}>
                    {`${name} ${formatNitrogen(j.valueMgN, j.key, b)} ${nitrogenUnit(j.key, b)}: ${LEVEL_WORDS[j.level as 'watch' | 'over']} the limit of ${formatNitrogen(j.limit.value, j.key, b)}`}
                  </AppText>
                );
              })}
              {overview.overall === 'over' ? <Banner tone="danger" title="Over a limit" message={OVER_LIMIT_ADVICE} testID="tank-latest-over" /> : null}
            </>
          ) : (
            <AppText tone="textMuted">No water test logged yet.</AppText>
          )}
        </View>
      </View>

      <View style={{ flexGrow: 1, flexBasis: 280, gap: space.md }}>
        <View testID="tank-running-plan" style={{ gap: space.xxs }}>
          {running ? (
            <>
              <View style={{ flexDirection: 'row', gap: space.sm, alignItems: 'center', flexWrap: 'wrap' }}>
                <StatusPill tone="ok" label="Plan in progress" />
                <AppText weight="bold">{running.plan.name}</AppText>
              </View>
              <AppText tone="textMuted">{`Day ${running.progress.today} of ${running.progress.lastDay} · ${running.progress.done} of ${running.progress.checkDays.length} test days done${running.progress.missed ? `, ${running.progress.missed} missed` : ''}`}</AppText>
            </>
          ) : (
            <AppText tone="textMuted">No plan running.</AppText>
          )}
        </View>

        <View testID="tank-next-action" style={{ gap: space.xs }}>
          <AppText variant="caption" weight="bold" tone="textMuted">
            Next
          </AppText>
          {action.kind === 'log-test' ? (
            <Button label={action.label} onPress={onLogTest} testID="tank-action-log-test" />
          ) : (
            <ButtonLink
              href={action.kind === 'open-plan' ? `/plans/${action.planId}` : `/plans?tankId=${tank.id}`}
              label={action.label}
              testID={action.kind === 'open-plan' ? 'tank-action-open-plan' : 'tank-action-plan-change'}
            />
          )}
          <AppText testID="tank-next-action-why">{action.why}</AppText>
        </View>
      </View>
    </Card>
  );
}
