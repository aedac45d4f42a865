/**
 * The lesson builder's form ↔ the API's lesson input (pure, tested in tests/unit, no React
 * Native). A mentor types a tank in their own units, the fish already in it, one or two
 * timelines of events (the plan editor's event form makes those, already valid) and a short
 * story; `buildLessonInput` turns that into a `CreateLessonInput` and checks it with the shared
 * `createLessonSchema`, every message keyed by the form field that shows it.
 */
import { fieldErrors } from '@/shared/api-error';
import { createLessonSchema, LESSON_MAX_STEPS, type CreateLessonInput, type LessonKind } from '@/shared/schemas/lesson';
import type { UnitPreferences } from '@/shared/schemas/preferences';
import type { ScenarioEvent, ScenarioInput } from '@/simulation/scenario';
import { defaultSetup, TANK_DEFAULTS } from '@/shared/schemas/tank';
import { defaultHorizonDays } from '@/shared/tank-scenario';
import { findSpecies } from '@/simulation/catalogue';
import { zonesFromDescription, type FilterKind } from '@/simulation/presets';
import { parseDecimal, temperatureInputText, temperatureToCelsius, volumeInputText, volumeToLitres } from '@/lib/units-format';

/** The most steps a lesson may have (the shared lesson schema's limit). */
export const MAX_LESSON_STEPS = LESSON_MAX_STEPS;

export const SUBSTRATE_CHOICES = ['bare', 'sand', 'gravel'] as const;
export type LessonSubstrate = (typeof SUBSTRATE_CHOICES)[number];

/** How the tank starts: settled (its biofilter sized to the fish already in it) or brand new. */
export const START_CHOICES = ['mature', 'new'] as const;
export type LessonStart = (typeof START_CHOICES)[number];

/** The guess step every lesson can use; the player shows the guess chart beside the story. */
export const GUESS_STEP = { title: 'Your guess', body: 'Drag the marker to the day and height where you think nitrite will peak.' } as const;

/** Names a comparison's two forecasts get when the mentor gives none (the player shows them). */
export const DEFAULT_FAST_NAME = 'All at once';
export const DEFAULT_STAGED_NAME = 'In stages';

/** Substrate depth a lesson tank gets when it has one (common practice: 5 cm of gravel or sand). */
const SUBSTRATE_DEPTH_CM = 5;

export interface LessonFishRow {
  /** A catalogue id, e.g. "neon-tetra". */
  species: string;
  count: string;
}

export interface LessonTankForm {
  /** In the person's volume unit. */
  volume: string;
  /** In the person's temperature unit. */
  temperature: string;
  ph: string;
  /** °dKH; empty = the pH is held as given. */
  kh: string;
  filterKind: FilterKind;
  substrate: LessonSubstrate;
  start: LessonStart;
  /** Routine water change, % of the water every `waterChangeEveryDays`; 0 = none. */
  waterChangePercent: string;
  waterChangeEveryDays: string;
  fish: LessonFishRow[];
}

export interface LessonStepForm {
  title: string;
  body: string;
}

export interface LessonBuilderForm {
  clubId: string;
  title: string;
  summary: string;
  kind: LessonKind;
  tank: LessonTankForm;
  /** Names the learner sees above each forecast: "all at once" and (compare) "staged". */
  fastName: string;
  stagedName: string;
  events: ScenarioEvent[];
  stagedEvents: ScenarioEvent[];
  steps: LessonStepForm[];
  /** Forecast days; empty = automatic (three weeks after the last event, 30–365). */
  horizon: string;
}

/** A typical settled 120 L community tank (common practice sizes; TANK_DEFAULTS for the water). */
export function emptyLessonForm(units: UnitPreferences, clubId = ''): LessonBuilderForm {
  return {
    clubId,
    title: '',
    summary: '',
    kind: 'single',
    tank: {
      volume: volumeInputText(120, units.volumeUnit),
      temperature: temperatureInputText(TANK_DEFAULTS.temperatureC, units.temperatureUnit),
      ph: String(TANK_DEFAULTS.ph),
      kh: '',
      filterKind: TANK_DEFAULTS.filterKind,
      substrate: 'gravel',
      start: 'mature',
      waterChangePercent: String(TANK_DEFAULTS.routineWaterChange.percent),
      waterChangeEveryDays: String(TANK_DEFAULTS.routineWaterChange.everyDays),
      fish: [{ species: 'neon-tetra', count: '8' }],
    },
    fastName: '',
    stagedName: '',
    events: [],
    stagedEvents: [],
    steps: [{ title: '', body: '' }, { ...GUESS_STEP }],
    horizon: '',
  };
}

// ---- Steps ------------------------------------------------------------------------------------

