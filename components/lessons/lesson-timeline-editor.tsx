import { useState } from 'react';
import { View } from 'react-native';
import type { ScenarioEvent } from '@/simulation/scenario';
import { useTheme } from '@/hooks/use-theme';
import { parseDecimal } from '@/lib/units-format';
import { Button } from '@/components/ui/button';
import { TextField } from '@/components/ui/text-field';
import { AppText, Heading } from '@/components/ui/text';
import { ChoiceGroup } from '@/components/settings/choice-group';
import { EventForm } from '@/components/plans/event-form';
import { EventTimeline } from '@/components/plans/event-timeline';
import { fishOnDay } from '@/shared/fish-on-day';
import { DEFAULT_FAST_NAME, DEFAULT_STAGED_NAME, stagedFromFast, type LessonBuilderForm, type LessonFormErrors } from './lesson-builder-model';

type Which = 'fast' | 'staged';
type Patch = Partial<Pick<LessonBuilderForm, 'events' | 'stagedEvents' | 'fastName' | 'stagedName' | 'horizon'>>;

/** Routine water changes come from the tank, so mentors should not add them as events too. */
function routineNote(form: LessonBuilderForm): string {
  const percent = parseDecimal(form.tank.waterChangePercent);
  const every = parseDecimal(form.tank.waterChangeEveryDays);
  const routine =
    percent !== null && percent > 0 && every !== null && every > 0
      ? `The tank’s usual ${percent} % water change every ${every} days runs by itself: no need to add it here. `
      : '';
  return `${routine}Tap an event to change it.`;
}

const DAY_HINT = 'Days from the start of the lesson (0 = the first day)';

/**
 * The lesson's timeline(s), edited with the plan editor's event form and list. A comparison
 * has two: the fast way and the staged way, one shown at a time, and a shortcut that makes the
 * staged one from the fast one by splitting each fish addition into batches.
 */
export function LessonTimelineEditor({
  form,
  onChange,
  errors,
  autoHorizon,
}: {
  form: LessonBuilderForm;
  onChange(patch: Patch, touched: string): void;
  errors: LessonFormErrors;
  /** The horizon used when the field is empty. */
  autoHorizon: number | null;
}) {
  const { space } = useTheme();
  const compare = form.kind === 'compare';
  const [which, setWhich] = useState<Which>('fast');
  const [selected, setSelected] = useState<number | null>(null);
  const [batches, setBatches] = useState('3');
  const [every, setEvery] = useState('7');
  const [splitError, setSplitError] = useState<string | null>(null);

  const shown: Which = compare ? which : 'fast';
  const events = shown === 'fast' ? form.events : form.stagedEvents;
  const key = shown === 'fast' ? 'events' : 'stagedEvents';
  const setEvents = (next: ScenarioEvent[]) => onChange({ [key]: next }, key);
  const startFish = form.tank.fish.reduce((n, f) => n + (parseDecimal(f.count) ?? 0), 0);
  const choose = (w: Which) => {
    setWhich(w);
    setSelected(null);
  };
  const split = () => {
    const made = stagedFromFast(form.events, batches, every);
    if ('error' in made) return setSplitError(made.error);
    setSplitError(null);
    onChange({ stagedEvents: made.events }, 'stagedEvents');
    choose('staged');
  };

  return (
    <View style={{ gap: space.md }} testID="lesson-timeline">
      {compare ? (
        <ChoiceGroup
          label="Timeline"
          hint="The learner sees both forecasts side by side and guesses the fast one’s nitrite peak."
          testID="lesson-timeline-which"
          value={shown}
          onChange={choose}
          choices={[
            { value: 'fast', label: form.fastName.trim() || DEFAULT_FAST_NAME },
            { value: 'staged', label: form.stagedName.trim() || DEFAULT_STAGED_NAME },
          ]}
        />
      ) : null}
      <AppText variant="caption" tone="textMuted" testID="lesson-timeline-note">{routineNote(form)}</AppText>
      <EventTimeline
        events={events}
        selected={selected}
        onSelect={setSelected}
        onRemove={(i) => {
          setSelected(null);
          setEvents(events.filter((_, j) => j !== i));
        }}
      />
      {errors[key] ? <AppText tone="dangerText" weight="bold" testID={`lesson-${key}-error`}>{`Error: ${errors[key]}`}</AppText> : null}
      {compare && shown === 'fast' && errors.stagedEvents ? (
        <AppText tone="dangerText" weight="bold" testID="lesson-stagedEvents-error">{`Error (staged way): ${errors.stagedEvents}`}</AppText>
      ) : null}
      <Heading level={3}>{selected !== null && events[selected] ? `Edit day ${events[selected].day}` : 'Add an event'}</Heading>
      <EventForm
        editing={selected !== null ? (events[selected] ?? null) : null}
        dayHint={DAY_HINT}
        onSubmit={(e) => setEvents(selected !== null ? events.map((x, j) => (j === selected ? e : x)) : [...events, e])}
        onCancel={selected !== null ? () => setSelected(null) : undefined}
        fishOnDay={(day) => fishOnDay(startFish, events, day)}
      />
      {compare ? (
        <View style={{ gap: space.sm }} testID="lesson-split">
          <Heading level={3}>Make the staged way from the fast one</Heading>
          <AppText tone="textMuted">Copies the fast timeline and splits every fish addition into batches (this replaces the staged timeline).</AppText>
          <View style={{ flexDirection: 'row', gap: space.md, flexWrap: 'wrap', alignItems: 'flex-end' }}>
            <View style={{ width: 120 }}>
              <TextField label="Batches" testID="lesson-split-batches" value={batches} onChangeText={setBatches} inputMode="numeric" />
            </View>
            <View style={{ width: 120 }}>
              <TextField label="Days apart" testID="lesson-split-every" value={every} onChangeText={setEvery} inputMode="numeric" />
            </View>
            <Button variant="secondary" label="Copy and split" onPress={split} testID="lesson-split-submit" />
          </View>
          {splitError ? <AppText tone="dangerText" weight="bold" testID="lesson-split-error">{`Error: ${splitError}`}</AppText> : null}
        </View>
      ) : null}
      <TextField
        label={compare ? (shown === 'fast' ? 'Name of the fast way' : 'Name of the staged way') : 'Name of this forecast (optional)'}
        hint={`Shown above its chart, e.g. “${shown === 'fast' ? 'All thirty on day 1' : 'Ten a week for three weeks'}”.`}
        testID={`lesson-name-${shown}`}
        value={shown === 'fast' ? form.fastName : form.stagedName}
        placeholder={compare ? (shown === 'fast' ? DEFAULT_FAST_NAME : DEFAULT_STAGED_NAME) : 'Forecast'}
        onChangeText={(v) => onChange(shown === 'fast' ? { fastName: v } : { stagedName: v }, shown === 'fast' ? 'fastName' : 'stagedName')}
        error={errors[shown === 'fast' ? 'fastName' : 'stagedName']}
        maxLength={200}
      />
      <TextField
        label="Forecast length (days)"
        hint={autoHorizon !== null ? `Empty: ${autoHorizon} days (three weeks after the last event).` : 'Empty: three weeks after the last event.'}
        testID="lesson-horizon"
        value={form.horizon}
        onChangeText={(v) => onChange({ horizon: v }, 'horizon')}
        error={errors.horizon}
        inputMode="numeric"
      />
    </View>
  );
}
