import { useState } from 'react';
import { View } from 'react-native';
import type { PlanDetail } from '@/shared/schemas/plan';
import type { TankDetail } from '@/shared/schemas/tank';
import { usePlanTransition } from '@/hooks/use-plans';
import { useTheme } from '@/hooks/use-theme';
import { isApiRequestError } from '@/lib/api-client';
import { shortDate } from '@/lib/format';
import { localDate, type PlanProgress } from '@/lib/plan-progress';
import { dayWords } from '@/lib/tank-next-action';
import { Card } from '@/components/ui/card';
import { Banner } from '@/components/ui/banner';
import { Button } from '@/components/ui/button';
import { TextLink } from '@/components/ui/text-link';
import { AppText, Heading } from '@/components/ui/text';
import { QuickTestForm } from '@/components/readings/quick-test-form';

export interface PlanLifeCardProps {
  plan: PlanDetail;
  tank: TankDetail;
  /** Where a started plan stands (null for a draft). */
  progress: PlanProgress | null;
  /** Unsaved changes in the editor: starting saves them first. */
  dirty: boolean;
  /** How many events the editor holds (saved or not). */
  eventCount: number;
  /** Saves the draft; resolves once saved. */
  save(): Promise<unknown>;
}

/**
 * A plan's life in one card: a draft starts today (day 0), a running plan shows the day it is
 * on, today's check and "Mark as done", a finished one says when it ran. One plan runs per
 * tank: while another runs, starting is refused by the server and this card says so first.
 */
export function PlanLifeCard({ plan, tank, progress, dirty, eventCount, save }: PlanLifeCardProps) {
  const transition = usePlanTransition(plan.id);
  const error = transition.error && isApiRequestError(transition.error) ? transition.error.message : transition.error?.message;
  return (
    <Card testID="plan-life">
      {plan.status === 'draft' ? <DraftPart plan={plan} tank={tank} dirty={dirty} eventCount={eventCount} save={save} transition={transition} /> : null}
      {plan.status === 'active' && progress ? <RunningPart plan={plan} tank={tank} progress={progress} dirty={dirty} transition={transition} /> : null}
      {plan.status === 'done' && progress ? <DonePart plan={plan} progress={progress} /> : null}
      {error ? <Banner tone="danger" title="Not changed" message={error} testID="plan-life-error" /> : null}
    </Card>
  );
}

type Transition = ReturnType<typeof usePlanTransition>;

function DraftPart({ plan, tank, dirty, eventCount, save, transition }: Omit<PlanLifeCardProps, 'progress'> & { transition: Transition }) {
  const today = localDate(new Date());
  const other = tank.plans.find((p) => p.status === 'active' && p.id !== plan.id);
  const empty = eventCount === 0;
  const start = async () => {
    try {
      if (dirty) await save();
    } catch {
      return; // The save card says what was refused.
    }
    transition.mutate({ kind: 'start', body: { startDate: today } });
  };
  return (
    <>
      <Heading level={2}>Start when you begin</Heading>
      <AppText>{`Starting makes today, ${shortDate(`${today}T12:00:00`)}, day 0. The test days then fall on real dates and the tank page follows the plan.`}</AppText>
      {other ? (
        <Banner tone="watch" title={`“${other.name}” is running on this tank`} message="One plan runs on a tank at a time: mark that one as done before starting this one." testID="plan-other-running">
          <TextLink href={`/plans/${other.id}`} label={`Open “${other.name}”`} testID="plan-other-running-link" />
        </Banner>
      ) : null}
      {empty ? <AppText tone="textMuted">Add an event first: a plan with nothing in it has no test days.</AppText> : null}
      <Button
        label={dirty ? 'Save and start this plan' : 'Start this plan'}
        busy={transition.isPending}
        busyLabel="Starting…"
        disabled={empty || other !== undefined}
        onPress={() => void start()}
        testID="plan-start"
      />
    </>
  );
}

