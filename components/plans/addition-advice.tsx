import { useState } from 'react';
import { View } from 'react-native';
import type { z } from 'zod';
import { useTheme } from '@/hooks/use-theme';
import { useAdditionAdvice } from '@/hooks/use-plans';
import { additionBody, DEFAULT_MAX_BATCHES, DEFAULT_SEARCH_DAYS, type AdditionLimitsText } from '@/lib/addition-form';
import { plainNumber } from '@/shared/forecast-view';
import { addDays } from '@/shared/plan-check-days';
import { plannedDay } from '@/shared/plan-schedule';
import type { ScenarioEvent } from '@/simulation/scenario';
import type { additionSuggestionSchema } from '@/simulation/advice/schemas';
import { fishName } from '@/simulation/advice/schedule-words';
import { AppText, Heading } from '@/components/ui/text';
import { Button } from '@/components/ui/button';
import { Banner } from '@/components/ui/banner';
import { TextField } from '@/components/ui/text-field';
import { TextLink } from '@/components/ui/text-link';
import { CautionsList } from '@/components/forecast/cautions-list';
import { errorText, OutcomeFigures, plannedAddition, Section, Words, type AdvicePanelProps } from '@/components/plans/advice-parts';

type Suggestion = z.infer<typeof additionSuggestionSchema>;

/** "How fast can it go": the fastest safe schedule from the planned day, or what stands in the way and what would make it possible. */
export function AdditionAdvice({ tank, planId, events, startDate, onApplySchedule }: AdvicePanelProps) {
  const { space, colors, radii } = useTheme();
  const advice = useAdditionAdvice(tank.id);
  const [limits, setLimits] = useState<AdditionLimitsText>({ searchDays: String(DEFAULT_SEARCH_DAYS), maxBatches: String(DEFAULT_MAX_BATCHES) });
  const [errors, setErrors] = useState<Partial<Record<keyof AdditionLimitsText, string>>>({});
  const [applied, setApplied] = useState<'applied' | 'refused' | null>(null);
  const fish = plannedAddition(events);
  if (!fish) return <AppText tone="textMuted">This plan adds no fish. Add an “Add fish” event to ask how fast it can go.</AppText>;
  const fromDay = plannedDay(events, fish);
  const name = fishName(fish);

  const run = (text: AdditionLimitsText) => {
    setLimits(text);
    setApplied(null);
    const checked = additionBody(planId, fish, text);
    setErrors(checked.ok ? {} : checked.fields);
    if (checked.ok) advice.mutate(checked.body);
  };
  const apply = (schedule: ScenarioEvent[]) => setApplied(onApplySchedule(schedule) ? 'applied' : 'refused');
  const data = advice.data;
  const labels = Object.fromEntries((data?.limits ?? []).map((l) => [l.key, l.label]));
  const lastDay = Number(limits.searchDays);
  const dated = (day: number) => {
    const date = addDays(startDate, day);
    return date ? `Day ${day} (${date})` : `Day ${day}`;
  };

  return (
    <Section testID="advice-addition">
      <AppText>{`How fast can ${fish.count} ${name} go in without a spike? The search starts on day ${fromDay}, the day you planned; the plan's other events (water changes, doses, other fish) stay.`}</AppText>
      <View style={{ flexDirection: 'row', flexWrap: 'wrap', gap: space.md }}>
        <View style={{ flexGrow: 1, flexBasis: 160 }}>
          <TextField
            label="Finish within (days)"
            hint={Number.isInteger(lastDay) && lastDay > 0 ? `Last batch by ${dated(lastDay).toLowerCase()}` : 'Days from the plan start'}
            value={limits.searchDays}
            onChangeText={(v) => {
              setLimits((l) => ({ ...l, searchDays: v }));
              setErrors((e) => ({ ...e, searchDays: undefined }));
            }}
            keyboardType="number-pad"
            error={errors.searchDays}
            testID="addition-search-days"
          />
        </View>
        <View style={{ flexGrow: 1, flexBasis: 160 }}>
          <TextField
            label="At most how many batches"
            hint="More batches: smaller trips to the shop"
            value={limits.maxBatches}
            onChangeText={(v) => {
              setLimits((l) => ({ ...l, maxBatches: v }));
              setErrors((e) => ({ ...e, maxBatches: undefined }));
            }}
            keyboardType="number-pad"
            error={errors.maxBatches}
            testID="addition-max-batches"
          />
        </View>
      </View>
      <Button label="How fast can it go?" busy={advice.isPending} busyLabel="Working it out…" onPress={() => run(limits)} testID="advice-addition-run" />
      {advice.isError ? <Banner tone="danger" title="No advice this time" message={errorText(advice.error)} testID="advice-error" /> : null}
      {data ? (
        <View testID="advice-addition-result" style={{ gap: space.md }}>
          <AppText tone={data.status === 'no-safe-schedule' ? 'dangerText' : 'okText'} weight="bold">
            {data.status === 'all-at-once-is-safe' ? 'All at once looks safe' : data.status === 'staged' ? `In ${data.batches.length} batches` : 'No safe schedule within these limits'}
          </AppText>
          <Heading level={3} testID="advice-summary">
            {data.summary}
          </Heading>
          {data.batches.length > 0 ? (
            <View testID="advice-batches" style={{ gap: space.xxs }}>
              {data.batches.map((b) => (
                <AppText key={b.day}>{`${dated(b.day)}: ${b.count} ${name}`}</AppText>
              ))}
            </View>
          ) : null}
          {data.blocker ? <Banner tone="watch" title="What stands in the way" message={data.blocker.words} testID="advice-blocker" /> : null}
          {data.status === 'no-safe-schedule' ? (
            <View testID="advice-suggestions" style={{ gap: space.sm }}>
              <Heading level={3}>What would make it possible</Heading>
              {data.suggestions.length === 0 ? <AppText tone="textMuted">Nothing tried here keeps the forecast under the limits.</AppText> : null}
              {data.suggestions.map((s, i) => (
                <View key={s.kind} testID={`advice-suggestion-${s.kind}`} style={{ gap: space.xs, padding: space.sm, borderWidth: 1, borderColor: colors.border, borderRadius: radii.md }}>
                  <AppText>{s.summary}</AppText>
                  <SuggestionAction suggestion={s} index={i} tankId={tank.id} onSearch={run} onApply={apply} fishName={name} />
                </View>
              ))}
            </View>
          ) : null}
          <View style={{ flexDirection: 'row', flexWrap: 'wrap', gap: space.sm }}>
            {data.staged ? <OutcomeFigures title="This schedule" outcome={data.staged} labels={labels} testID="advice-staged" /> : null}
            <OutcomeFigures title="All at once" outcome={data.allAtOnce} labels={labels} testID="advice-all-at-once" />
          </View>
          <AppText testID="advice-binding">{`The limit ${data.status === 'no-safe-schedule' ? 'in the way' : 'that sets the pace'}: ${data.binding.label}, ${plainNumber(data.binding.value)} ${data.binding.unit}.`}</AppText>
          <Words lines={data.explanation} />
          {data.status !== 'no-safe-schedule' && data.events.length > 0 ? (
            <Button
              label="Apply this schedule"
              onPress={() => apply(data.events as ScenarioEvent[])}
              accessibilityLabel={`Apply this schedule: replaces the plan's additions of ${name}, from day ${fromDay} on`}
              testID="advice-apply"
            />
          ) : null}
          {applied === 'applied' ? <Banner tone="ok" title="Applied" message="The plan now adds these fish on the schedule's days. Save the plan to keep it." testID="advice-applied" /> : null}
          {applied === 'refused' ? (
            <Banner tone="watch" title="Not applied" message="This schedule would add fish before the day you planned. Ask again: the answer starts from your planned day." testID="advice-apply-refused" />
          ) : null}
          <CautionsList extra={data.cautions} testID="advice-cautions" />
        </View>
      ) : null}
    </Section>
  );
}

