/**
 * The tank form's text values ↔ the API's tank input (pure, tested in tests/unit). What the
 * person types is in their units; the input sent is litres, °C and mg N/L. Fields left empty
 * take the newcomer defaults (shared/schemas/tank.ts `defaultSetup`, `TANK_DEFAULTS`).
 */
import { fieldErrors } from '@/shared/api-error';
import type { UnitPreferences } from '@/shared/schemas/preferences';
import { defaultSetup, tankCreateSchema, tankPatchSchema, type TankCreateInput, type TankDetail, type TankSetup } from '@/shared/schemas/tank';
import { AERATION_LEVELS, PLANTING_LEVELS } from '@/simulation/scenario';
import { FILTER_KINDS, type FilterKind } from '@/simulation/presets';
import {
  nitrogenIn,
  nitrogenToMgN,
  parseDecimal,
  temperatureInputText,
  temperatureToCelsius,
  trimNumber,
  volumeInputText,
  volumeToLitres,
} from '@/lib/units-format';

export const SUBSTRATE_CHOICES = ['bare', 'sand', 'fine-gravel', 'gravel', 'coarse-gravel'] as const;
export type SubstrateChoice = (typeof SUBSTRATE_CHOICES)[number];
export const HARDSCAPE_CHOICES = ['none', 'some', 'lots'] as const;
/** '' = whatever the filter gives by itself (the engine's filter preset). */
export const AERATION_CHOICES = ['', ...AERATION_LEVELS] as const;

export interface TankFormValues {
  name: string;
  volume: string;
  filterKind: FilterKind;
  mediaVolume: string;
  temperature: string;
  ph: string;
  kh: string;
  tapTan: string;
  tapNo2: string;
  tapNo3: string;
  substrate: SubstrateChoice;
  substrateDepthCm: string;
  hardscape: (typeof HARDSCAPE_CHOICES)[number];
  plants: (typeof PLANTING_LEVELS)[number];
  aeration: (typeof AERATION_CHOICES)[number];
  lightHours: string;
  waterChangePercent: string;
  waterChangeEveryDays: string;
  notes: string;
}

export type TankFormField = keyof TankFormValues;

/** An empty form: only a name and a volume to type; the rest shows the defaults. */
export function emptyTankForm(): TankFormValues {
  const d = defaultSetup(100);
  return {
    name: '',
    volume: '',
    filterKind: 'hang-on-back',
    mediaVolume: '',
    temperature: '',
    ph: '',
    kh: '',
    tapTan: '',
    tapNo2: '',
    tapNo3: '',
    substrate: d.substrate === 'bare' || !d.substrate ? 'bare' : d.substrate.grain,
    substrateDepthCm: '',
    hardscape: d.hardscape ?? 'some',
    plants: d.plants ?? 'none',
    aeration: '',
    lightHours: '',
    waterChangePercent: '',
    waterChangeEveryDays: '',
    notes: '',
  };
}

const num = (v: number, digits = 2) => trimNumber(v, digits);

/** A stored tank as form text, in the person's units. */
export function tankToForm(tank: TankDetail, units: UnitPreferences): TankFormValues {
  const s = tank.setup;
  const b = units.nitrogenBasis;
  return {
    name: tank.name,
    volume: volumeInputText(tank.volumeL, units.volumeUnit),
    filterKind: s.filter?.kind ?? 'hang-on-back',
    mediaVolume: s.filter ? volumeInputText(s.filter.mediaVolumeL, units.volumeUnit) : '',
    temperature: temperatureInputText(tank.temperatureC, units.temperatureUnit),
    ph: num(tank.ph),
    kh: tank.khDkh === null ? '' : num(tank.khDkh),
    tapTan: num(nitrogenIn(tank.tapWater.tanMgN, 'tanMgN', b), 3),
    tapNo2: num(nitrogenIn(tank.tapWater.no2MgN, 'no2MgN', b), 3),
    tapNo3: num(nitrogenIn(tank.tapWater.no3MgN, 'no3MgN', b), 3),
    substrate: s.substrate === undefined || s.substrate === 'bare' ? 'bare' : s.substrate.grain,
    substrateDepthCm: s.substrate && s.substrate !== 'bare' ? num(s.substrate.depthCm) : '',
    hardscape: s.hardscape ?? 'none',
    plants: s.plants ?? 'none',
    aeration: s.aeration ?? '',
    lightHours: s.lightHoursPerDay === undefined ? '' : num(s.lightHoursPerDay),
    waterChangePercent: s.routineWaterChange ? num(s.routineWaterChange.percent) : '',
    waterChangeEveryDays: s.routineWaterChange ? num(s.routineWaterChange.everyDays) : '',
    notes: tank.notes,
  };
}

