/**
 * The "edit the words" form of a saved lesson ↔ the PATCH body (pure, tested in tests/unit).
 * Only the title, the summary and the steps change; the tank and timeline stay as built.
 * Form field names are the request's own paths (`title`, `steps.1.body`), so client (zod) and
 * server (400) messages land under the same fields.
 */
import { validateForm } from '@/lib/form-errors';
import { updateLessonTextSchema, type LessonDetail, type UpdateLessonTextInput } from '@/shared/schemas/lesson';
import type { LessonFormErrors, LessonStepForm } from './lesson-builder-model';

export interface LessonTextForm {
  title: string;
  summary: string;
  steps: LessonStepForm[];
}

/** The form filled with the lesson's current words (a copy: editing never touches the cache). */
export function lessonTextFormOf(lesson: Pick<LessonDetail, 'title' | 'summary' | 'steps'>): LessonTextForm {
  return { title: lesson.title, summary: lesson.summary, steps: lesson.steps.map((s) => ({ title: s.title, body: s.body })) };
}

/** Every field the form shows a message under, for sorting a server 400 (`formErrorsFromRequest`). */
export function lessonTextFields(stepCount: number): string[] {
  const out = ['title', 'summary', 'steps'];
  for (let i = 0; i < stepCount; i++) out.push(`steps.${i}.title`, `steps.${i}.body`);
  return out;
}

/** The form checked with the shared schema: the PATCH body (all three parts), or messages per field. */
export function checkLessonText(form: LessonTextForm): { ok: true; input: UpdateLessonTextInput } | { ok: false; errors: LessonFormErrors } {
  const input: UpdateLessonTextInput = { title: form.title, summary: form.summary, steps: form.steps.map((s) => ({ title: s.title, body: s.body })) };
  const checked = validateForm(updateLessonTextSchema, input);
  return checked.ok ? { ok: true, input } : { ok: false, errors: checked.errors.fields };
}

/** Whether the form differs from the lesson as saved (trimmed as the server stores it). */
export function lessonTextChanged(form: LessonTextForm, lesson: Pick<LessonDetail, 'title' | 'summary' | 'steps'>): boolean {
  if (form.title.trim() !== lesson.title || form.summary.trim() !== lesson.summary || form.steps.length !== lesson.steps.length) return true;
  return form.steps.some((s, i) => s.title.trim() !== lesson.steps[i].title || s.body.trim() !== lesson.steps[i].body);
}