function SuggestionAction({
  suggestion: s,
  index,
  tankId,
  fishName: name,
  onSearch,
  onApply,
}: {
  suggestion: Suggestion;
  index: number;
  tankId: string;
  fishName: string;
  onSearch(limits: AdditionLimitsText): void;
  onApply(events: ScenarioEvent[]): void;
}) {
  if (s.kind === 'more-batches' || s.kind === 'later-finish') {
    return (
      <Button
        label="Search with these limits"
        variant="secondary"
        onPress={() => onSearch({ searchDays: String(s.searchDays), maxBatches: String(s.maxBatches) })}
        accessibilityLabel={`Search again within ${s.searchDays} days and at most ${s.maxBatches} batches`}
        testID={`advice-suggestion-search-${index}`}
      />
    );
  }
  if (s.kind === 'fewer-fish') {
    return (
      <Button
        label={`Apply ${s.count} ${name} instead`}
        variant="secondary"
        onPress={() => onApply(s.events as ScenarioEvent[])}
        accessibilityLabel={`Apply this schedule of ${s.count} ${name}: replaces the plan's additions of ${name}`}
        testID={`advice-suggestion-apply-${index}`}
      />
    );
  }
  return <TextLink href={`/tanks/${tankId}`} label="Set the routine water change on the tank page" testID={`advice-suggestion-tank-${index}`} />;
}
