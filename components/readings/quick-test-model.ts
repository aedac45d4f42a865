/**
 * Quick test entry: the text a keeper types at the tank ↔ the API's reading input (pure).
 * Nitrogen values are typed in the chosen kit basis (sent as is, with the basis: the server
 * converts to mg N/L); temperature in the person's unit (converted here to °C).
 */
import { fieldErrors } from '@/shared/api-error';
import type { ReadingBasis, ReadingItem } from '@/shared/schemas/tank';
import type { TemperatureUnit } from '@/shared/schemas/preferences';
import { readingCreateSchema, type ReadingCreateInput } from '@/shared/schemas/reading';
import { nitrogenIn, parseDecimal, temperatureIn, temperatureToCelsius, trimNumber } from '@/lib/units-format';

export interface QuickTestValues {
  when: string;
  tan: string;
  no2: string;
  no3: string;
  ph: string;
  temperature: string;
  kh: string;
  note: string;
}
export type QuickTestField = keyof QuickTestValues;

export const EMPTY_QUICK_TEST: QuickTestValues = { when: '', tan: '', no2: '', no3: '', ph: '', temperature: '', kh: '', note: '' };

const pad = (n: number) => String(n).padStart(2, '0');

/** "2026-03-01 08:30" in local time. */
export function localStamp(d: Date): string {
  return `${d.getFullYear()}-${pad(d.getMonth() + 1)}-${pad(d.getDate())} ${pad(d.getHours())}:${pad(d.getMinutes())}`;
}

/** Local "YYYY-MM-DD HH:MM" (or "YYYY-MM-DD", read as noon) → ISO with offset; empty → now; else null. */
export function parseLocalStamp(text: string, now: Date): string | null {
  const t = text.trim();
  if (t === '') return now.toISOString();
  const m = /^(\d{4})-(\d{2})-(\d{2})(?:[ T](\d{1,2}):(\d{2}))?$/.exec(t);
  if (!m) return null;
  const [y, mo, d, h = '12', mi = '00'] = m.slice(1);
  const date = new Date(Number(y), Number(mo) - 1, Number(d), Number(h), Number(mi));
  if (date.getMonth() !== Number(mo) - 1 || date.getDate() !== Number(d) || Number(h) > 23) return null;
  return date.toISOString();
}

/** The last test's values as form text, in `basis` and the person's temperature unit. */
export function lastValues(r: ReadingItem, basis: ReadingBasis, unit: TemperatureUnit): Partial<QuickTestValues> {
  const n = (v: number | null, key: 'tanMgN' | 'no2MgN' | 'no3MgN') => (v === null ? '' : trimNumber(nitrogenIn(v, key, basis), 2));
  return {
    tan: n(r.tanMgN, 'tanMgN'),
    no2: n(r.no2MgN, 'no2MgN'),
    no3: n(r.no3MgN, 'no3MgN'),
    ph: r.ph === null ? '' : trimNumber(r.ph, 2),
    temperature: r.temperatureC === null ? '' : trimNumber(temperatureIn(r.temperatureC, unit), 1),
    kh: r.khDkh === null ? '' : trimNumber(r.khDkh, 1),
  };
}

const FIELD_OF: Record<string, QuickTestField> = { takenAt: 'when', tan: 'tan', no2: 'no2', no3: 'no3', ph: 'ph', temperatureC: 'temperature', khDkh: 'kh', note: 'note' };

export function mapReadingErrors(fields: Readonly<Record<string, string>>): Partial<Record<QuickTestField, string>> {
  const out: Partial<Record<QuickTestField, string>> = {};
  for (const [path, message] of Object.entries(fields)) {
    const f = FIELD_OF[path] ?? 'tan';
    if (!(f in out)) out[f] = message;
  }
  return out;
}

/** Form text → reading input, or messages per field. */
export function quickTestInput(
  values: QuickTestValues,
  basis: ReadingBasis,
  unit: TemperatureUnit,
  now: Date,
): { ok: true; input: ReadingCreateInput } | { ok: false; fields: Partial<Record<QuickTestField, string>> } {
  const bad: Partial<Record<QuickTestField, string>> = {};
  const read = (f: QuickTestField) => {
    const n = parseDecimal(values[f]);
    if (Number.isNaN(n)) bad[f] = 'Enter a number, or leave it empty.';
    return n === null || Number.isNaN(n) ? null : n;
  };
  const takenAt = parseLocalStamp(values.when, now);
  if (takenAt === null) bad.when = 'Write the date and time as 2026-03-01 08:30, or leave it empty for now.';
  const temperature = read('temperature');
  const raw = {
    takenAt: takenAt ?? now.toISOString(),
    basis,
    tan: read('tan'),
    no2: read('no2'),
    no3: read('no3'),
    ph: read('ph'),
    temperatureC: temperature === null ? null : temperatureToCelsius(temperature, unit),
    khDkh: read('kh'),
    note: values.note,
  };
  if (Object.keys(bad).length > 0) return { ok: false, fields: bad };
  const parsed = readingCreateSchema.safeParse(raw);
  if (!parsed.success) {
    const fields = mapReadingErrors(fieldErrors(parsed.error.issues));
    // The schema speaks °C; a person typing °F gets the range in °F.
    if (fields.temperature && unit === 'F') fields.temperature = 'Temperature must be 32–113 °F.';
    return { ok: false, fields };
  }
  return { ok: true, input: parsed.data };
}
