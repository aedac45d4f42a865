/**
 * A refused plan (a save the server turned down, a forecast the engine cannot run) in the
 * keeper's words (pure): messages on `events.N.…` go to that event's form fields, and every
 * message becomes a sentence that says which event or which part of the tank it is about.
 * Schema paths never reach the screen.
 */
import type { ScenarioEvent } from '@/simulation/scenario';
import { describeEventOnDay, eventFieldErrors } from '@/components/plans/event-fields';

export interface PlanErrors {
  /** Per event index: messages by form field, for the event form when that event is opened. */
  byEvent: Record<number, Record<string, string>>;
  /** One sentence per message, e.g. "Day 3: Add 10 Neon tetra: Count must be at least 1." */
  sentences: string[];
}

/** Which part of the tank a path outside the events is about. */
function placeOf(path: string): string | null {
  if (path === '_' || path === '') return null;
  if (path.startsWith('fish.')) return "The tank's fish";
  if (path.startsWith('tank.') || path === 'volumeL') return 'The tank';
  if (path.startsWith('start')) return "The tank's starting state";
  return null;
}

/** `fields` from an ApiError or a ScenarioError; `skip` are paths another field already shows (the plan name). */
export function planErrors(fields: Record<string, string>, events: readonly ScenarioEvent[], skip: readonly string[] = []): PlanErrors {
  const byPath: Record<number, Record<string, string>> = {};
  const sentences: string[] = [];
  for (const [path, message] of Object.entries(fields)) {
    if (skip.includes(path)) continue;
    const m = /^events\.(\d+)(?:\.(.+))?$/.exec(path);
    const event = m ? events[Number(m[1])] : undefined;
    if (m && event) {
      const i = Number(m[1]);
      (byPath[i] ??= {})[m[2] ?? '_'] = message;
      sentences.push(`${describeEventOnDay(event)}: ${message}`);
      continue;
    }
    const place = m ? 'One of the events' : placeOf(path);
    sentences.push(place ? `${place}: ${message}` : message);
  }
  const byEvent = Object.fromEntries(Object.entries(byPath).map(([i, errs]) => [i, eventFieldErrors(events[Number(i)]!.type, errs)]));
  return { byEvent, sentences };
}
