/**
 * Plan events as form fields and words (pure, no React Native): what each event type is
 * called, the text fields its form shows, turning typed text into an event (validated with the
 * engine's `eventSchema`, errors by field) and describing an event in a sentence.
 */
import { eventSchema, type ScenarioEvent } from '@/simulation/scenario';
import { fieldErrors } from '@/shared/api-error';
import { findSpecies } from '@/simulation/catalogue';
import { parseDecimal } from '@/lib/units-format';

export type EventType = ScenarioEvent['type'];

export const EVENT_TYPES: readonly { type: EventType; label: string }[] = [
  { type: 'add-fish', label: 'Add fish' },
  { type: 'remove-fish', label: 'Rehome fish' },
  { type: 'move-fish', label: 'Move fish' },
  { type: 'feeding', label: 'Feeding' },
  { type: 'water-change', label: 'Water change' },
  { type: 'ammonia-dose', label: 'Ammonia dose' },
  { type: 'filter-clean', label: 'Media rinse' },
  { type: 'medication', label: 'Medication' },
  { type: 'temperature', label: 'Temperature' },
  { type: 'aeration-loss', label: 'Aeration loss' },
];

export interface FieldSpec {
  key: string;
  label: string;
  hint?: string;
  numeric: boolean;
}

const DAY: FieldSpec = { key: 'day', label: 'Day', hint: 'Days from the plan start (0 = the first day)', numeric: true };
const SPECIES: FieldSpec = { key: 'species', label: 'Species', hint: 'A catalogue species, e.g. neon-tetra, or your own name', numeric: false };
const COUNT: FieldSpec = { key: 'count', label: 'How many', numeric: true };

export const FIELDS: Record<EventType, FieldSpec[]> = {
  'add-fish': [DAY, SPECIES, COUNT, { key: 'lengthCm', label: 'Length (cm)', hint: 'Optional for catalogue species', numeric: true }],
  'remove-fish': [DAY, SPECIES, COUNT],
  'move-fish': [DAY, { key: 'direction', label: 'Direction', hint: 'in or out', numeric: false }, SPECIES, COUNT, { key: 'otherTank', label: 'Other tank', numeric: false }],
  feeding: [DAY, { key: 'gramsPerDay', label: 'Food a day (g)', numeric: true }],
  'water-change': [DAY, { key: 'percent', label: 'Water changed (%)', numeric: true }],
  'ammonia-dose': [
    DAY,
    { key: 'mgNPerL', label: 'Dose (mg N/L)', hint: 'Ammonia as nitrogen per litre of tank water', numeric: true },
    { key: 'repeatEveryDays', label: 'Repeat every (days)', hint: 'Leave empty for one dose', numeric: true },
    { key: 'repeatCount', label: 'Doses in all', numeric: true },
  ],
  'filter-clean': [
    DAY,
    { key: 'zoneId', label: 'Where', hint: 'filter, substrate or surfaces', numeric: false },
    { key: 'action', label: 'Rinse or replace', hint: 'rinse or replace', numeric: false },
    { key: 'percentLost', label: 'Nitrifiers lost (%)', numeric: true },
  ],
  medication: [
    DAY,
    { key: 'name', label: 'Medicine', numeric: false },
    { key: 'durationDays', label: 'Lasts (days)', numeric: true },
    { key: 'activityPercent', label: 'Nitrifier activity left (%)', hint: '100 = harmless to the biofilter, 0 = stops it', numeric: true },
  ],
  temperature: [DAY, { key: 'temperatureC', label: 'New temperature (°C)', numeric: true }],
  'aeration-loss': [
    DAY,
    { key: 'durationDays', label: 'Lasts (days)', numeric: true },
    { key: 'oxygenPercent', label: 'Oxygen left (%)', numeric: true },
  ],
};

export type EventFields = Record<string, string>;

const s = (x: number | string | undefined) => (x === undefined ? '' : String(x));

