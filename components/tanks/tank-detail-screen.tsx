import { useState, type ReactNode } from 'react';
import { View } from 'react-native';
import { useRouter } from 'expo-router';
import type { TankDetail } from '@/shared/schemas/tank';
import { useDeleteTank, useTankDetail } from '@/hooks/use-tanks';
import { usePreferences } from '@/hooks/use-preferences';
import { useTheme } from '@/hooks/use-theme';
import { isApiRequestError } from '@/lib/api-client';
import { relativeDayLabel, shortDate } from '@/lib/format';
import { formatTemperature, formatVolume } from '@/lib/units-format';
import { Screen } from '@/components/ui/screen';
import { Card } from '@/components/ui/card';
import { Banner } from '@/components/ui/banner';
import { Button } from '@/components/ui/button';
import { StatusPill } from '@/components/ui/status-pill';
import { AppText, Heading } from '@/components/ui/text';
import { TextLink } from '@/components/ui/text-link';
import { Loading, LoadError } from '@/components/ui/load-state';
import { NitrogenFigures } from '@/components/tanks/nitrogen-figures';
import { LivestockSection } from '@/components/tanks/livestock-section';
import { TankSetupSection } from '@/components/tanks/tank-setup-section';
import { OVER_LIMIT_ADVICE, planStatusLabel, planSummary } from '@/components/tanks/tank-labels';
import { judgeLatest } from '@/shared/tank-status';
import { QuickTestForm } from '@/components/readings/quick-test-form';
import { ReadingsLog } from '@/components/readings/readings-log';
import { CsvImportExport } from '@/components/readings/csv-import';
import { TankHistorySection } from '@/components/tanks/tank-history-section';
import { FitToTests } from '@/components/tanks/fit-to-tests';
import { TEST_START_MAX_DAYS } from '@/shared/tank-start';

/** One tank: log a test at the top (phone first), then the log, stock, setup and plans. */
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
  const units = usePreferences();
  const latest = tank.readings[0] ?? null;
  const fishCount = tank.livestock.reduce((n, l) => n + l.count, 0);
  const facts = [
    formatVolume(tank.volumeL, units.volumeUnit),
    formatTemperature(tank.temperatureC, units.temperatureUnit),
    `pH ${tank.ph}`,
    tank.khDkh === null ? null : `KH ${tank.khDkh} °dKH`,
  ].filter(Boolean);

  return (
    <>
      <View style={{ gap: space.xs }}>
        <Heading testID="tank-name">{tank.name}</Heading>
        <AppText tone="textMuted" testID="tank-facts">
          {facts.join(' · ')}
        </AppText>
      </View>

      <View style={{ flexDirection: 'row', flexWrap: 'wrap', gap: space.lg }}>
        <View style={{ flexGrow: 1, flexBasis: 320, gap: space.lg }}>
          <Card testID="tank-quick-test" style={{ gap: space.md }}>
            <QuickTestForm tankId={tank.id} last={latest} />
          </Card>
          <Section title="Latest water test" testID="tank-latest">
            {latest ? (
              <>
                <AppText weight="bold" tone="textMuted">{`${relativeDayLabel(latest.takenAt, now)} (${shortDate(latest.takenAt)})`}</AppText>
                <NitrogenFigures values={latest} testID="tank-latest-figures" />
                {judgeLatest(latest, tank).some((j) => j.level === 'over') ? (
                  <Banner tone="danger" title="Over a limit" message={OVER_LIMIT_ADVICE} testID="tank-latest-over" />
                ) : null}
              </>
            ) : (
              <AppText tone="textMuted">No water test logged yet.</AppText>
            )}
          </Section>
        </View>

        <View style={{ flexGrow: 1, flexBasis: 320, gap: space.lg }}>
          <Section title={`Livestock · ${fishCount} ${fishCount === 1 ? 'animal' : 'animals'}`} testID="tank-livestock">
            <LivestockSection tankId={tank.id} volumeL={tank.volumeL} livestock={tank.livestock} />
          </Section>
          <Section title="Setup" testID="tank-setup">
            <TankSetupSection tank={tank} />
          </Section>
        </View>
      </View>

      <Section title="Where forecasts start" testID="tank-start">
        <AppText tone="textMuted">
          {`Every forecast starts from your latest test when it is at most ${TEST_START_MAX_DAYS} days old, with the nitrifiers of an applied fit, else of how you say the tank has run.`}
        </AppText>
        <View style={{ flexDirection: 'row', flexWrap: 'wrap', gap: space.lg }}>
          <View style={{ flexGrow: 1, flexBasis: 320, gap: space.md }}>
            <TankHistorySection tank={tank} />
          </View>
          <View style={{ flexGrow: 1, flexBasis: 320, gap: space.md }}>
            <FitToTests tank={tank} />
          </View>
        </View>
      </Section>

      <Section title="Test log" testID="tank-readings">
        <ReadingsLog tankId={tank.id} tank={tank} />
        <CsvImportExport tankId={tank.id} />
      </Section>

      <Section title="Plans" testID="tank-plans">
        {tank.plans.length === 0 ? <AppText tone="textMuted">No plans for this tank yet.</AppText> : null}
        {tank.plans.map((plan) => {
          const status = planStatusLabel[plan.status];
          return (
            <View key={plan.id} testID={`plan-${plan.id}`} style={{ gap: space.xxs }}>
              <StatusPill tone={status.tone} label={status.label} />
              <TextLink href={`/plans/${plan.id}`} label={plan.name} accessibilityLabel={`Open plan: ${plan.name}`} testID={`plan-open-${plan.id}`} />
              <AppText tone="textMuted">{`Starts ${shortDate(plan.startDate)} · ${planSummary(plan.events)}`}</AppText>
            </View>
          );
        })}
        <TextLink href={`/plans?tankId=${tank.id}`} label="Plan a change for this tank" testID="tank-new-plan" />
      </Section>

      <DeleteTank tank={tank} />
    </>
  );
}

function DeleteTank({ tank }: { tank: TankDetail }) {
  const { space } = useTheme();
  const router = useRouter();
  const remove = useDeleteTank(tank.id);
  const [asking, setAsking] = useState(false);
  if (!asking) return <Button variant="quiet" label="Delete this tank…" onPress={() => setAsking(true)} testID="tank-delete" />;
  return (
    <Banner tone="watch" title={`Delete ${tank.name}?`} message="Its fish list, every water test and every plan go with it. This cannot be undone." testID="tank-delete-confirm">
      <View style={{ flexDirection: 'row', gap: space.md, flexWrap: 'wrap' }}>
        <Button label="Delete for good" busy={remove.isPending} busyLabel="Deleting…" onPress={() => remove.mutate(undefined, { onSuccess: () => router.replace('/') })} testID="tank-delete-yes" />
        <Button variant="secondary" label="Keep it" onPress={() => setAsking(false)} testID="tank-delete-no" />
      </View>
    </Banner>
  );
}
