/**
 * Every kind of plan event, once, on the client side: its label, the text fields its form
 * shows, its blank form, how an event becomes form text and back, and its sentence. The
 * record is typed over every engine event type, so a new kind that is missing here does not
 * compile (pure, no React Native).
 */
import { MAX_DOSES_PER_DAY, type ScenarioEvent } from '@/simulation/scenario';
import { parseDecimal } from '@/lib/units-format';
import { fieldsToGroups, groupsToFields, groupsWords, type GroupShape } from '@/components/plans/fish-groups';

export { fishName } from '@/components/plans/fish-groups';

export type EventType = ScenarioEvent['type'];
export type EventOf<T extends EventType> = Extract<ScenarioEvent, { type: T }>;
export type EventFields = Record<string, string>;

export interface FieldSpec {
  key: string;
  label: string;
  hint?: string;
  numeric: boolean;
  /** A pick among these values (radio buttons) instead of typed text. */
  choices?: readonly { value: string; label: string }[];
  /** Shown only when this holds for the form's text (absent: always). */
  shownWhen?(f: EventFields): boolean;
}

export interface EventKind<T extends EventType> {
  label: string;
  /** The form's fields after the day, in order (a fish event's group rows come after them). */
  fields: readonly FieldSpec[];
  /** Fish events: the form shows group rows (`fish.N.*`, components/plans/fish-groups.ts) of this shape. */
  groups?: GroupShape;
  /** A new event's starting text (the day is added by the caller). */
  blank: EventFields;
  toFields(e: EventOf<T>): EventFields;
  /** Form text → the raw event the engine's schema then checks (the day is added by the caller). */
  fromFields(f: EventFields): Record<string, unknown>;
  /** Schema paths of this kind that belong to a differently named form field. */
  pathToField?: Record<string, string>;
  /** The event in a sentence, e.g. "Add 4 Neon tetra". */
  sentence(e: EventOf<T>): string;
}

export const DAY_FIELD: FieldSpec = { key: 'day', label: 'Day', hint: 'Days from the plan start (0 = the first day)', numeric: true };
const LASTS: FieldSpec = { key: 'durationDays', label: 'Lasts (days)', numeric: true };

const text = (x: number | string | undefined) => (x === undefined ? '' : String(x));
const percentText = (share: number) => text(Math.round(share * 100));
const days = (n: number) => (n === 1 ? '1 day' : `${n} days`);

/** Typed text → number; empty → undefined; unreadable → NaN (the schema then names the field). */
export function num(t: string | undefined): number | undefined {
  const v = parseDecimal(t ?? '');
  return v === null ? undefined : v;
}

/** Typed percent → share of 1. */
function share(t: string | undefined): number | undefined {
  const v = num(t);
  return v === undefined ? undefined : v / 100;
}

/** How the keeper gives a dose: the form's words for the engine's `delivery` and `timesPerDay`. */
export const DOSE_DELIVERY_CHOICES = [
  { value: 'once', label: 'Once' },
  { value: 'split', label: 'N times a day' },
  { value: 'continuous', label: 'Continuous (dosing pump / drip)' },
] as const;
type DeliveryText = (typeof DOSE_DELIVERY_CHOICES)[number]['value'];

function deliveryText(e: EventOf<'ammonia-dose'>): DeliveryText {
  if (e.delivery === 'continuous') return 'continuous';
  return (e.timesPerDay ?? 1) > 1 ? 'split' : 'once';
}

/** The form's delivery → the event's fields; N times a day with no number gives NaN, which the schema names. */
function deliveryFromFields(f: EventFields): Record<string, unknown> {
  if (f.delivery === 'continuous') return { delivery: 'continuous' };
  if (f.delivery === 'split') return { timesPerDay: num(f.timesPerDay) ?? NaN };
  return {};
}

/** "1 mg N/L", "2 g ammonium chloride", "5 mL ammonia solution" */
function doseWords(a: EventOf<'ammonia-dose'>['amount']): string {
  return a.unit === 'mgN-per-L' ? `${a.value} mg N/L` : a.unit === 'ammonium-chloride-g' ? `${a.grams} g ammonium chloride` : `${a.mL} mL ammonia solution`;
}

