import { router } from 'expo-router';
import { useMutation, useQueryClient } from '@tanstack/react-query';
import { z } from 'zod';
import { lessonDetailSchema, lessonStepSchema } from '@/shared/schemas/lesson';
import { useFormState } from '@/hooks/use-form-state';
import { useTheme } from '@/hooks/use-theme';
import { apiRequest } from '@/lib/api-client';
import { lessonKeys } from '@/lib/query-keys';
import { formErrorsFromRequest, NO_FORM_ERRORS, validateForm } from '@/lib/form-errors';
import { Button } from '@/components/ui/button';
import { Banner } from '@/components/ui/banner';
import { Card } from '@/components/ui/card';
import { TextField } from '@/components/ui/text-field';
import { AppText, Heading } from '@/components/ui/text';

const formSchema = z.object({
  title: z.string().trim().min(3, 'Use at least 3 characters.').max(120, 'Use at most 120 characters.'),
  story: lessonStepSchema.shape.body,
});

/**
 * For mentors and organizers on a shared plan: turn it into a lesson (the server builds the
 * scenario from the plan and its tank). The newcomer's guess step is added after the story.
 */
export function LessonFromPlanCard({ clubId, shareId, planName }: { clubId: string; shareId: string; planName: string }) {
  const { space } = useTheme();
  const qc = useQueryClient();
  const { values, setValue, errors, setErrors } = useFormState({ title: planName.length >= 3 ? planName : '', story: '' });
  const create = useMutation({
    mutationFn: (v: { title: string; story: string }) =>
      apiRequest(`/api/clubs/${encodeURIComponent(clubId)}/lessons`, {
        method: 'POST',
        body: {
          title: v.title,
          fromShareId: shareId,
          steps: [
            { title: 'The situation', body: v.story },
            { title: 'Your guess', body: 'Drag the marker to the day and height where you think nitrite will peak.' },
          ],
        },
        schema: lessonDetailSchema,
      }),
    onSuccess: (lesson) => {
      void qc.invalidateQueries({ queryKey: lessonKeys.all });
      router.push(`/lessons/${lesson.id}`);
    },
  });
  const submit = () => {
    const checked = validateForm(formSchema, values);
    if (!checked.ok) return setErrors(checked.errors);
    setErrors(NO_FORM_ERRORS);
    create.mutate(checked.data, { onError: (e) => setErrors(formErrorsFromRequest(e, ['title'])) });
  };
  return (
    <Card testID="lesson-from-plan" style={{ gap: space.md }}>
      <Heading level={2}>Teach with this plan</Heading>
      <AppText tone="textMuted">Makes a club lesson from this plan and its tank. Newcomers guess the nitrite peak, then see the forecast.</AppText>
      {errors.banner ? <Banner tone="danger" title="No lesson was made" message={errors.banner} /> : null}
      <TextField label="Lesson title" testID="lesson-from-plan-title" value={values.title} onChangeText={setValue('title')} error={errors.fields.title} />
      <TextField
        label="The story"
        hint="A few sentences: the tank, the change, what to watch."
        testID="lesson-from-plan-story"
        value={values.story}
        onChangeText={setValue('story')}
        error={errors.fields.story}
        multiline
      />
      <Button label="Make the lesson" onPress={submit} busy={create.isPending} testID="lesson-from-plan-submit" />
    </Card>
  );
}
