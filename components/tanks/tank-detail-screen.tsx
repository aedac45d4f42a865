import type { ReactNode } from 'react';
import { View } from 'react-native';
import type { TankDetail } from '@/shared/schemas/tank';
import { useTankDetail } from '@/hooks/use-tanks';
import { useTheme } from '@/hooks/use-theme';
import { isApiRequestError } from '@/lib/api-client';
import { formatCelsius, formatLitres, formatMgPerL, relativeDayLabel, shortDate } from '@/lib/format';
import { Screen } from '@/components/ui/screen';
import { Card } from '@/components/ui/card';
import { Banner } from '@/components/ui/banner';
import { StatusPill } from '@/components/ui/status-pill';
import { AppText, Heading } from '@/components/ui/text';
import { TextLink } from '@/components/ui/text-link';
import { Loading, LoadError } from '@/components/ui/load-state';
import { NitrogenFigures } from '@/components/tanks/nitrogen-figures';
import { ReadingsTable } from '@/components/tanks/readings-table';
import { NITROGEN_UNIT, planStatusLabel, planSummary, setupLines, speciesDisplayName } from '@/components/tanks/tank-labels';

/** One tank, read-only: its setup, stock, recent water tests and plans. */
export function TankDetailScreen({ id }: { id: string }) {
  const tank = useTankDetail(id);
  return (
    <Screen testID="screen-tank" title={tank.data?.name ?? 'Tank'}>
      <TextLink href="/" label="← All tanks" accessibilityLabel="Back to all tanks" testID="tank-back" />
      {tank.isPending ? <Loading label="Loading the tank…" /> : null}
      {tank.isError && isApiRequestError(tank.error) && tank.error.status === 404 ? (
        <Banner tone="watch" title="Tank not found" message="This tank does not exist, or it belongs to someone else." testID="tank-not-found" />
      ) : tank.isError ? (
        <LoadError title="Could not load this tank" error={tank.error} onRetry={() => void tank.refetch()} retrying={tank.isFetching} testID="tank-error" />
      ) : null}
      {tank.data ? <TankDetailBody tank={tank.data} now={new Date()} /> : null}
    </Screen>
  );
}

function Section({ title, testID, children }: { title: string; testID: string; children: ReactNode }) {
  const { space } = useTheme();
  return (
    <Card testID={testID} style={{ gap: space.md }}>
      <Heading level={2}>{title}</Heading>
      {children}
    </Card>
  );
}

function TankDetailBody({ tank, now }: { tank: TankDetail; now: Date }) {
  const { space } = useTheme();
  const latest = tank.readings[0] ?? null;
  const fishCount = tank.livestock.reduce((n, l) => n + l.count, 0);
  const facts = [
    formatLitres(tank.volumeL),
    formatCelsius(tank.temperatureC),
    `pH ${tank.ph}`,
    tank.khDkh === null ? null : `KH ${tank.khDkh} °dKH`,
  ].filter(Boolean);
  const tap = tank.tapWater;
  const setup = setupLines(tank.setup);

  return (
    <>
      <View style={{ gap: space.xs }}>
        <Heading testID="tank-name">{tank.name}</Heading>
        <AppText tone="textMuted">{facts.join(' · ')}</AppText>
      </View>

      <View style={{ flexDirection: 'row', flexWrap: 'wrap', gap: space.lg }}>
        <View style={{ flexGrow: 1, flexBasis: 320, gap: space.lg }}>
          <Section title="Latest water test" testID="tank-latest">
            {latest ? (
              <>
                <AppText weight="bold" tone="textMuted">{`${relativeDayLabel(latest.takenAt, now)} (${shortDate(latest.takenAt)})`}</AppText>
                <NitrogenFigures values={latest} />
              </>
            ) : (
              <AppText tone="textMuted">No water test logged yet.</AppText>
            )}
          </Section>

          <Section title="Plans" testID="tank-plans">
            {tank.plans.length === 0 ? <AppText tone="textMuted">No plans for this tank yet.</AppText> : null}
            {tank.plans.map((plan) => {
              const status = planStatusLabel[plan.status];
              return (
                <View key={plan.id} testID={`plan-${plan.id}`} style={{ gap: space.xxs }}>
                  <StatusPill tone={status.tone} label={status.label} />
                  <AppText weight="bold">{plan.name}</AppText>
                  <AppText tone="textMuted">
                    {`Starts ${shortDate(plan.startDate)} · ${planSummary(plan.events)}`}
                  </AppText>
                </View>
              );
            })}
          </Section>
        </View>

        <View style={{ flexGrow: 1, flexBasis: 320, gap: space.lg }}>
          <Section title={`Livestock · ${fishCount} fish`} testID="tank-livestock">
            {tank.livestock.length === 0 ? <AppText tone="textMuted">No fish or invertebrates recorded.</AppText> : null}
            {tank.livestock.map((item) => (
              <View key={item.id} testID={`livestock-${item.id}`} style={{ flexDirection: 'row', justifyContent: 'space-between', gap: space.md }}>
                <AppText style={{ flex: 1 }}>{speciesDisplayName(item)}</AppText>
                <AppText weight="bold">{`${item.count} ×${item.lengthCm === null ? '' : ` ${item.lengthCm} cm`}`}</AppText>
              </View>
            ))}
          </Section>

          <Section title="Setup" testID="tank-setup">
            {setup.length === 0 ? <AppText tone="textMuted">No filter or substrate details yet.</AppText> : null}
            {setup.map((line) => (
              <AppText key={line}>{line}</AppText>
            ))}
            <AppText tone="textMuted">
              {`Tap water: total ammonia ${formatMgPerL(tap.tanMgN)}, nitrite ${formatMgPerL(tap.no2MgN)}, nitrate ${formatMgPerL(tap.no3MgN)} ${NITROGEN_UNIT}`}
            </AppText>
            {tank.notes.trim() ? <AppText>{tank.notes}</AppText> : null}
          </Section>
        </View>
      </View>

      <Section title="Recent water tests" testID="tank-readings">
        {tank.readings.length === 0 ? (
          <AppText tone="textMuted">No water tests logged yet.</AppText>
        ) : (
          <ReadingsTable readings={tank.readings} now={now} />
        )}
      </Section>
    </>
  );
}