/** A dose in a sentence: how much, how it goes in, how often. */
function doseSentence(e: EventOf<'ammonia-dose'>): string {
  const repeats = e.repeatEveryDays !== undefined && (e.repeatCount ?? 1) > 1;
  const count = e.repeatCount ?? 1;
  if (e.delivery === 'continuous') {
    const span = !repeats ? 'over one day' : e.repeatEveryDays === 1 ? `a day for ${days(count)}` : `over a day, every ${days(e.repeatEveryDays!)}, ${count} times`;
    return `Dose ammonia ${doseWords(e.amount)} ${span}, continuously (dosing pump or drip)`;
  }
  const n = e.timesPerDay ?? 1;
  const split = n > 1 ? ` in ${n} equal doses ${plainHours(24 / n)} apart` : '';
  const times = repeats ? `, every ${e.repeatEveryDays === 1 ? 'day' : days(e.repeatEveryDays!)}, ${count} times` : '';
  return `Dose ammonia ${doseWords(e.amount)}${split}${times}`;
}

/** "6 h", "4.8 h" */
function plainHours(h: number): string {
  return `${Number(h.toFixed(1))} h`;
}

export const EVENT_KINDS: { readonly [T in EventType]: EventKind<T> } = {
  'add-fish': {
    label: 'Add fish',
    fields: [],
    groups: 'sized',
    blank: groupsToFields([]),
    toFields: (e) => groupsToFields(e.fish),
    fromFields: (f) => ({ fish: fieldsToGroups(f, 'sized') }),
    sentence: (e) => `Add ${groupsWords(e.fish)}`,
  },
  'remove-fish': {
    label: 'Rehome fish',
    fields: [],
    groups: 'count-only',
    blank: groupsToFields([]),
    toFields: (e) => groupsToFields(e.fish),
    fromFields: (f) => ({ fish: fieldsToGroups(f, 'count-only') }),
    sentence: (e) => `Rehome ${groupsWords(e.fish)}`,
  },
  'move-fish': {
    label: 'Move fish',
    fields: [{ key: 'direction', label: 'Direction', hint: 'in or out', numeric: false }, { key: 'otherTank', label: 'Other tank', numeric: false }],
    groups: 'sized',
    blank: { direction: 'in', ...groupsToFields([]) },
    toFields: (e) => ({ direction: e.direction, otherTank: e.otherTank ?? '', ...groupsToFields(e.fish) }),
    fromFields: (f) => ({ direction: (f.direction ?? '').trim(), otherTank: f.otherTank?.trim() || undefined, fish: fieldsToGroups(f, 'sized') }),
    sentence: (e) => `Move ${groupsWords(e.fish)} ${e.direction === 'in' ? 'in from' : 'out to'} ${e.otherTank || 'another tank'}`,
  },
  feeding: {
    label: 'Feeding',
    fields: [{ key: 'gramsPerDay', label: 'Food a day (g)', numeric: true }],
    blank: {},
    toFields: (e) => ({ gramsPerDay: e.feeding.mode === 'grams' ? text(e.feeding.gramsPerDay) : '' }),
    fromFields: (f) => ({ feeding: { mode: 'grams', gramsPerDay: num(f.gramsPerDay) } }),
    pathToField: { 'feeding.gramsPerDay': 'gramsPerDay' },
    sentence: (e) => (e.feeding.mode === 'grams' ? `Feed ${e.feeding.gramsPerDay} g a day` : 'Feed by body mass'),
  },
  'water-change': {
    label: 'Water change',
    fields: [{ key: 'percent', label: 'Water changed (%)', numeric: true }],
    blank: { percent: '25' },
    toFields: (e) => ({ percent: text(e.percent) }),
    fromFields: (f) => ({ percent: num(f.percent) }),
    sentence: (e) => `Change ${e.percent} % of the water`,
  },
  'ammonia-dose': {
    label: 'Ammonia dose',
    fields: [
      { key: 'mgNPerL', label: 'Dose (mg N/L)', hint: 'Ammonia as nitrogen per litre of tank water; split or continuous: the whole day’s amount', numeric: true },
      { key: 'delivery', label: 'How it goes in', numeric: false, choices: DOSE_DELIVERY_CHOICES },
      {
        key: 'timesPerDay',
        label: 'Times a day',
        hint: `2 to ${MAX_DOSES_PER_DAY}, in equal parts spread evenly over the day`,
        numeric: true,
        shownWhen: (f) => f.delivery === 'split',
      },
      { key: 'repeatEveryDays', label: 'Repeat every (days)', hint: 'Leave empty for one day’s dose', numeric: true },
      { key: 'repeatCount', label: 'Doses in all', hint: 'Days of dosing, counting the first', numeric: true },
    ],
    blank: { mgNPerL: '1', delivery: 'once', timesPerDay: '4', repeatEveryDays: '', repeatCount: '' },
    toFields: (e) => ({
      mgNPerL: e.amount.unit === 'mgN-per-L' ? text(e.amount.value) : '',
      delivery: deliveryText(e),
      timesPerDay: (e.timesPerDay ?? 1) > 1 ? text(e.timesPerDay) : '4',
      repeatEveryDays: text(e.repeatEveryDays),
      repeatCount: text(e.repeatCount),
    }),
    fromFields: (f) => ({
      amount: { unit: 'mgN-per-L', value: num(f.mgNPerL) },
      ...deliveryFromFields(f),
      repeatEveryDays: num(f.repeatEveryDays),
      repeatCount: num(f.repeatCount),
    }),
    pathToField: { 'amount.value': 'mgNPerL' },
    sentence: doseSentence,
  },
  'filter-clean': {
    label: 'Media rinse',
    fields: [
      { key: 'zoneId', label: 'Where', hint: 'filter, substrate or surfaces', numeric: false },
      { key: 'action', label: 'Rinse or replace', hint: 'rinse or replace', numeric: false },
      { key: 'percentLost', label: 'Nitrifiers lost (%)', numeric: true },
    ],
    blank: { zoneId: 'filter', action: 'rinse', percentLost: '30' },
    toFields: (e) => ({ zoneId: e.zoneId, action: e.action, percentLost: percentText(e.shareLost) }),
    fromFields: (f) => ({ zoneId: (f.zoneId ?? '').trim() || 'filter', action: (f.action ?? '').trim(), shareLost: share(f.percentLost) }),
    pathToField: { shareLost: 'percentLost' },
    sentence: (e) => `${e.action === 'rinse' ? 'Rinse' : 'Replace'} ${e.zoneId} media (about ${Math.round(e.shareLost * 100)} % of its nitrifiers lost)`,
  },
  medication: {
    label: 'Medication',
    fields: [
      { key: 'name', label: 'Medicine', numeric: false },
      LASTS,
      { key: 'activityPercent', label: 'Nitrifier activity left (%)', hint: '100 = harmless to the biofilter, 0 = stops it', numeric: true },
    ],
    blank: { durationDays: '5', activityPercent: '50' },
    toFields: (e) => ({ name: e.name ?? '', durationDays: text(e.durationDays), activityPercent: percentText(e.oxidationMultiplier) }),
    fromFields: (f) => ({ name: f.name?.trim() || undefined, durationDays: num(f.durationDays), oxidationMultiplier: share(f.activityPercent) }),
    pathToField: { oxidationMultiplier: 'activityPercent' },
    sentence: (e) => `Medicate${e.name ? ` with ${e.name}` : ''} for ${days(e.durationDays)}`,
  },
  temperature: {
    label: 'Temperature',
    fields: [{ key: 'temperatureC', label: 'New temperature (°C)', numeric: true }],
    blank: {},
    toFields: (e) => ({ temperatureC: text(e.temperatureC) }),
    fromFields: (f) => ({ temperatureC: num(f.temperatureC) }),
    sentence: (e) => `Set the temperature to ${e.temperatureC} °C`,
  },
  'aeration-loss': {
    label: 'Aeration loss',
    fields: [LASTS, { key: 'oxygenPercent', label: 'Oxygen left (%)', numeric: true }],
    blank: { durationDays: '1', oxygenPercent: '50' },
    toFields: (e) => ({ durationDays: text(e.durationDays), oxygenPercent: percentText(e.oxygenShare) }),
    fromFields: (f) => ({ durationDays: num(f.durationDays), oxygenShare: share(f.oxygenPercent) }),
    pathToField: { oxygenShare: 'oxygenPercent' },
    sentence: (e) => `Aeration drops to ${Math.round(e.oxygenShare * 100)} % for ${days(e.durationDays)}`,
  },
};

/**
 * The record entry for an event's kind. TypeScript cannot tie a union member's tag to its
 * entry in a mapped record, so the one cast lives here.
 */
export function kindFor(e: ScenarioEvent): EventKind<EventType> {
  return EVENT_KINDS[e.type] as unknown as EventKind<EventType>;
}