function RunningPart({ plan, tank, progress, dirty, transition }: { plan: PlanDetail; tank: TankDetail; progress: PlanProgress; dirty: boolean; transition: Transition }) {
  const { space } = useTheme();
  const [logging, setLogging] = useState(false);
  const [confirming, setConfirming] = useState(false);
  const now = new Date();
  const due = progress.checkDays.find((c) => c.state === 'due');
  const { next } = progress;
  const checks = progress.checkDays.length;
  return (
    <>
      <Heading level={2}>{`Day ${progress.today} of ${progress.lastDay}`}</Heading>
      <AppText testID="plan-running-since">{`Running since ${shortDate(`${plan.startDate}T12:00:00`)} (day 0). ${progress.done} of ${checks} test days done${progress.missed ? `, ${progress.missed} missed` : ''}.`}</AppText>
      {due ? (
        <Banner tone="watch" title="Today is a test day" message={`Day ${due.day}: ${due.reasons.join('; ')}.`} testID="plan-due-today" />
      ) : (
        <AppText weight="bold" testID="plan-next-check">
          {next ? `Next test day: ${dayWords(next.date, now)} (day ${next.day}): ${next.reasons[0]}.` : 'Every test day is behind. Mark the plan as done when the water has settled.'}
        </AppText>
      )}
      <View style={{ flexDirection: 'row', gap: space.sm, flexWrap: 'wrap' }}>
        <Button
          label={logging ? 'Close the test form' : due ? "Log today's test" : 'Log a test'}
          variant={due ? 'primary' : 'secondary'}
          onPress={() => setLogging((v) => !v)}
          accessibilityState={{ expanded: logging }}
          testID="plan-log-test"
        />
        {!confirming ? <Button label="Mark as done…" variant="secondary" disabled={dirty} onPress={() => setConfirming(true)} testID="plan-finish" /> : null}
      </View>
      {dirty ? <AppText tone="textMuted">Save or undo your changes before marking the plan as done.</AppText> : null}
      {logging ? (
        <View testID="plan-quick-test">
          <QuickTestForm tankId={tank.id} last={tank.readings[0] ?? null} />
        </View>
      ) : null}
      {confirming ? (
        <Banner
          tone="info"
          title={`Mark “${plan.name}” as done?`}
          message="It is then kept as it ran, with your tests beside the forecast, and can no longer change. The tank goes back to its usual test days."
          testID="plan-finish-confirm"
        >
          <View style={{ flexDirection: 'row', gap: space.sm, flexWrap: 'wrap' }}>
            <Button label="Mark as done" busy={transition.isPending} busyLabel="Saving…" onPress={() => transition.mutate({ kind: 'finish' }, { onSuccess: () => setConfirming(false) })} testID="plan-finish-yes" />
            <Button label="Not yet" variant="secondary" onPress={() => setConfirming(false)} testID="plan-finish-no" />
          </View>
        </Banner>
      ) : null}
    </>
  );
}

function DonePart({ plan, progress }: { plan: PlanDetail; progress: PlanProgress }) {
  const ran = plan.finishedAt ? Math.max(0, Math.round((Date.parse(plan.finishedAt) - Date.parse(`${plan.startDate}T00:00:00`)) / 86_400_000)) : null;
  return (
    <>
      <Heading level={2}>Done</Heading>
      <AppText testID="plan-done-summary">
        {`Ran from ${shortDate(`${plan.startDate}T12:00:00`)}${plan.finishedAt ? ` to ${shortDate(plan.finishedAt)} (${ran === 0 ? 'the same day' : `${ran} ${ran === 1 ? 'day' : 'days'}`})` : ''}. ${progress.done} of ${progress.checkDays.filter((c) => c.state !== 'not-needed').length} test days were tested.`}
      </AppText>
      <AppText tone="textMuted">Kept as it ran: it can no longer change. Plan the next change from the tank page.</AppText>
    </>
  );
}
