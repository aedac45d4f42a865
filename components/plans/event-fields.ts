/**
 * Plan events as form fields and words (pure, no React Native), for every kind at once: the
 * kinds themselves live in `event-kinds.ts`; this module turns typed text into an event
 * (validated with the engine's `eventSchema`, errors by field) and an event into words.
 */
import { eventSchema, type ScenarioEvent } from '@/simulation/scenario';
import { fieldErrors } from '@/shared/api-error';
import { DAY_FIELD, EVENT_KINDS, kindFor, num, type EventFields, type EventType, type FieldSpec } from '@/components/plans/event-kinds';

export type { EventFields, EventType, FieldSpec } from '@/components/plans/event-kinds';

const TYPES = Object.keys(EVENT_KINDS) as EventType[];

/** The event kinds in the order the form offers them. */
export const EVENT_TYPES: readonly { type: EventType; label: string }[] = TYPES.map((type) => ({ type, label: EVENT_KINDS[type].label }));

/** Each kind's form fields, the day first. */
export const FIELDS = Object.fromEntries(TYPES.map((type) => [type, [DAY_FIELD, ...EVENT_KINDS[type].fields]])) as Record<EventType, FieldSpec[]>;

/** A new event's starting fields. */
export function blankFields(type: EventType, day = 0): EventFields {
  return { day: String(day), ...EVENT_KINDS[type].blank };
}

/** An event as form text. */
export function eventToFields(e: ScenarioEvent): EventFields {
  return { day: String(e.day), ...kindFor(e).toFields(e) };
}

/** Typed fields → a valid event, or errors keyed by form field. */
export function fieldsToEvent(type: EventType, f: EventFields): { event: ScenarioEvent } | { errors: Record<string, string> } {
  const kind = EVENT_KINDS[type];
  const parsed = eventSchema.safeParse({ type, day: num(f.day), ...kind.fromFields(f) });
  if (parsed.success) return { event: parsed.data };
  return { errors: eventFieldErrors(type, fieldErrors(parsed.error.issues)) };
}

/** Messages keyed by an event's schema paths (`fish.0.count`, `amount.value`) → keyed by its form fields. */
export function eventFieldErrors(type: EventType, byPath: Record<string, string>): Record<string, string> {
  const errors: Record<string, string> = {};
  for (const [path, message] of Object.entries(byPath)) {
    const field = EVENT_KINDS[type].pathToField?.[path] ?? path;
    if (!(field in errors)) errors[field] = message;
  }
  return errors;
}

/** One event in a sentence, e.g. "Add 4 Neon tetra". */
export function describeEvent(e: ScenarioEvent): string {
  return kindFor(e).sentence(e);
}

/** One event with its day, for read-only lists, e.g. "Day 3: Add 4 Neon tetra". */
export function describeEventOnDay(e: ScenarioEvent): string {
  return `Day ${e.day}: ${describeEvent(e)}`;
}
