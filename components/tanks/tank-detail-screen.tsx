import { useEffect, useMemo, useRef, useState } from 'react';
import { View } from 'react-native';
import { useRouter } from 'expo-router';
import { TANK_DETAIL_READING_LIMIT, type TankDetail } from '@/shared/schemas/tank';
import { useDeleteTank, useTankDetail } from '@/hooks/use-tanks';
import { usePreferences } from '@/hooks/use-preferences';
import { useTheme } from '@/hooks/use-theme';
import { isApiRequestError } from '@/lib/api-client';
import { relativeDayLabel, shortDate, stockingLabel } from '@/lib/format';
import { shownEvents, useDraftStore } from '@/lib/draft-store';
import { tankOverview, type TankOverview as Overview } from '@/lib/tank-next-action';
import { Screen } from '@/components/ui/screen';
import { Banner } from '@/components/ui/banner';
import { Button } from '@/components/ui/button';
import { StatusPill } from '@/components/ui/status-pill';
import { AppText } from '@/components/ui/text';
import { TextLink } from '@/components/ui/text-link';
import { Loading, LoadError } from '@/components/ui/load-state';
import { TankOverview } from '@/components/tanks/tank-overview';
import { TankSection } from '@/components/tanks/tank-section';
import { LivestockSection } from '@/components/tanks/livestock-section';
import { TankSetupSection } from '@/components/tanks/tank-setup-section';
import { planStatusLabel, planSummary } from '@/components/tanks/tank-labels';
import { QuickTestForm } from '@/components/readings/quick-test-form';
import { ReadingsLog } from '@/components/readings/readings-log';
import { CsvImportExport } from '@/components/readings/csv-import';
import { TankHistorySection } from '@/components/tanks/tank-history-section';
import { FitToTests } from '@/components/tanks/fit-to-tests';
import { TEST_START_MAX_DAYS } from '@/shared/tank-start';

/**
 * One tank: a first screen with its state and the one next action (components/tanks/
 * tank-overview.tsx), then folded sections: log a test, fish, plans, the test log, setup.
 */
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

type SectionKey = 'test' | 'livestock' | 'readings' | 'plans' | 'setup' | 'start';

/** Which sections start open: the test form when a test is what to do, the fish list while the tank is empty. */
function openAtFirst(overview: Overview, tank: TankDetail): Record<SectionKey, boolean> {
  return { test: overview.action.kind === 'log-test', livestock: tank.livestock.length === 0, readings: false, plans: false, setup: false, start: false };
}

