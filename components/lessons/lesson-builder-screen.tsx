import { useDeferredValue, useMemo, useState } from 'react';
import { Platform, View } from 'react-native';
import { router } from 'expo-router';
import type { LessonKind } from '@/shared/schemas/lesson';
import type { Preferences } from '@/shared/schemas/preferences';
import type { ClubSummary } from '@/shared/schemas/club';
import { useClubList } from '@/hooks/use-clubs';
import { useCreateLesson } from '@/hooks/use-lessons';
import { usePreferences, usePreferencesQuery } from '@/hooks/use-preferences';
import { useLayoutSize } from '@/hooks/use-breakpoint';
import { useTheme } from '@/hooks/use-theme';
import { isApiRequestError } from '@/lib/api-client';
import { formErrorsFromRequest } from '@/lib/form-errors';
import { Screen } from '@/components/ui/screen';
import { Card } from '@/components/ui/card';
import { Banner } from '@/components/ui/banner';
import { Button } from '@/components/ui/button';
import { TextField } from '@/components/ui/text-field';
import { TextLink } from '@/components/ui/text-link';
import { AppText, Heading } from '@/components/ui/text';
import { Loading, LoadError } from '@/components/ui/load-state';
import { ChoiceGroup } from '@/components/settings/choice-group';
import { CautionsList } from '@/components/forecast/cautions-list';
import {
  buildLessonInput,
  clearTouched,
  emptyLessonForm,
  errorPlaces,
  horizonOf,
  lessonScenarios,
  mapLessonErrors,
  type LessonBuilderForm,
  type LessonFormErrors,
} from './lesson-builder-model';
import { lessonAuthorClubs } from './lesson-authors';
import { LessonTankFields } from './lesson-tank-fields';
import { LessonTimelineEditor } from './lesson-timeline-editor';
import { LessonStepsEditor } from './lesson-steps-editor';
import { LessonBuilderPreview } from './lesson-builder-preview';

const KIND_CHOICES: readonly { value: LessonKind; label: string; a11y: string }[] = [
  { value: 'single', label: 'One forecast', a11y: 'One forecast' },
  { value: 'compare', label: 'Fast vs staged', a11y: 'Fast versus staged, side by side' },
];

// Wide web: the preview column stays in view while the form scrolls beside it.
const STICKY = Platform.OS === 'web' ? ({ position: 'sticky', top: 0 } as object) : null;

/** A club mentor or organizer builds a lesson from scratch: club, tank, timeline, story; a live preview; save. */
export function LessonBuilderScreen({ clubId }: { clubId?: string }) {
  const clubs = useClubList();
  const prefs = usePreferencesQuery();
  const authorClubs = useMemo(() => lessonAuthorClubs(clubs.data?.clubs ?? []), [clubs.data]);
  return (
    <Screen testID="screen-lesson-new" title="New lesson">
      <TextLink href="/lessons" label="← All lessons" testID="lesson-new-back" />
      <Heading>New lesson</Heading>
      <AppText tone="textMuted">A tank, what happens to it, and a short story. Learners guess where nitrite peaks, then see the forecast.</AppText>
      {clubs.isPending || prefs.isPending ? <Loading label="Loading your clubs…" /> : null}
      {clubs.isError ? <LoadError title="Could not load your clubs" error={clubs.error} onRetry={() => void clubs.refetch()} retrying={clubs.isFetching} /> : null}
      {clubs.data && authorClubs.length === 0 ? (
        <Banner tone="info" title="Only mentors and organizers build lessons" message="Ask your club’s organizer to make you a mentor." testID="lesson-new-not-allowed" />
      ) : null}
      {clubs.data && !prefs.isPending && authorClubs.length > 0 ? <Builder clubs={authorClubs} initialClubId={clubId} /> : null}
    </Screen>
  );
}