export function addStep(steps: readonly LessonStepForm[]): LessonStepForm[] {
  return steps.length >= MAX_LESSON_STEPS ? [...steps] : [...steps, { title: '', body: '' }];
}

export function removeStep(steps: readonly LessonStepForm[], index: number): LessonStepForm[] {
  return steps.filter((_, i) => i !== index);
}

/** Moves step `index` one place up (-1) or down (+1); out-of-range moves change nothing. */
export function moveStep(steps: readonly LessonStepForm[], index: number, by: -1 | 1): LessonStepForm[] {
  const to = index + by;
  if (index < 0 || index >= steps.length || to < 0 || to >= steps.length) return [...steps];
  const out = [...steps];
  [out[index], out[to]] = [out[to], out[index]];
  return out;
}

// ---- Staging ----------------------------------------------------------------------------------

/**
 * The "staged" timeline made from the fast one: every fish addition split into `batches`
 * batches `everyDays` apart (the first on the original day; larger batches first when the count
 * does not divide). Other events are kept as they are. Sorted by day.
 */
export function splitAdditions(events: readonly ScenarioEvent[], batches: number, everyDays: number): ScenarioEvent[] {
  const out: ScenarioEvent[] = [];
  for (const e of events) {
    const most = e.type === 'add-fish' ? Math.max(...e.fish.map((g) => g.count)) : 0;
    if (e.type !== 'add-fish' || batches < 2 || most < 2) {
      out.push(structuredClone(e));
      continue;
    }
    // Each kind of fish is split on its own; a batch carries every kind that still has fish.
    const n = Math.min(batches, most);
    for (let i = 0; i < n; i++) {
      const fish = e.fish
        .map((g) => {
          const k = Math.min(n, g.count);
          return { ...structuredClone(g), count: i < k ? Math.floor(g.count / k) + (i < g.count % k ? 1 : 0) : 0 };
        })
        .filter((g) => g.count > 0);
      out.push({ ...structuredClone(e), day: e.day + i * everyDays, fish });
    }
  }
  return out.map((e, i) => ({ e, i })).sort((a, b) => a.e.day - b.e.day || a.i - b.i).map(({ e }) => e);
}

/** The staged timeline from typed batch settings, or the message why not (shown under the shortcut). */
export function stagedFromFast(fast: readonly ScenarioEvent[], batchesText: string, everyText: string): { events: ScenarioEvent[] } | { error: string } {
  const n = parseDecimal(batchesText);
  const d = parseDecimal(everyText);
  if (n === null || !Number.isInteger(n) || n < 2 || n > 10) return { error: 'Batches: a whole number from 2 to 10.' };
  if (d === null || !(d >= 1) || d > 60) return { error: 'Days apart: from 1 to 60.' };
  if (!fast.some((e) => e.type === 'add-fish')) return { error: 'The fast timeline has no fish addition to split.' };
  return { events: splitAdditions(fast, n, d) };
}

// ---- Form → request ---------------------------------------------------------------------------

export type LessonFormErrors = Record<string, string>;

/** Drops the messages of a field just edited, and of its parts (`steps` → `steps.0.title`); same object when none. */
export function clearTouched(errors: Readonly<LessonFormErrors>, touched: string): LessonFormErrors {
  const next = Object.fromEntries(Object.entries(errors).filter(([k]) => k !== touched && !k.startsWith(`${touched}.`)));
  return Object.keys(next).length === Object.keys(errors).length ? (errors as LessonFormErrors) : next;
}

/** The form field behind a request path (client zod or server 400), or null when none shows it. */
export function lessonFieldFor(path: string): string | null {
  const direct: Record<string, string> = {
    title: 'title',
    summary: 'summary',
    kind: 'kind',
    steps: 'steps',
    stagedScenario: 'stagedEvents',
    scenario: 'events',
    'scenario.name': 'fastName',
    'stagedScenario.name': 'stagedName',
  };
  if (path in direct) return direct[path];
  let m = /^steps\.(\d+)\.(title|body)$/.exec(path);
  if (m) return `steps.${m[1]}.${m[2]}`;
  m = /^(scenario|stagedScenario)\.(.+)$/.exec(path);
  if (!m) return null;
  const rest = m[2];
  const tankField: Record<string, string> = {
    'tank.volumeL': 'tank.volume',
    'tank.temperatureC': 'tank.temperature',
    'tank.ph': 'tank.ph',
    'tank.khDegrees': 'tank.kh',
    'tank.routineWaterChange.percent': 'tank.waterChangePercent',
    'tank.routineWaterChange.everyDays': 'tank.waterChangeEveryDays',
    horizonDays: 'horizon',
  };
  if (rest in tankField) return tankField[rest];
  const fish = /^fish\.(\d+)\.(count|species)/.exec(rest);
  if (fish) return `tank.fish.${fish[1]}.${fish[2]}`;
  // An event past the horizon: the horizon field says so (the events were valid when added).
  if (/^events\.\d+\.day$/.test(rest)) return 'horizon';
  if (rest.startsWith('events')) return m[1] === 'scenario' ? 'events' : 'stagedEvents';
  return null;
}