function TankDetailBody({ tank, now }: { tank: TankDetail; now: Date }) {
  const { space } = useTheme();
  const latest = tank.readings[0] ?? null;
  const overview = useMemo(() => tankOverview(tank, now), [tank, now]);
  // The keeper's own choice wins; until then a section follows what the tank needs (a section
  // once opened by that rule stays open, so saving a test does not fold its form away).
  const [chosen, setChosen] = useState<Partial<Record<SectionKey, boolean>>>({});
  const wanted = openAtFirst(overview, tank);
  const opened = (Object.keys(wanted) as SectionKey[]).filter((k) => wanted[k]).join(' ');
  useEffect(() => {
    if (!opened) return;
    setChosen((c) => {
      const add = (opened.split(' ') as SectionKey[]).filter((k) => c[k] === undefined);
      return add.length ? { ...c, ...Object.fromEntries(add.map((k) => [k, true])) } : c;
    });
  }, [opened]);
  const isOpen = (k: SectionKey) => chosen[k] ?? wanted[k];
  const toggle = (k: SectionKey) => setChosen((c) => ({ ...c, [k]: !isOpen(k) }));
  const testSection = useRef<View>(null);
  const onLogTest = () => {
    setChosen((c) => ({ ...c, test: true }));
    // Web: bring the form into view (react-native-web refs are DOM nodes).
    requestAnimationFrame(() => (testSection.current as unknown as { scrollIntoView?: (o: object) => void } | null)?.scrollIntoView?.({ behavior: 'smooth', block: 'start' }));
  };

  const { stock } = overview;
  const lastTest = latest ? `last ${relativeDayLabel(latest.takenAt, now)}` : 'none yet';
  const readingCount = tank.readings.length >= TANK_DETAIL_READING_LIMIT ? `${TANK_DETAIL_READING_LIMIT}+ tests` : `${tank.readings.length} ${tank.readings.length === 1 ? 'test' : 'tests'}`;
  const planCounts = (['active', 'draft', 'done'] as const)
    .map((st) => [st, tank.plans.filter((p) => p.status === st).length] as const)
    .filter(([, n]) => n > 0)
    .map(([st, n]) => `${n} ${planStatusLabel[st].label.toLowerCase()}`);

  return (
    <>
      <TankOverview tank={tank} overview={overview} now={now} onLogTest={onLogTest} />

      <View style={{ flexDirection: 'row', flexWrap: 'wrap', gap: space.lg, alignItems: 'flex-start' }}>
        <View style={{ flexGrow: 1, flexBasis: 320, gap: space.lg }}>
          <TankSection ref={testSection} title="Log a test" summary={`Ammonia, nitrite, nitrate and more · ${lastTest}`} open={isOpen('test')} onToggle={() => toggle('test')} testID="tank-quick-test">
            <QuickTestForm tankId={tank.id} last={latest} />
          </TankSection>
          <TankSection
            title="Fish and other animals"
            summary={stockingLabel(stock.fish, stock.species, stock.invertebrates)}
            open={isOpen('livestock')}
            onToggle={() => toggle('livestock')}
            testID="tank-livestock"
          >
            <LivestockSection tankId={tank.id} volumeL={tank.volumeL} livestock={tank.livestock} />
          </TankSection>
          <TankSection title="Plans" summary={planCounts.length ? planCounts.join(' · ') : 'None yet'} open={isOpen('plans')} onToggle={() => toggle('plans')} testID="tank-plans">
            <PlansList tank={tank} />
          </TankSection>
        </View>
        <View style={{ flexGrow: 1, flexBasis: 320, gap: space.lg }}>
          <TankSection title="Test log" summary={`${readingCount} · import or export a file`} open={isOpen('readings')} onToggle={() => toggle('readings')} testID="tank-readings">
            <ReadingsLog tankId={tank.id} tank={tank} />
            <CsvImportExport tankId={tank.id} />
          </TankSection>
          <TankSection title="Setup" summary="Filter, substrate, plants and water changes" open={isOpen('setup')} onToggle={() => toggle('setup')} testID="tank-setup">
            <TankSetupSection tank={tank} />
          </TankSection>
          <TankSection
            title="Where forecasts start"
            summary={tank.fit ? 'From your tests and an applied fit' : 'From your tests and how the tank has run'}
            open={isOpen('start')}
            onToggle={() => toggle('start')}
            testID="tank-start"
          >
            <AppText tone="textMuted">
              {`Every forecast starts from your latest test when it is at most ${TEST_START_MAX_DAYS} days old, with the filter bacteria of an applied fit, else of how you say the tank has run.`}
            </AppText>
            <TankHistorySection tank={tank} />
            <FitToTests tank={tank} />
          </TankSection>
        </View>
      </View>

      <DeleteTank tank={tank} />
    </>
  );
}

/** The tank's plans, newest day 0 first; unsaved draft events count. */
function PlansList({ tank }: { tank: TankDetail }) {
  const { space } = useTheme();
  const drafts = useDraftStore((s) => s.drafts);
  return (
    <>
      {tank.plans.length === 0 ? <AppText tone="textMuted">No plans for this tank yet.</AppText> : null}
      {tank.plans.map((plan) => {
        const status = planStatusLabel[plan.status];
        const { events, unsaved } = shownEvents(plan.status === 'done' ? undefined : drafts[plan.id], plan.events);
        const when = plan.status === 'draft' ? 'Not started' : `Day 0: ${shortDate(`${plan.startDate}T12:00:00`)}`;
        return (
          <View key={plan.id} testID={`plan-${plan.id}`} style={{ gap: space.xxs }}>
            <StatusPill tone={status.tone} label={status.label} />
            <TextLink href={`/plans/${plan.id}`} label={plan.name} accessibilityLabel={`Open plan: ${plan.name}`} testID={`plan-open-${plan.id}`} />
            <AppText tone="textMuted">{`${when} · ${planSummary(events)}${unsaved ? ' (unsaved changes)' : ''}`}</AppText>
          </View>
        );
      })}
      <TextLink href={`/plans?tankId=${tank.id}`} label="Plan a change for this tank" testID="tank-new-plan" />
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