/** A new event's starting fields. */
export function blankFields(type: EventType, day = 0): EventFields {
  const base: EventFields = { day: String(day) };
  switch (type) {
    case 'add-fish':
    case 'remove-fish':
      return { ...base, species: '', count: '' };
    case 'move-fish':
      return { ...base, direction: 'in', species: '', count: '' };
    case 'water-change':
      return { ...base, percent: '25' };
    case 'ammonia-dose':
      return { ...base, mgNPerL: '1', repeatEveryDays: '', repeatCount: '' };
    case 'filter-clean':
      return { ...base, zoneId: 'filter', action: 'rinse', percentLost: '30' };
    case 'medication':
      return { ...base, durationDays: '5', activityPercent: '50' };
    case 'aeration-loss':
      return { ...base, durationDays: '1', oxygenPercent: '50' };
    default:
      return base;
  }
}

/** An event as form text. */
export function eventToFields(e: ScenarioEvent): EventFields {
  const day = { day: s(e.day) };
  switch (e.type) {
    case 'add-fish':
      return { ...day, species: e.fish.species ?? e.fish.name ?? '', count: s(e.fish.count), lengthCm: s(e.fish.lengthCm) };
    case 'remove-fish':
      return { ...day, species: e.species ?? e.name ?? '', count: s(e.count) };
    case 'move-fish':
      return { ...day, direction: e.direction, species: e.fish.species ?? e.fish.name ?? '', count: s(e.fish.count), otherTank: e.otherTank ?? '' };
    case 'feeding':
      return { ...day, gramsPerDay: e.feeding.mode === 'grams' ? s(e.feeding.gramsPerDay) : '' };
    case 'water-change':
      return { ...day, percent: s(e.percent) };
    case 'ammonia-dose':
      return { ...day, mgNPerL: e.amount.unit === 'mgN-per-L' ? s(e.amount.value) : '', repeatEveryDays: s(e.repeatEveryDays), repeatCount: s(e.repeatCount) };
    case 'filter-clean':
      return { ...day, zoneId: e.zoneId, action: e.action, percentLost: s(Math.round(e.shareLost * 100)) };
    case 'medication':
      return { ...day, name: e.name ?? '', durationDays: s(e.durationDays), activityPercent: s(Math.round(e.oxidationMultiplier * 100)) };
    case 'temperature':
      return { ...day, temperatureC: s(e.temperatureC) };
    case 'aeration-loss':
      return { ...day, durationDays: s(e.durationDays), oxygenPercent: s(Math.round(e.oxygenShare * 100)) };
  }
}

/** Typed text → number; empty → undefined; unreadable → NaN (the schema then names the field). */
function num(text: string | undefined): number | undefined {
  const v = parseDecimal(text ?? '');
  return v === null ? undefined : v;
}

function fish(f: EventFields): { species?: string; name?: string; count?: number; lengthCm?: number } {
  const name = (f.species ?? '').trim();
  const known = findSpecies(name);
  return { species: known ? name : undefined, name: known ? undefined : name || undefined, count: num(f.count), lengthCm: num(f.lengthCm) };
}

/** Form field behind each schema path, so a schema error shows under the right field. */
const PATH_TO_FIELD: Record<string, string> = {
  'fish.count': 'count',
  'fish.lengthCm': 'lengthCm',
  'fish.species': 'species',
  'fish.name': 'species',
  'fish.massG': 'lengthCm',
  name: 'species',
  'feeding.gramsPerDay': 'gramsPerDay',
  'amount.value': 'mgNPerL',
  shareLost: 'percentLost',
  oxidationMultiplier: 'activityPercent',
  oxygenShare: 'oxygenPercent',
};

