import { useState } from 'react';
import { View } from 'react-native';
import type { LessonDetail } from '@/shared/schemas/lesson';
import { useUpdateLessonText } from '@/hooks/use-lessons';
import { useTheme } from '@/hooks/use-theme';
import { formErrorsFromRequest } from '@/lib/form-errors';
import { Card } from '@/components/ui/card';
import { Banner } from '@/components/ui/banner';
import { Button } from '@/components/ui/button';
import { TextField } from '@/components/ui/text-field';
import { AppText, Heading } from '@/components/ui/text';
import { clearTouched, errorPlaces, type LessonFormErrors } from './lesson-builder-model';
import { checkLessonText, lessonTextChanged, lessonTextFields, lessonTextFormOf, type LessonTextForm } from './lesson-text-editor-model';
import { LessonStepsEditor } from './lesson-steps-editor';

/**
 * For the lesson's author or an organizer: reword the title, summary and steps of a saved
 * lesson. Closed, it is one line and a button; Cancel puts the saved words back.
 */
export function LessonTextEditor({ lesson }: { lesson: LessonDetail }) {
  const { space } = useTheme();
  const update = useUpdateLessonText(lesson.id);
  const [form, setForm] = useState<LessonTextForm | null>(null);
  const [errors, setErrors] = useState<LessonFormErrors>({});
  const [banner, setBanner] = useState<string | null>(null);
  const [saved, setSaved] = useState(false);

  const open = () => {
    setForm(lessonTextFormOf(lesson));
    setErrors({});
    setBanner(null);
    setSaved(false);
    update.reset();
  };
  const close = () => {
    setForm(null);
    setErrors({});
    setBanner(null);
  };
  const edit = (patch: Partial<LessonTextForm>, touched: string) => {
    setForm((f) => (f ? { ...f, ...patch } : f));
    setBanner(null);
    setErrors((prev) => clearTouched(prev, touched));
  };

  const save = () => {
    if (!form) return;
    if (!lessonTextChanged(form, lesson)) return close();
    const checked = checkLessonText(form);
    if (!checked.ok) {
      setErrors(checked.errors);
      const places = errorPlaces(checked.errors);
      setBanner(places.length ? `Check ${places.join(', ')}: the messages are under the fields.` : Object.values(checked.errors).join(' '));
      return;
    }
    update.mutate(checked.input, {
      onSuccess: () => {
        close();
        setSaved(true);
      },
      onError: (e) => {
        const sorted = formErrorsFromRequest(e, lessonTextFields(form.steps.length));
        setErrors(sorted.fields);
        const places = errorPlaces(sorted.fields);
        setBanner([sorted.banner ?? '', places.length ? `Check ${places.join(', ')}.` : ''].join(' ').trim());
      },
    });
  };

  if (!form) {
    return (
      <Card testID="lesson-edit-card" style={{ gap: space.sm }}>
        <View style={{ flexDirection: 'row', flexWrap: 'wrap', alignItems: 'center', justifyContent: 'space-between', gap: space.sm }}>
          <View style={{ flexShrink: 1, gap: space.xs }}>
            <Heading level={2}>The words of this lesson</Heading>
            <AppText variant="caption" tone="textMuted">As its author or an organizer, you can reword the title, summary and steps.</AppText>
          </View>
          <Button variant="secondary" label="Edit the words" onPress={open} testID="lesson-edit-open" />
        </View>
        {saved ? <AppText tone="textMuted" testID="lesson-edit-saved">Saved. Learners see the new words from now on.</AppText> : null}
      </Card>
    );
  }

  return (
    <Card testID="lesson-edit-card" style={{ gap: space.md }}>
      <Heading level={2}>Edit the words</Heading>
      <AppText tone="textMuted" testID="lesson-edit-scenario-note">
        The tank and its timeline stay as they are; to change them, build a new lesson.
      </AppText>
      <TextField label="Title" testID="lesson-edit-title" value={form.title} onChangeText={(v) => edit({ title: v }, 'title')} error={errors.title} maxLength={120} />
      <TextField
        label="Summary (optional)"
        testID="lesson-edit-summary"
        value={form.summary}
        onChangeText={(v) => edit({ summary: v }, 'summary')}
        error={errors.summary}
        multiline
        numberOfLines={3}
        maxLength={400}
      />
      <Heading level={3}>The story</Heading>
      <LessonStepsEditor steps={form.steps} onChange={(steps, touched) => edit({ steps }, touched)} errors={errors} />
      {banner ? <Banner tone="danger" title="The new words are not saved yet" message={banner} testID="lesson-edit-error" /> : null}
      <View style={{ flexDirection: 'row', flexWrap: 'wrap', gap: space.sm }}>
        <Button label="Save the words" onPress={save} busy={update.isPending} busyLabel="Saving…" testID="lesson-edit-save" />
        <Button variant="secondary" label="Cancel" accessibilityLabel="Cancel and keep the saved words" onPress={close} disabled={update.isPending} testID="lesson-edit-cancel" />
      </View>
    </Card>
  );
}
