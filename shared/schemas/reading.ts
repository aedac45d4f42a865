import { z } from 'zod';
import { ionToN, nToIon, type NitrogenSpecies } from '../../simulation/units';
import { readingBasisSchema, readingSchema, type ReadingBasis } from './tank';

/**
 * Which ion a kit "as the ion" reports each nitrogen value as. Total ammonia as the ion is
 * read as ammonium (NH4+), the form nearly all of it takes at aquarium pH — the same choice
 * the demo seed makes.
 */
export const ION_OF = { tanMgN: 'NH4', no2MgN: 'NO2', no3MgN: 'NO3' } as const satisfies Record<string, NitrogenSpecies>;
export type NitrogenKey = keyof typeof ION_OF;
export const NITROGEN_KEYS = ['tanMgN', 'no2MgN', 'no3MgN'] as const;

/** A value the kit showed (in `basis`) as mg N/L. */
export function toMgN(value: number, key: NitrogenKey, basis: ReadingBasis): number {
  return basis === 'N' ? value : ionToN(value, ION_OF[key]);
}

/** A stored mg N/L value in `basis`. */
export function fromMgN(mgN: number, key: NitrogenKey, basis: ReadingBasis): number {
  return basis === 'N' ? mgN : nToIon(mgN, ION_OF[key]);
}

/** Upper bounds well above any hobby test kit's scale; values beyond them are typing slips. */
export const READING_LIMITS = {
  nitrogenMax: 1000,
  phMin: 0,
  phMax: 14,
  temperatureMinC: 0,
  temperatureMaxC: 45,
  khMax: 50,
  noteMax: 200,
} as const;

const nitrogenValue = z
  .number({ error: 'Enter a number, or leave it empty.' })
  .min(0, 'Must be 0 or more.')
  .max(READING_LIMITS.nitrogenMax, `At most ${READING_LIMITS.nitrogenMax} mg/L.`)
  .nullable()
  .optional();

/** A water test as the keeper typed it: nitrogen values in the kit's `basis`. */
export const readingCreateSchema = z
  .strictObject({
    takenAt: z.iso.datetime({ offset: true, error: 'Enter the date and time of the test.' }),
    basis: readingBasisSchema.default('N'),
    tan: nitrogenValue,
    no2: nitrogenValue,
    no3: nitrogenValue,
    ph: z.number({ error: 'Enter a number.' }).min(READING_LIMITS.phMin, 'pH is 0–14.').max(READING_LIMITS.phMax, 'pH is 0–14.').nullable().optional(),
    temperatureC: z
      .number({ error: 'Enter a number.' })
      .min(READING_LIMITS.temperatureMinC, 'Temperature must be 0–45 °C.')
      .max(READING_LIMITS.temperatureMaxC, 'Temperature must be 0–45 °C.')
      .nullable()
      .optional(),
    khDkh: z.number({ error: 'Enter a number.' }).min(0, 'KH must be 0 or more.').max(READING_LIMITS.khMax, `At most ${READING_LIMITS.khMax} °dKH.`).nullable().optional(),
    note: z.string().trim().max(READING_LIMITS.noteMax, `Use at most ${READING_LIMITS.noteMax} characters.`).optional(),
  })
  .superRefine((v, ctx) => {
    const values = [v.tan, v.no2, v.no3, v.ph, v.temperatureC, v.khDkh];
    if (values.every((x) => x === undefined || x === null)) {
      ctx.addIssue({ code: 'custom', path: ['tan'], message: 'Enter at least one test value.' });
    }
    // A test logged more than a day ahead of the server's clock is a date typo.
    if (Date.parse(v.takenAt) > Date.now() + 86_400_000) {
      ctx.addIssue({ code: 'custom', path: ['takenAt'], message: 'The test date is in the future.' });
    }
  });
export type ReadingCreateInput = z.infer<typeof readingCreateSchema>;

/** Stored form of a typed reading: nitrogen converted to mg N/L (simulation/units.ts). */
export function storedReadingValues(input: Pick<ReadingCreateInput, 'basis' | 'tan' | 'no2' | 'no3'>) {
  const conv = (v: number | null | undefined, key: NitrogenKey) => (v === undefined || v === null ? null : toMgN(v, key, input.basis));
  return { tanMgN: conv(input.tan, 'tanMgN'), no2MgN: conv(input.no2, 'no2MgN'), no3MgN: conv(input.no3, 'no3MgN') };
}

export const READINGS_PAGE_SIZE_MAX = 200;
export const readingsQuerySchema = z.strictObject({
  page: z.coerce.number({ error: 'Use a page number.' }).int('Use a whole number.').min(1, 'Pages start at 1.').max(100000).default(1),
  pageSize: z.coerce
    .number({ error: 'Use a number.' })
    .int('Use a whole number.')
    .min(1, 'At least 1.')
    .max(READINGS_PAGE_SIZE_MAX, `At most ${READINGS_PAGE_SIZE_MAX}.`)
    .default(50),
});

export const readingPageSchema = z.object({
  readings: z.array(readingSchema),
  page: z.number().int(),
  pageSize: z.number().int(),
  total: z.number().int(),
});
export type ReadingPage = z.infer<typeof readingPageSchema>;

// ---- CSV import / export -----------------------------------------------------------------------

/** The CSV columns, in export order. Nitrogen values are in the row's `basis`; temperature in °C. */
export const CSV_COLUMNS = ['taken_at', 'basis', 'total_ammonia', 'nitrite', 'nitrate', 'ph', 'temperature_c', 'kh_dkh', 'note'] as const;
export type CsvColumn = (typeof CSV_COLUMNS)[number];

/** Upload caps (hardening S11): bytes, rows. */
export const CSV_IMPORT_MAX_BYTES = 512 * 1024;
export const CSV_IMPORT_MAX_ROWS = 2000;

/** One parsed CSV row, as the file gave it (nitrogen in its basis). `line` counts the header as line 1. */
export const csvRowSchema = z.object({
  line: z.number().int(),
  takenAt: z.string(),
  basis: readingBasisSchema,
  tan: z.number().nullable(),
  no2: z.number().nullable(),
  no3: z.number().nullable(),
  ph: z.number().nullable(),
  temperatureC: z.number().nullable(),
  khDkh: z.number().nullable(),
  note: z.string(),
});
export type CsvRow = z.infer<typeof csvRowSchema>;

export const csvRowErrorSchema = z.object({
  line: z.number().int(),
  /** The CSV column at fault, or null for the row as a whole. */
  column: z.string().nullable(),
  message: z.string(),
});
export type CsvRowError = z.infer<typeof csvRowErrorSchema>;

export const importPreviewSchema = z.object({
  rows: z.array(csvRowSchema),
  errors: z.array(csvRowErrorSchema),
  /** True when every row is valid and new: a commit of this file would write all of them. */
  canImport: z.boolean(),
});
export type ImportPreview = z.infer<typeof importPreviewSchema>;

export const importResultSchema = z.object({ imported: z.number().int() });
export type ImportResult = z.infer<typeof importResultSchema>;

export { readingBasisSchema };
