/**
 * The "how fast" tab's limits (finish within so many days, at most so many batches) as typed,
 * turned into the advice request and checked with the request's own schema, so a bad value
 * gets its message next to its field before anything is sent.
 */
import type { z } from 'zod';
import { additionAdviceBodySchema } from '@/shared/schemas/plan';
import type { FishGroup } from '@/simulation/scenario';
import { validateForm } from '@/lib/form-errors';
import { parseDecimal } from '@/lib/units-format';

export type AdditionBody = z.input<typeof additionAdviceBodySchema>;

/** The limits a first answer uses (the keeper can change both). */
export const DEFAULT_SEARCH_DAYS = 60;
export const DEFAULT_MAX_BATCHES = 8;

export interface AdditionLimitsText {
  searchDays: string;
  maxBatches: string;
}

/** Request field → the form field that shows its message. */
const FIELD_OF: Record<string, keyof AdditionLimitsText> = { searchDays: 'searchDays', 'constraints.maxBatches': 'maxBatches' };

export function additionBody(
  planId: string,
  fish: FishGroup,
  text: AdditionLimitsText,
): { ok: true; body: AdditionBody } | { ok: false; fields: Partial<Record<keyof AdditionLimitsText, string>> } {
  const searchDays = parseDecimal(text.searchDays);
  const maxBatches = parseDecimal(text.maxBatches);
  const fields: Partial<Record<keyof AdditionLimitsText, string>> = {};
  if (searchDays === null || Number.isNaN(searchDays)) fields.searchDays = 'A whole number of days.';
  if (maxBatches === null || Number.isNaN(maxBatches)) fields.maxBatches = 'A whole number of batches.';
  if (Object.keys(fields).length > 0) return { ok: false, fields };
  const body: AdditionBody = { planId, fish, searchDays: searchDays!, constraints: { maxBatches: maxBatches! } };
  const checked = validateForm(additionAdviceBodySchema, body);
  if (checked.ok) return { ok: true, body };
  for (const [key, message] of Object.entries(checked.errors.fields)) {
    const field = FIELD_OF[key];
    if (field && !fields[field]) fields[field] = message;
  }
  // Anything else wrong is the plan's fish, not a field here: say so on the first field.
  if (Object.keys(fields).length === 0) fields.searchDays = Object.values(checked.errors.fields)[0] ?? 'Check these values.';
  return { ok: false, fields };
}
