/**
 * The engine's work budget: how much a forecast would expand to, counted from the scenario
 * alone before any timeline is built or any step is solved, so a scenario the schema accepts
 * can never make one forecast run out of memory or pin a thread (issue 11).
 *
 * The unit is a timeline entry (one dose or part of a split dose, the start or end of a
 * continuous dose, a water change, a fish change or the end of a medication, before entries
 * at the same instant merge). Measured on this engine: ~30–50 µs per entry and
 * ~30 µs per forecast day on one core, so a forecast at the cap is well under a second and a
 * 64-member band of one stays within a few seconds.
 */
// No imports: the scenario schema checks the same count, so this module must not import it.

/**
 * Most timeline entries one forecast may expand to. A year of doses four times a day (1460),
 * weekly routine water changes over ten years (520) and a full plan of 200 events all fit.
 */
export const MAX_TIMELINE_ENTRIES = 2000;

/**
 * Most work units (timeline entries + forecast days, summed over every forecast) one
 * multi-forecast request may ask for before it starts: ~5 s of one core at the ~25 µs a unit
 * measured for a 256-member year (2.3 s). A 1024-member band of a 180-day plan fits; 1024
 * members over a year (~9 s) does not, 540 do.
 */
export const MAX_ENSEMBLE_WORK = 200_000;

/** What the count needs of a scenario (structural, so a raw or parsed scenario both fit). */
export interface BudgetScenario {
  tank: { routineWaterChange?: { everyDays: number } };
  events: readonly (
    | { type: 'ammonia-dose'; day: number; repeatEveryDays?: number; repeatCount?: number; timesPerDay?: number; delivery?: string }
    | { type: string; day: number }
  )[];
}

export interface TimelineCount {
  /** Timeline entries the forecast would build. */
  entries: number;
  /** The field that adds the most entries (a zod issue path; ScenarioError names it dot-joined). */
  largest: { path: (string | number)[]; entries: number };
}

type BudgetDose = Extract<BudgetScenario['events'][number], { type: 'ammonia-dose' }>;
const isDose = (e: BudgetScenario['events'][number]): e is BudgetDose => e.type === 'ammonia-dose';

/**
 * Entries a dose adds within the horizon, as simulation/timeline.ts `doseParts` expands it (at
 * most that many): per repeat `timesPerDay` pulses, or a flow's start and end (daily flows are
 * one stretch: two entries in all).
 */
function doseEntries(e: BudgetDose, horizonDays: number): number {
  const every = e.repeatEveryDays;
  const fit = every !== undefined && every > 0 ? Math.floor((horizonDays - e.day) / every + 1e-9) + 1 : 1;
  const repeats = every === undefined || e.repeatCount === undefined ? fit : Math.min(fit, e.repeatCount);
  if (e.delivery === 'continuous') return every !== undefined && Math.abs(every - 1) < 1e-9 ? 2 : 2 * repeats;
  return repeats * Math.max(1, e.timesPerDay ?? 1);
}

/** Entries one event adds within the horizon (repeats past it are dropped, as the timeline does). */
function eventEntries(e: BudgetScenario['events'][number], horizonDays: number): number {
  if (e.day > horizonDays) return 0;
  if (isDose(e)) return doseEntries(e, horizonDays);
  // A medication or aeration loss also ends inside the horizon (at most one more entry).
  return e.type === 'medication' || e.type === 'aeration-loss' ? 2 : 1;
}

/** The field to name when a dose adds the most entries: its split, else its repeat. */
function dosePath(e: BudgetDose, i: number): (string | number)[] {
  return ['events', i, (e.timesPerDay ?? 1) > 1 && e.delivery !== 'continuous' ? 'timesPerDay' : 'repeatEveryDays'];
}

/** Counts the timeline entries of a scenario over a horizon, without building them. */
export function countTimelineEntries(scenario: BudgetScenario, horizonDays: number): TimelineCount {
  let entries = 0;
  let largest: TimelineCount['largest'] = { path: ['events'], entries: 0 };
  scenario.events.forEach((e, i) => {
    const n = eventEntries(e, horizonDays);
    entries += n;
    if (n > largest.entries) largest = { path: n > 1 && isDose(e) ? dosePath(e, i) : ['events'], entries: n };
  });
  const routine = scenario.tank.routineWaterChange;
  if (routine && routine.everyDays > 0) {
    const n = Math.floor(horizonDays / routine.everyDays + 1e-9);
    entries += n;
    if (n > largest.entries) largest = { path: ['tank', 'routineWaterChange', 'everyDays'], entries: n };
  }
  return { entries, largest };
}

/** The message for a scenario over the cap (one wording for the schema and the engine). */
export function overBudgetMessage(count: TimelineCount, horizonDays: number): string {
  return (
    `This expands to ${count.entries} timeline entries over ${horizonDays} days; at most ${MAX_TIMELINE_ENTRIES} per forecast. ` +
    'Repeat less often, split doses into fewer parts (or give them continuously), give a repeat count, or shorten the plan.'
  );
}

/**
 * The fields (path → message, as ScenarioError takes them) of a forecast above the budget, or
 * null when it fits. The engine throws them before building the timeline.
 */
export function overBudgetFields(scenario: BudgetScenario, horizonDays: number): Record<string, string> | null {
  const count = countTimelineEntries(scenario, horizonDays);
  return count.entries > MAX_TIMELINE_ENTRIES ? { [count.largest.path.join('.')]: overBudgetMessage(count, horizonDays) } : null;
}

/** Work units of one forecast: its timeline entries and its days. */
export function forecastWork(scenario: BudgetScenario, horizonDays: number): number {
  return countTimelineEntries(scenario, horizonDays).entries + Math.ceil(horizonDays);
}

/**
 * The fields of a request for `forecasts` forecasts of the scenario (an ensemble, a plan's band)
 * above MAX_ENSEMBLE_WORK, naming `field` (the count the caller chose, e.g. "members"), or null.
 */
export function overEnsembleBudgetFields(scenario: BudgetScenario, horizonDays: number, forecasts: number, field: string): Record<string, string> | null {
  const single = overBudgetFields(scenario, horizonDays);
  if (single) return single;
  const each = forecastWork(scenario, horizonDays);
  if (each * forecasts <= MAX_ENSEMBLE_WORK) return null;
  const most = Math.max(1, Math.floor(MAX_ENSEMBLE_WORK / each));
  return { [field]: `At most ${most} for a forecast of ${horizonDays} days with these events (the engine's work budget); choose fewer or a shorter horizon.` };
}
