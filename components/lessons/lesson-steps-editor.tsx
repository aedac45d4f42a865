import { View } from 'react-native';
import { useTheme } from '@/hooks/use-theme';
import { Button } from '@/components/ui/button';
import { TextField } from '@/components/ui/text-field';
import { AppText } from '@/components/ui/text';
import { addStep, GUESS_STEP, MAX_LESSON_STEPS, moveStep, removeStep, type LessonFormErrors, type LessonStepForm } from './lesson-builder-model';

/**
 * The lesson's story: numbered steps (title and text) the learner reads above the guess chart.
 * Steps can be added (up to 12), removed and moved; each message sits under its field.
 */
export function LessonStepsEditor({
  steps,
  onChange,
  errors,
}: {
  steps: readonly LessonStepForm[];
  onChange(steps: LessonStepForm[], touched: string): void;
  errors: LessonFormErrors;
}) {
  const { space, colors, radii } = useTheme();
  const hasGuess = steps.some((s) => s.title.trim().toLowerCase() === GUESS_STEP.title.toLowerCase());
  const edit = (i: number, key: 'title' | 'body') => (text: string) => onChange(steps.map((s, j) => (j === i ? { ...s, [key]: text } : s)), `steps.${i}.${key}`);
  return (
    <View style={{ gap: space.md }} testID="lesson-steps-editor">
      {steps.map((s, i) => (
        <View
          key={i}
          testID={`lesson-step-edit-${i}`}
          style={{ gap: space.sm, padding: space.md, borderRadius: radii.md, borderWidth: 1, borderColor: colors.border, backgroundColor: colors.surface }}
        >
          <AppText weight="bold">{`Step ${i + 1}`}</AppText>
          <TextField label="Title" testID={`lesson-step-${i}-title`} value={s.title} onChangeText={edit(i, 'title')} error={errors[`steps.${i}.title`]} maxLength={80} />
          <TextField label="What the learner reads" testID={`lesson-step-${i}-body`} value={s.body} onChangeText={edit(i, 'body')} error={errors[`steps.${i}.body`]} multiline numberOfLines={4} maxLength={1200} />
          <View style={{ flexDirection: 'row', gap: space.xs, flexWrap: 'wrap' }}>
            <Button variant="quiet" label="Move up" accessibilityLabel={`Move step ${i + 1} up`} disabled={i === 0} onPress={() => onChange(moveStep(steps, i, -1), 'steps')} testID={`lesson-step-${i}-up`} />
            <Button variant="quiet" label="Move down" accessibilityLabel={`Move step ${i + 1} down`} disabled={i === steps.length - 1} onPress={() => onChange(moveStep(steps, i, 1), 'steps')} testID={`lesson-step-${i}-down`} />
            <Button variant="quiet" label="Remove" accessibilityLabel={`Remove step ${i + 1}`} disabled={steps.length === 1} onPress={() => onChange(removeStep(steps, i), 'steps')} testID={`lesson-step-${i}-remove`} />
          </View>
        </View>
      ))}
      {errors.steps ? <AppText tone="dangerText" weight="bold" testID="lesson-steps-error">{`Error: ${errors.steps}`}</AppText> : null}
      <View style={{ flexDirection: 'row', gap: space.sm, flexWrap: 'wrap' }}>
        <Button variant="secondary" label="Add a step" disabled={steps.length >= MAX_LESSON_STEPS} onPress={() => onChange(addStep(steps), 'steps')} testID="lesson-step-add" />
        {!hasGuess && steps.length < MAX_LESSON_STEPS ? (
          <Button variant="secondary" label="Add the guess step" onPress={() => onChange([...steps, { ...GUESS_STEP }], 'steps')} testID="lesson-step-add-guess" />
        ) : null}
      </View>
      <AppText variant="caption" tone="textMuted">{`${steps.length} of at most ${MAX_LESSON_STEPS} steps. Learners see the guess chart under the story, then the forecast.`}</AppText>
    </View>
  );
}