function Builder({ clubs, initialClubId }: { clubs: ClubSummary[]; initialClubId?: string }) {
  const { space } = useTheme();
  const units: Preferences = usePreferences();
  const wide = useLayoutSize() === 'wide';
  const create = useCreateLesson();
  const [form, setForm] = useState<LessonBuilderForm>(() => {
    const start = clubs.find((c) => c.id === initialClubId) ?? (clubs.length === 1 ? clubs[0] : undefined);
    return emptyLessonForm(units, start?.id ?? '');
  });
  const [errors, setErrors] = useState<LessonFormErrors>({});
  const [banner, setBanner] = useState<string | null>(null);

  /** Applies an edit and clears the messages of what was touched (and the banner). */
  const update = (patch: Partial<LessonBuilderForm>, touched: string) => {
    setForm((f) => ({ ...f, ...patch }));
    setBanner(null);
    setErrors((prev) => clearTouched(prev, touched));
  };

  // The preview follows the form without holding up typing.
  // Only the parts that change the forecast count: typing a title or a step runs nothing.
  const { tank, kind, events, stagedEvents, horizon, fastName, stagedName } = useDeferredValue(form);
  const preview = useMemo(() => {
    const s = lessonScenarios({ tank, kind, events, stagedEvents, horizon, fastName, stagedName }, units);
    return s.ok ? s : ({ ok: false } as const);
  }, [tank, kind, events, stagedEvents, horizon, fastName, stagedName, units]);
  const autoHorizon = horizonOf({ ...form, horizon: '' });

  const save = () => {
    const built = buildLessonInput(form, units);
    if (!built.ok) {
      setErrors(built.errors);
      const places = errorPlaces(built.errors);
      setBanner([places.length ? `Check ${places.join(', ')}: the messages are under the fields.` : '', ...built.other].join(' ').trim());
      return;
    }
    setErrors({});
    setBanner(null);
    create.mutate(
      { clubId: built.clubId, input: built.input },
      {
        onSuccess: (lesson) => router.replace(`/lessons/${lesson.id}`),
        onError: (e) => {
          if (isApiRequestError(e) && e.status === 400) {
            const mapped = mapLessonErrors(e.fields);
            setErrors(mapped.fields);
            const places = errorPlaces(mapped.fields);
            setBanner([e.message, places.length ? `Check ${places.join(', ')}.` : '', ...mapped.other].join(' ').trim());
          } else {
            setBanner(formErrorsFromRequest(e, []).banner);
          }
        },
      },
    );
  };

  const aboutCard = (
    <Card testID="lesson-new-about" style={{ gap: space.md }}>
      <Heading level={2}>The lesson</Heading>
      {clubs.length > 1 ? (
        <ChoiceGroup label="Club" testID="lesson-new-club" value={form.clubId} onChange={(v) => update({ clubId: v }, 'clubId')} choices={clubs.map((c) => ({ value: c.id, label: c.name }))} />
      ) : (
        <AppText testID="lesson-new-club-name">{`For ${clubs[0].name}`}</AppText>
      )}
      {errors.clubId ? <AppText tone="dangerText" weight="bold" testID="lesson-new-club-error">{`Error: ${errors.clubId}`}</AppText> : null}
      <TextField label="Title" testID="lesson-new-title" value={form.title} onChangeText={(v) => update({ title: v }, 'title')} error={errors.title} maxLength={120} />
      <TextField
        label="Summary (optional)"
        hint="One or two sentences on the lessons list: the tank and the change."
        testID="lesson-new-summary"
        value={form.summary}
        onChangeText={(v) => update({ summary: v }, 'summary')}
        error={errors.summary}
        multiline
        numberOfLines={3}
        maxLength={400}
      />
      <ChoiceGroup
        label="Kind"
        hint={form.kind === 'single' ? 'One tank, one timeline, one forecast.' : 'The same tank two ways: all at once against staged, side by side.'}
        testID="lesson-new-kind"
        value={form.kind}
        onChange={(v) => update({ kind: v }, 'kind')}
        choices={KIND_CHOICES}
      />
    </Card>
  );
  const tankCard = (
    <Card testID="lesson-new-tank-card" style={{ gap: space.md }}>
      <Heading level={2}>The tank</Heading>
      <LessonTankFields tank={form.tank} onChange={(patch, touched) => update({ tank: { ...form.tank, ...patch } }, touched)} errors={errors} units={units} />
    </Card>
  );
  const timelineCard = (
    <Card testID="lesson-new-timeline-card" style={{ gap: space.md }}>
      <Heading level={2}>What happens when</Heading>
      <LessonTimelineEditor form={form} onChange={update} errors={errors} autoHorizon={autoHorizon} />
    </Card>
  );
  const previewCard = (
    <Card testID="lesson-new-preview-card" style={{ gap: space.md }}>
      <Heading level={2}>What the learner will see</Heading>
      <AppText variant="caption" tone="textMuted">The forecast shown after the guess, as mg/L as N. It redraws as you edit.</AppText>
      <LessonBuilderPreview input={preview} />
    </Card>
  );
  const stepsCard = (
    <Card testID="lesson-new-steps-card" style={{ gap: space.md }}>
      <Heading level={2}>The story</Heading>
      <LessonStepsEditor steps={form.steps} onChange={(steps, touched) => update({ steps }, touched)} errors={errors} />
    </Card>
  );
  const saveCard = (
    <Card testID="lesson-new-save" style={{ gap: space.md }}>
      {banner ? <Banner tone="danger" title="The lesson is not saved yet" message={banner} testID="lesson-new-error" /> : null}
      <Button label="Save the lesson" onPress={save} busy={create.isPending} busyLabel="Saving…" testID="lesson-new-submit" />
      <AppText variant="caption" tone="textMuted">Club members see it in their lessons list. You can share it by link from its page.</AppText>
    </Card>
  );

  // Wide: the form beside the preview. Phone: the preview right after the timeline it shows.
  return wide ? (
    <View style={{ flexDirection: 'row', gap: space.lg, alignItems: 'flex-start' }} testID="lesson-new-wide">
      <View style={{ flex: 1, minWidth: 0, gap: space.lg }}>
        {aboutCard}
        {tankCard}
        {timelineCard}
        {stepsCard}
        {saveCard}
      </View>
      <View style={[{ flex: 1, minWidth: 0, gap: space.lg }, STICKY]}>
        {previewCard}
        <CautionsList testID="lesson-new-cautions" />
      </View>
    </View>
  ) : (
    <View style={{ gap: space.lg }} testID="lesson-new-narrow">
      {aboutCard}
      {tankCard}
      {timelineCard}
      {previewCard}
      {stepsCard}
      {saveCard}
      <CautionsList testID="lesson-new-cautions" />
    </View>
  );
}