/** Request field messages → form field messages, and the rest for a banner. */
export function mapLessonErrors(fields: Readonly<Record<string, string>>): { fields: LessonFormErrors; other: string[] } {
  const out: LessonFormErrors = {};
  const other: string[] = [];
  for (const [path, message] of Object.entries(fields)) {
    const field = lessonFieldFor(path);
    if (field === null) other.push(message);
    else if (!(field in out)) out[field] = message;
  }
  return { fields: out, other };
}

/**
 * Where the messages are, in the form's order and words ("Title", "The tank", "Step 2"), for the
 * banner beside the save button: on a phone the fields may be far above it.
 */
export function errorPlaces(errors: Readonly<LessonFormErrors>): string[] {
  const place = (key: string): [number, string] => {
    if (key === 'clubId') return [0, 'Club'];
    if (key === 'title') return [1, 'Title'];
    if (key === 'summary') return [2, 'Summary'];
    if (key.startsWith('tank.')) return [3, 'The tank'];
    if (['events', 'stagedEvents', 'horizon', 'fastName', 'stagedName'].includes(key)) return [4, 'What happens when'];
    const step = /^steps\.(\d+)\./.exec(key);
    if (step) return [5 + Number(step[1]), `Step ${Number(step[1]) + 1}`];
    if (key === 'steps') return [100, 'The story'];
    return [200, 'The lesson'];
  };
  const seen = new Map<string, number>();
  for (const key of Object.keys(errors)) {
    const [order, name] = place(key);
    if (!seen.has(name)) seen.set(name, order);
  }
  return [...seen.entries()].sort((a, b) => a[1] - b[1]).map(([name]) => name);
}

type Parsed = { value: number | undefined; error?: string };

/** Typed text → number: empty is allowed only when `optional`; unreadable text gets a message. */
function readNumber(text: string, what: string, optional = false): Parsed {
  const v = parseDecimal(text);
  if (v === null) return optional ? { value: undefined } : { value: undefined, error: `Enter ${what}.` };
  if (Number.isNaN(v)) return { value: undefined, error: `Enter ${what} as a number, like 25 or 7.2.` };
  return { value: v };
}

/** The tank part of the scenario (same for both timelines of a comparison). */
function tankScenarioPart(t: LessonTankForm, units: UnitPreferences, errors: LessonFormErrors): Omit<ScenarioInput, 'events' | 'horizonDays' | 'name'> | null {
  const volume = readNumber(t.volume, 'the volume');
  const temperature = readNumber(t.temperature, 'a temperature');
  const ph = readNumber(t.ph, 'a pH');
  const kh = readNumber(t.kh, 'KH', true);
  const wcPercent = readNumber(t.waterChangePercent, 'a percentage (0 for none)');
  const wcEvery = readNumber(t.waterChangeEveryDays, 'a number of days', wcPercent.value === 0);
  const parsed: [string, Parsed][] = [
    ['tank.volume', volume],
    ['tank.temperature', temperature],
    ['tank.ph', ph],
    ['tank.kh', kh],
    ['tank.waterChangePercent', wcPercent],
    ['tank.waterChangeEveryDays', wcEvery],
  ];
  for (const [key, p] of parsed) if (p.error) errors[key] = p.error;
  const fish: { species: string; count: number }[] = [];
  t.fish.forEach((row, i) => {
    if (!findSpecies(row.species)) errors[`tank.fish.${i}.species`] = 'Choose a species from the list.';
    const count = readNumber(row.count, 'how many');
    if (count.error) errors[`tank.fish.${i}.count`] = count.error;
    fish.push({ species: row.species, count: count.value ?? Number.NaN });
  });
  if (parsed.some(([, p]) => p.error) || Object.keys(errors).some((k) => k.startsWith('tank.fish.'))) return null;

  const volumeL = volumeToLitres(volume.value!, units.volumeUnit);
  // Zones from the plain description (filter preset, substrate, some rock and wood). A volume
  // of 0 or less still needs zones to reach the schema, which then names the volume field.
  const setup = defaultSetup(volumeL > 0 ? volumeL : 1, t.filterKind);
  const { zones, aeration } = zonesFromDescription({
    volumeL: volumeL > 0 ? volumeL : 1,
    filter: { kind: t.filterKind, mediaVolumeL: setup.filter!.mediaVolumeL },
    substrate: t.substrate === 'bare' ? 'bare' : { grain: t.substrate, depthCm: SUBSTRATE_DEPTH_CM },
    hardscape: 'some',
  });
  return {
    tank: {
      volumeL,
      temperatureC: temperatureToCelsius(temperature.value!, units.temperatureUnit),
      ph: ph.value!,
      ...(kh.value !== undefined && kh.value > 0 ? { khDegrees: kh.value } : {}),
      zones,
      aeration,
      ...(wcPercent.value! > 0 ? { routineWaterChange: { percent: wcPercent.value!, everyDays: wcEvery.value! } } : {}),
    },
    start: { kind: t.start },
    fish,
    feeding: { mode: 'body-mass' },
  };
}

