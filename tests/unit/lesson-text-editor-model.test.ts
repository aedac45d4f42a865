import { describe, expect, it } from 'vitest';
import { createLessonSchema, updateLessonTextSchema } from '@/shared/schemas/lesson';
import { clearTouched } from '@/components/lessons/lesson-builder-model';
import { checkLessonText, lessonTextChanged, lessonTextFields, lessonTextFormOf } from '@/components/lessons/lesson-text-editor-model';

const saved = {
  title: 'A filter rinsed in tap water',
  summary: 'The sponge goes under the tap.',
  steps: [
    { title: 'The sponge', body: 'Most of the nitrifiers live here.' },
    { title: 'Your guess', body: 'Where does nitrite peak?' },
  ],
};

describe('editing a saved lesson’s words', () => {
  it('fills the form with a copy of the saved words; editing the copy leaves the lesson alone', () => {
    const form = lessonTextFormOf(saved);
    expect(form).toEqual(saved);
    form.steps[0].title = 'Changed';
    expect(saved.steps[0].title).toBe('The sponge');
  });

  it('sends title, summary and steps when the shared schema accepts them', () => {
    const form = { ...lessonTextFormOf(saved), title: 'Rinsed in tap water' };
    const checked = checkLessonText(form);
    expect(checked).toEqual({ ok: true, input: { title: 'Rinsed in tap water', summary: saved.summary, steps: saved.steps } });
  });

  it('puts the schema’s messages under the fields: a 2-character title, an empty step body, 13 steps, none', () => {
    const short = checkLessonText({ ...lessonTextFormOf(saved), title: 'ab' });
    expect(short.ok ? null : short.errors).toEqual({ title: 'Use at least 3 characters.' });
    const noBody = checkLessonText({ ...lessonTextFormOf(saved), steps: [saved.steps[0], { title: 'Two', body: '  ' }] });
    expect(noBody.ok ? null : noBody.errors).toEqual({ 'steps.1.body': 'Write the step.' });
    const many = checkLessonText({ ...lessonTextFormOf(saved), steps: Array.from({ length: 13 }, () => saved.steps[0]) });
    expect(many.ok ? null : many.errors).toEqual({ steps: 'At most 12 steps.' });
    const none = checkLessonText({ ...lessonTextFormOf(saved), steps: [] });
    expect(none.ok ? null : none.errors).toEqual({ steps: 'Write at least one step.' });
  });

  it('the edit schema and the create schema give the same message for the same field', () => {
    const create = createLessonSchema.safeParse({ title: 'ab', fromShareId: '6f1c1f8e-8a43-4c55-9d1e-2f9b6f0b7a11', steps: [] });
    const edit = updateLessonTextSchema.safeParse({ title: 'ab', steps: [] });
    const messages = (r: typeof create | typeof edit) => (r.success ? [] : r.error.issues.map((i) => `${i.path.join('.')}: ${i.message}`).sort());
    expect(messages(edit)).toEqual(messages(create));
    expect(messages(edit)).toEqual(['steps: Write at least one step.', 'title: Use at least 3 characters.']);
    expect(updateLessonTextSchema.safeParse({}).success).toBe(false);
    expect(updateLessonTextSchema.safeParse({ summary: '' }).success).toBe(true);
    expect(updateLessonTextSchema.safeParse({ title: 'Fine', kind: 'compare' }).success).toBe(false);
  });

  it('knows when nothing changed (spaces the server trims do not count)', () => {
    expect(lessonTextChanged(lessonTextFormOf(saved), saved)).toBe(false);
    expect(lessonTextChanged({ ...lessonTextFormOf(saved), title: ` ${saved.title} ` }, saved)).toBe(false);
    expect(lessonTextChanged({ ...lessonTextFormOf(saved), summary: '' }, saved)).toBe(true);
    expect(lessonTextChanged({ ...lessonTextFormOf(saved), steps: [saved.steps[1], saved.steps[0]] }, saved)).toBe(true);
    expect(lessonTextChanged({ ...lessonTextFormOf(saved), steps: [saved.steps[0]] }, saved)).toBe(true);
  });

  it('lists every field a server message can land under, and clears a touched field’s messages', () => {
    expect(lessonTextFields(2)).toEqual(['title', 'summary', 'steps', 'steps.0.title', 'steps.0.body', 'steps.1.title', 'steps.1.body']);
    const errors = { title: 'a', steps: 'b', 'steps.0.title': 'c' };
    expect(clearTouched(errors, 'steps')).toEqual({ title: 'a' });
    expect(clearTouched(errors, 'summary')).toBe(errors);
  });
});