/** Typed fields → a valid event, or errors keyed by form field. */
export function fieldsToEvent(type: EventType, f: EventFields): { event: ScenarioEvent } | { errors: Record<string, string> } {
  const day = num(f.day);
  const pct = (t: string | undefined) => {
    const v = num(t);
    return v === undefined ? undefined : v / 100;
  };
  let raw: Record<string, unknown>;
  switch (type) {
    case 'add-fish':
      raw = { type, day, fish: fish(f) };
      break;
    case 'remove-fish': {
      const fi = fish(f);
      raw = { type, day, species: fi.species, name: fi.name, count: fi.count };
      break;
    }
    case 'move-fish':
      raw = { type, day, direction: (f.direction ?? '').trim(), otherTank: f.otherTank?.trim() || undefined, fish: fish(f) };
      break;
    case 'feeding':
      raw = { type, day, feeding: { mode: 'grams', gramsPerDay: num(f.gramsPerDay) } };
      break;
    case 'water-change':
      raw = { type, day, percent: num(f.percent) };
      break;
    case 'ammonia-dose':
      raw = { type, day, amount: { unit: 'mgN-per-L', value: num(f.mgNPerL) }, repeatEveryDays: num(f.repeatEveryDays), repeatCount: num(f.repeatCount) };
      break;
    case 'filter-clean':
      raw = { type, day, zoneId: (f.zoneId ?? '').trim() || 'filter', action: (f.action ?? '').trim(), shareLost: pct(f.percentLost) };
      break;
    case 'medication':
      raw = { type, day, name: f.name?.trim() || undefined, durationDays: num(f.durationDays), oxidationMultiplier: pct(f.activityPercent) };
      break;
    case 'temperature':
      raw = { type, day, temperatureC: num(f.temperatureC) };
      break;
    case 'aeration-loss':
      raw = { type, day, durationDays: num(f.durationDays), oxygenShare: pct(f.oxygenPercent) };
      break;
  }
  const parsed = eventSchema.safeParse(raw);
  if (parsed.success) {
    if (parsed.data.type === 'remove-fish' && !parsed.data.species && !parsed.data.name) return { errors: { species: 'Say which fish.' } };
    return { event: parsed.data };
  }
  const errors: Record<string, string> = {};
  for (const [path, message] of Object.entries(fieldErrors(parsed.error.issues))) {
    const field = PATH_TO_FIELD[path] ?? path;
    if (!(field in errors)) errors[field] = message;
  }
  return { errors };
}

function fishName(id: string | undefined, name: string | undefined): string {
  if (id) return findSpecies(id)?.commonName ?? id;
  return name ?? 'fish';
}

/** One event in a sentence, e.g. "Add 4 Harlequin rasbora". */
export function describeEvent(e: ScenarioEvent): string {
  switch (e.type) {
    case 'add-fish':
      return `Add ${e.fish.count} ${fishName(e.fish.species, e.fish.name)}`;
    case 'remove-fish':
      return `Rehome ${e.count} ${fishName(e.species, e.name)}`;
    case 'move-fish':
      return `Move ${e.fish.count} ${fishName(e.fish.species, e.fish.name)} ${e.direction === 'in' ? 'in from' : 'out to'} ${e.otherTank || 'another tank'}`;
    case 'feeding':
      return e.feeding.mode === 'grams' ? `Feed ${e.feeding.gramsPerDay} g a day` : 'Feed by body mass';
    case 'water-change':
      return `Change ${e.percent} % of the water`;
    case 'ammonia-dose': {
      const dose = e.amount.unit === 'mgN-per-L' ? `${e.amount.value} mg N/L` : e.amount.unit === 'ammonium-chloride-g' ? `${e.amount.grams} g ammonium chloride` : `${e.amount.mL} mL ammonia solution`;
      const times = e.repeatEveryDays && (e.repeatCount ?? 1) > 1 ? `, every ${e.repeatEveryDays} days, ${e.repeatCount} times` : '';
      return `Dose ammonia ${dose}${times}`;
    }
    case 'filter-clean':
      return `${e.action === 'rinse' ? 'Rinse' : 'Replace'} ${e.zoneId} media (about ${Math.round(e.shareLost * 100)} % of its nitrifiers lost)`;
    case 'medication':
      return `Medicate${e.name ? ` with ${e.name}` : ''} for ${e.durationDays} days`;
    case 'temperature':
      return `Set the temperature to ${e.temperatureC} °C`;
    case 'aeration-loss':
      return `Aeration drops to ${Math.round(e.oxygenShare * 100)} % for ${e.durationDays} days`;
  }
}