/** Which form field shows the message for an API field path. */
export function formFieldFor(path: string): TankFormField | null {
  const map: Record<string, TankFormField> = {
    name: 'name',
    volumeL: 'volume',
    filterKind: 'filterKind',
    temperatureC: 'temperature',
    ph: 'ph',
    khDkh: 'kh',
    'tapWater.tanMgN': 'tapTan',
    'tapWater.no2MgN': 'tapNo2',
    'tapWater.no3MgN': 'tapNo3',
    'setup.filter.mediaVolumeL': 'mediaVolume',
    'setup.substrate.depthCm': 'substrateDepthCm',
    'setup.lightHoursPerDay': 'lightHours',
    'setup.routineWaterChange.percent': 'waterChangePercent',
    'setup.routineWaterChange.everyDays': 'waterChangeEveryDays',
    notes: 'notes',
  };
  return map[path] ?? null;
}

/** API field messages → form field messages; the rest (if any) in `other`. */
export function mapTankErrors(fields: Readonly<Record<string, string>>): { fields: Partial<Record<TankFormField, string>>; other: string[] } {
  const out: Partial<Record<TankFormField, string>> = {};
  const other: string[] = [];
  for (const [path, message] of Object.entries(fields)) {
    const f = formFieldFor(path);
    if (f && !(f in out)) out[f] = message;
    else if (!f) other.push(message);
  }
  return { fields: out, other };
}

type Result<T> = { ok: true; input: T } | { ok: false; fields: Partial<Record<TankFormField, string>>; other: string[] };

/**
 * Form text → a tank input. `mode: 'create'` leaves out empty fields (the server fills the
 * defaults); `'edit'` sends everything, empty optional fields falling back to the defaults.
 */
