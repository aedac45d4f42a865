import { useState } from 'react';
import { View } from 'react-native';
import { useRouter } from 'expo-router';
import { useCreatePlan, usePlanList } from '@/hooks/use-plans';
import { useTankList } from '@/hooks/use-tanks';
import { useTheme } from '@/hooks/use-theme';
import { isApiRequestError } from '@/lib/api-client';
import { Screen } from '@/components/ui/screen';
import { Card } from '@/components/ui/card';
import { Banner } from '@/components/ui/banner';
import { Button } from '@/components/ui/button';
import { TextField } from '@/components/ui/text-field';
import { PressableLink } from '@/components/ui/pressable-link';
import { StatusPill } from '@/components/ui/status-pill';
import { AppText, Heading } from '@/components/ui/text';
import { Loading, LoadError } from '@/components/ui/load-state';
import { planStatusLabel } from '@/components/tanks/tank-labels';
import { describeEvent } from '@/components/plans/event-fields';
import { eventCount, shownEvents, useDraftStore } from '@/lib/draft-store';
import type { PlanDetail } from '@/shared/schemas/plan';

const today = () => new Date().toISOString().slice(0, 10);

/** Every plan of the keeper's tanks, and a short form to start a new one. */
export function PlansListScreen({ tankId }: { tankId?: string }) {
  const { space, colors, radii } = useTheme();
  const plans = usePlanList();
  return (
    <Screen testID="screen-plans" title="Plans">
      <Heading>Plans</Heading>
      <AppText tone="textMuted">A plan is a timeline of changes to one tank — fish in or out, water changes, doses — with its forecast.</AppText>
      {plans.isPending ? <Loading label="Loading plans…" /> : null}
      {plans.isError ? <LoadError title="Could not load plans" error={plans.error} onRetry={() => void plans.refetch()} retrying={plans.isFetching} /> : null}
      {plans.data?.plans.length === 0 ? <AppText testID="plans-empty">No plans yet. Start one below.</AppText> : null}
      <View style={{ gap: space.sm }} testID="plans-list">
        {plans.data?.plans.map((p) => (
          <PressableLink
            key={p.id}
            href={`/plans/${p.id}`}
            testID={`plans-item-${p.id}`}
            accessibilityLabel={`${p.name}, ${p.tankName}, ${planStatusLabel[p.status].label}`}
            style={({ pressed, hovered, focused }) => ({
              padding: space.lg,
              gap: space.xs,
              borderRadius: radii.lg,
              borderWidth: focused ? 2 : 1,
              borderColor: focused ? colors.focus : colors.border,
              backgroundColor: pressed || hovered ? colors.surfaceRaised : colors.surface,
            })}
          >
            <View style={{ flexDirection: 'row', justifyContent: 'space-between', gap: space.sm, flexWrap: 'wrap' }}>
              <AppText weight="bold">{p.name}</AppText>
              <StatusPill tone={planStatusLabel[p.status].tone} label={planStatusLabel[p.status].label} />
            </View>
            <PlanListFacts plan={p} />
          </PressableLink>
        ))}
      </View>
      <NewPlanForm initialTankId={tankId} />
    </Screen>
  );
}

/** Tank, day 0 and events of one listed plan; an unsaved draft's events count. */
function PlanListFacts({ plan }: { plan: PlanDetail }) {
  const draft = useDraftStore((s) => s.drafts[plan.id]);
  const { events, unsaved } = shownEvents(plan.status === 'done' ? undefined : draft, plan.events);
  const first = [...events].sort((a, b) => a.day - b.day)[0];
  const when = plan.status === 'draft' ? 'not started' : `day 0: ${plan.startDate}`;
  return (
    <>
      <AppText tone="textMuted" testID={`plans-item-${plan.id}-facts`}>{`${plan.tankName} · ${when} · ${eventCount(events.length)}${unsaved ? ' (unsaved changes)' : ''}`}</AppText>
      {first ? <AppText variant="caption">{`First: day ${first.day}, ${describeEvent(first)}`}</AppText> : null}
    </>
  );
}

function NewPlanForm({ initialTankId }: { initialTankId?: string }) {
  const { space } = useTheme();
  const router = useRouter();
  const tanks = useTankList();
  const [tankId, setTankId] = useState<string | undefined>(initialTankId);
  const [name, setName] = useState('');
  const [startDate, setStartDate] = useState(today());
  const chosen = tankId ?? tanks.data?.tanks[0]?.id;
  const create = useCreatePlan(chosen ?? '');
  const fields = create.error && isApiRequestError(create.error) ? create.error.fields : {};
  if (tanks.data && tanks.data.tanks.length === 0) return <AppText tone="textMuted">Add a tank first: a plan belongs to one tank.</AppText>;
  return (
    <Card testID="plan-new">
      <Heading level={2}>New plan</Heading>
      <View style={{ flexDirection: 'row', flexWrap: 'wrap', gap: space.xs }} accessibilityRole="radiogroup" accessibilityLabel="Tank">
        {tanks.data?.tanks.map((t) => (
          <Button key={t.id} label={t.name} variant={t.id === chosen ? 'primary' : 'secondary'} onPress={() => setTankId(t.id)} testID={`plan-new-tank-${t.id}`} />
        ))}
      </View>
      <TextField label="Name" value={name} onChangeText={setName} error={fields.name} testID="plan-new-name" />
      <TextField label="Start date" hint="Year-month-day, e.g. 2026-03-14" value={startDate} onChangeText={setStartDate} error={fields.startDate} testID="plan-new-start" />
      {create.isError && Object.keys(fields).length === 0 ? <Banner tone="danger" title="Not created" message={create.error.message} /> : null}
      <Button
        label="Create plan"
        busy={create.isPending}
        busyLabel="Creating…"
        disabled={!chosen}
        onPress={() => create.mutate({ name, startDate }, { onSuccess: (p) => router.push(`/plans/${p.id}`) })}
        testID="plan-new-submit"
      />
    </Card>
  );
}