/** The forecast length: typed, or three weeks after the last event of either timeline. */
export function horizonOf(form: Pick<LessonBuilderForm, 'horizon' | 'events' | 'stagedEvents' | 'kind'>): number | null {
  const typed = parseDecimal(form.horizon);
  if (typed === null) return defaultHorizonDays(form.kind === 'compare' ? [...form.events, ...form.stagedEvents] : form.events);
  return Number.isNaN(typed) ? null : typed;
}

export type BuildResult =
  | { ok: true; clubId: string; input: CreateLessonInput }
  | { ok: false; errors: LessonFormErrors; other: string[] };

/** The scenarios a form describes (also used by the live preview), or the messages why not. */
export type ScenarioParts = Pick<LessonBuilderForm, 'tank' | 'kind' | 'events' | 'stagedEvents' | 'horizon' | 'fastName' | 'stagedName'>;

export function lessonScenarios(
  form: ScenarioParts,
  units: UnitPreferences,
): { ok: true; scenario: ScenarioInput; stagedScenario?: ScenarioInput } | { ok: false; errors: LessonFormErrors } {
  const errors: LessonFormErrors = {};
  const base = tankScenarioPart(form.tank, units, errors);
  const horizonDays = horizonOf(form);
  if (horizonDays === null) errors.horizon = 'Enter the number of days, like 42, or leave it empty.';
  if (!base || horizonDays === null) return { ok: false, errors };
  const compare = form.kind === 'compare';
  const named = (name: string, fallback: string) => (name.trim() ? { name: name.trim() } : compare ? { name: fallback } : {});
  const scenario: ScenarioInput = { ...structuredClone(base), ...named(form.fastName, DEFAULT_FAST_NAME), events: form.events.map((e) => structuredClone(e)), horizonDays };
  if (!compare) return { ok: true, scenario };
  return {
    ok: true,
    scenario,
    stagedScenario: { ...structuredClone(base), ...named(form.stagedName, DEFAULT_STAGED_NAME), events: form.stagedEvents.map((e) => structuredClone(e)), horizonDays },
  };
}

/**
 * Form → request, checked with the shared schema. Messages are keyed by form field
 * (`title`, `tank.volume`, `steps.1.body`, `horizon`, …); anything no field shows goes to `other`.
 */
export function buildLessonInput(form: LessonBuilderForm, units: UnitPreferences): BuildResult {
  const errors: LessonFormErrors = {};
  if (!form.clubId) errors.clubId = 'Choose the club this lesson is for.';
  if (form.kind === 'compare' && form.stagedEvents.length === 0) errors.stagedEvents = 'Add the staged timeline (or copy the first one and split it).';
  if (form.events.length === 0) errors.events = 'Add at least one event, like fish arriving.';
  const scenarios = lessonScenarios(form, units);
  if (!scenarios.ok) Object.assign(errors, scenarios.errors);

  const raw: CreateLessonInput = {
    title: form.title,
    summary: form.summary,
    kind: form.kind,
    ...(scenarios.ok ? { scenario: scenarios.scenario } : {}),
    ...(scenarios.ok && scenarios.stagedScenario ? { stagedScenario: scenarios.stagedScenario } : {}),
    steps: form.steps.map((s) => ({ title: s.title, body: s.body })),
  };
  const checked = createLessonSchema.safeParse(raw);
  const other: string[] = [];
  if (!checked.success) {
    const mapped = mapLessonErrors(fieldErrors(checked.error.issues));
    for (const [k, v] of Object.entries(mapped.fields)) {
      // The tank was not built (its own messages stand); the schema's "give a scenario" adds nothing.
      if (!scenarios.ok && (k === 'events' || k === 'stagedEvents') && !(k in errors)) continue;
      if (!(k in errors)) errors[k] = v;
    }
    other.push(...mapped.other);
  }
  if (Object.keys(errors).length > 0 || other.length > 0) return { ok: false, errors, other };
  return { ok: true, clubId: form.clubId, input: raw };
}