export function formToTankInput(
  values: TankFormValues,
  units: UnitPreferences,
  mode: 'create' | 'edit',
  /** In edit mode, the tank the form was filled from: fields left as filled keep their exact stored value. */
  original?: TankDetail,
): Result<TankCreateInput> {
  // Shown values are rounded (0.53 US gal); saving them back would shift a value nobody touched.
  const before = original ? tankToForm(original, units) : null;
  const untouched = (f: TankFormField) => before !== null && before[f] === values[f];
  const bad: Partial<Record<TankFormField, string>> = {};
  const read = (field: TankFormField): number | undefined => {
    const n = parseDecimal(values[field] as string);
    if (n === null) return undefined;
    if (Number.isNaN(n)) {
      bad[field] = 'Enter a number (digits, one decimal point).';
      return undefined;
    }
    return n;
  };
  const volume = read('volume');
  const media = read('mediaVolume');
  const temperature = read('temperature');
  const ph = read('ph');
  const kh = read('kh');
  const tap = { tan: read('tapTan'), no2: read('tapNo2'), no3: read('tapNo3') };
  const depth = read('substrateDepthCm');
  const light = read('lightHours');
  const wcPercent = read('waterChangePercent');
  const wcEvery = read('waterChangeEveryDays');
  if (volume === undefined && !bad.volume) bad.volume = 'Enter the volume.';
  if (Object.keys(bad).length > 0) return { ok: false, fields: bad, other: [] };

  const volumeL = untouched('volume') ? original!.volumeL : volume === undefined ? undefined : volumeToLitres(volume, units.volumeUnit);
  const basis = units.nitrogenBasis;
  const input: Record<string, unknown> = { name: values.name, volumeL };
  if (untouched('temperature')) input.temperatureC = original!.temperatureC;
  else if (temperature !== undefined) input.temperatureC = temperatureToCelsius(temperature, units.temperatureUnit);
  if (ph !== undefined) input.ph = ph;
  if (kh !== undefined || mode === 'edit') input.khDkh = kh ?? null;
  if (tap.tan !== undefined || tap.no2 !== undefined || tap.no3 !== undefined || mode === 'edit') {
    input.tapWater = {
      tanMgN: untouched('tapTan') ? original!.tapWater.tanMgN : nitrogenToMgN(tap.tan ?? 0, 'tanMgN', basis),
      no2MgN: untouched('tapNo2') ? original!.tapWater.no2MgN : nitrogenToMgN(tap.no2 ?? 0, 'no2MgN', basis),
      no3MgN: untouched('tapNo3') ? original!.tapWater.no3MgN : nitrogenToMgN(tap.no3 ?? 0, 'no3MgN', basis),
    };
  }
  if (values.notes.trim() !== '' || mode === 'edit') input.notes = values.notes;

  const base = defaultSetup(volumeL && volumeL > 0 ? volumeL : 100, values.filterKind);
  const setup: TankSetup = {
    filter: {
      kind: values.filterKind,
      mediaVolumeL:
        untouched('mediaVolume') && original!.setup.filter
          ? original!.setup.filter.mediaVolumeL
          : media === undefined
            ? base.filter!.mediaVolumeL
            : volumeToLitres(media, units.volumeUnit),
      // Kept from the stored setup: the form does not edit them.
      ...(original?.setup.filter?.media && original.setup.filter.kind === values.filterKind ? { media: original.setup.filter.media } : {}),
      ...(original?.setup.filter?.surfaceSkimmer !== undefined ? { surfaceSkimmer: original.setup.filter.surfaceSkimmer } : {}),
    },
    substrate: values.substrate === 'bare' ? 'bare' : { grain: values.substrate, depthCm: depth ?? 5 },
    hardscape: values.hardscape,
    plants: values.plants,
    lightHoursPerDay: light ?? base.lightHoursPerDay,
    routineWaterChange: {
      percent: wcPercent ?? original?.setup.routineWaterChange?.percent ?? base.routineWaterChange!.percent,
      everyDays: wcEvery ?? original?.setup.routineWaterChange?.everyDays ?? base.routineWaterChange!.everyDays,
    },
    ...(values.aeration ? { aeration: values.aeration } : {}),
    ...(original?.setup.zones ? { zones: original.setup.zones } : {}),
  };
  input.setup = setup;

  const schema = mode === 'create' ? tankCreateSchema : tankPatchSchema;
  const parsed = schema.safeParse(input);
  if (!parsed.success) {
    const mapped = mapTankErrors(fieldErrors(parsed.error.issues));
    // The schema speaks °C; a person typing °F gets the range in °F.
    if (mapped.fields.temperature && units.temperatureUnit === 'F') mapped.fields.temperature = 'Temperature must be 32–104 °F.';
    return { ok: false, ...mapped };
  }
  return { ok: true, input: parsed.data as TankCreateInput };
}

export const FILTER_KIND_CHOICES: readonly { value: FilterKind; label: string }[] = FILTER_KINDS.map((k) => ({
  value: k,
  label: { 'hang-on-back': 'Hang-on-back', canister: 'Canister', sponge: 'Sponge', internal: 'Internal', sump: 'Sump', trickle: 'Trickle' }[k],
}));
