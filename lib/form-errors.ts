import type { z } from 'zod';
import { fieldErrors } from '@/shared/api-error';
import { ApiRequestError } from '@/lib/api-client';
import { formatWait } from '@/lib/format';

/** What a form shows after a failed submit: messages under fields, and at most one banner. */
export interface FormErrors {
  fields: Record<string, string>;
  banner: string | null;
}

export const NO_FORM_ERRORS: FormErrors = { fields: {}, banner: null };

/** Client-side check with the shared schema: the parsed value, or the messages per field. */
export function validateForm<S extends z.ZodType>(
  schema: S,
  values: unknown,
): { ok: true; data: z.infer<S> } | { ok: false; errors: FormErrors } {
  const result = schema.safeParse(values);
  if (result.success) return { ok: true, data: result.data };
  return { ok: false, errors: { fields: fieldErrors(result.error.issues), banner: null } };
}

/**
 * Sorts a failed request into field messages (for fields the form shows) and one banner
 * sentence for the rest: rate limits with their wait, network trouble, other server messages.
 */
export function formErrorsFromRequest(error: unknown, formFields: readonly string[]): FormErrors {
  if (!(error instanceof ApiRequestError)) {
    return { fields: {}, banner: 'Something went wrong. Please try again.' };
  }
  if (error.status === 429) {
    const wait = error.retryAfterSeconds;
    return { fields: {}, banner: wait === null ? error.message : `${error.message} Try again in ${formatWait(wait)}.` };
  }
  const fields: Record<string, string> = {};
  const others: string[] = [];
  for (const [key, message] of Object.entries(error.fields)) {
    if (formFields.includes(key)) fields[key] = message;
    else others.push(message);
  }
  // A banner is still needed when nothing landed on a visible field, or some message had no field.
  const banner =
    Object.keys(fields).length === 0 ? [error.message, ...others].join(' ') : others.length ? others.join(' ') : null;
  return { fields, banner };
}

/** One line for a failed request shown outside a form: the first field message, else the answer's message. */
export function requestErrorLine(e: unknown): string {
  if (e instanceof ApiRequestError) return Object.values(e.fields)[0] ?? e.message;
  return 'Something went wrong. Try again.';
}

const PLACES: Record<string, string> = { events: 'Event', livestock: 'Fish', fish: 'Fish' };

/**
 * A refusal's messages in the keeper's words, each led by where it sits when that is a numbered
 * item ("Event 2: …"), never by the request path (`events.1.fish.lengthCm`).
 */
export function placedMessages(fields: Record<string, string>): string {
  return Object.entries(fields)
    .map(([path, message]) => {
      const [head, index] = path.split('.');
      const place = PLACES[head];
      return place && /^\d+$/.test(index ?? '') ? `${place} ${Number(index) + 1}: ${message}` : message;
    })
    .join(' ');
}
