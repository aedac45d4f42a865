import { z } from 'zod';
import { FILTER_KINDS } from '../../simulation/presets';
import { AERATION_LEVELS, MEDIA_TYPES, PLANTING_LEVELS, eventSchema, zoneSchema, type ScenarioEvent } from '../../simulation/scenario';
import { tankFitSchema, tankHistorySchema } from './tank-history';

/** Basis a test kit reports ammonia/nitrite/nitrate in: as nitrogen, or as the ion. */
export const readingBasisSchema = z.enum(['N', 'ion']);
export type ReadingBasis = z.infer<typeof readingBasisSchema>;

/** One row of the keeper's tank list (home screen). Concentrations are stored as N. */
export const tankSummarySchema = z.object({
  id: z.string().uuid(),
  name: z.string(),
  volumeL: z.number(),
  temperatureC: z.number(),
  ph: z.number(),
  /** Fish only: shrimp and snails are counted apart (`invertebrateCount`). */
  fishCount: z.number().int(),
  invertebrateCount: z.number().int(),
  speciesCount: z.number().int(),
  latestReading: z
    .object({
      takenAt: z.string(),
      tanMgN: z.number().nullable(),
      no2MgN: z.number().nullable(),
      no3MgN: z.number().nullable(),
    })
    .nullable(),
  activePlan: z.object({ id: z.string().uuid(), name: z.string() }).nullable(),
});
export type TankSummary = z.infer<typeof tankSummarySchema>;
export const tankListSchema = z.object({ tanks: z.array(tankSummarySchema) });

// ---- Tank detail (GET /api/tanks/:id) -------------------------------------------------------

/** A plan's life: 'draft' → 'active' (running, shown as "In progress") → 'done' (kept read-only). */
export const planStatusSchema = z.enum(['draft', 'active', 'done']);
export type PlanStatus = z.infer<typeof planStatusSchema>;

/**
 * How the tank is built, as the keeper describes it: the engine's `TankDescription` (filter
 * preset with media volume, substrate, rock and wood) plus planting, aeration and light, and
 * optional explicit zones that replace the ones built from the description. Stored as JSON;
 * every part is optional so a tank can start from its volume alone.
 */
/**
 * The keeper's usual water change: `percent` of the water every `everyDays` days (0 % = none).
 * It matters to every forecast: water changes dilute nitrate and restore the carbonate
 * hardness that nitrification uses up (7.14 mg CaCO3 per mg N), which keeps the pH from
 * drifting down and slowing the nitrifiers.
 */
export const routineWaterChangeSchema = z.object({
  percent: z.number({ error: 'Enter a percentage.' }).min(0, 'Use 0 % for none.').max(90, 'At most 90 %.'),
  everyDays: z.number({ error: 'Enter a number of days.' }).int('Use whole days.').min(1, 'At least every day.').max(60, 'At most every 60 days.'),
});
export type RoutineWaterChange = z.infer<typeof routineWaterChangeSchema>;

export const tankSetupSchema = z.object({
  filter: z
    .object({
      kind: z.enum(FILTER_KINDS),
      mediaVolumeL: z.number().gt(0, 'Media volume must be above 0 L.').max(10000),
      media: z.enum(MEDIA_TYPES).optional(),
      surfaceSkimmer: z.boolean().optional(),
    })
    .optional(),
  substrate: z
    .union([
      z.literal('bare'),
      z.object({ grain: z.enum(['sand', 'fine-gravel', 'gravel', 'coarse-gravel']), depthCm: z.number().gt(0).max(30) }),
    ])
    .optional(),
  hardscape: z.enum(['none', 'some', 'lots']).optional(),
  plants: z.enum(PLANTING_LEVELS).optional(),
  aeration: z.enum(AERATION_LEVELS).optional(),
  lightHoursPerDay: z.number().min(0).max(24).optional(),
  /** Absent: the common weekly 25 % (TANK_DEFAULTS) is assumed. */
  routineWaterChange: routineWaterChangeSchema.optional(),
  zones: z.array(zoneSchema).min(1).max(8).optional(),
});
export type TankSetup = z.infer<typeof tankSetupSchema>;

export const livestockSchema = z.object({
  id: z.string().uuid(),
  speciesId: z.string().nullable(),
  customName: z.string().nullable(),
  count: z.number().int(),
  lengthCm: z.number().nullable(),
});
export type LivestockItem = z.infer<typeof livestockSchema>;

/** A stored water test. Nitrogen values are mg N/L; `basis` is what the kit displayed. */
export const readingSchema = z.object({
  id: z.string().uuid(),
  takenAt: z.string(),
  tanMgN: z.number().nullable(),
  no2MgN: z.number().nullable(),
  no3MgN: z.number().nullable(),
  ph: z.number().nullable(),
  temperatureC: z.number().nullable(),
  khDkh: z.number().nullable(),
  basis: readingBasisSchema,
  /** The keeper's short note ("after a 30 % water change"); optional for older clients. */
  note: z.string().optional(),
});
export type ReadingItem = z.infer<typeof readingSchema>;

/** A plan's events are the engine's scenario events (simulation/scenario.ts), stored as parsed. */
export const planEventSchema = eventSchema;
export type PlanEvent = ScenarioEvent;

export const planSchema = z.object({
  id: z.string().uuid(),
  name: z.string(),
  startDate: z.string(),
  status: planStatusSchema,
  startedAt: z.string().nullable(),
  finishedAt: z.string().nullable(),
  events: z.array(planEventSchema),
});
export type PlanItem = z.infer<typeof planSchema>;

/** Readings in the detail are the newest first, at most this many. */
export const TANK_DETAIL_READING_LIMIT = 50;

export const tankDetailSchema = z.object({
  id: z.string().uuid(),
  name: z.string(),
  volumeL: z.number(),
  temperatureC: z.number(),
  ph: z.number(),
  khDkh: z.number().nullable(),
  tapWater: z.object({ tanMgN: z.number(), no2MgN: z.number(), no3MgN: z.number() }),
  setup: tankSetupSchema,
  notes: z.string(),
  /** the keeper's account of the tank's past (null: not given) */
  history: tankHistorySchema.nullable(),
  /** the applied fit every forecast starts from (null: none applied) */
  fit: tankFitSchema.nullable(),
  livestock: z.array(livestockSchema),
  readings: z.array(readingSchema),
  plans: z.array(planSchema),
});
export type TankDetail = z.infer<typeof tankDetailSchema>;

// ---- Tank edits (POST /api/tanks, PATCH /api/tanks/:id) ---------------------------------------

/** Ranges match the engine's tank schema (simulation/scenario.ts), so a saved tank always forecasts. */
const nameField = z
  .string({ error: 'Enter a name for the tank.' })
  .trim()
  .min(1, 'Enter a name for the tank.')
  .max(80, 'Use at most 80 characters.');
const volumeField = z
  .number({ error: 'Enter the volume in litres.' })
  .gt(0, 'Volume must be above 0 L.')
  .max(100000, 'At most 100 000 L.');
const temperatureField = z
  .number({ error: 'Enter a temperature.' })
  .min(0, 'Temperature must be 0–40 °C.')
  .max(40, 'Temperature must be 0–40 °C.');
const phField = z.number({ error: 'Enter a pH.' }).min(4, 'pH must be between 4 and 10.').max(10, 'pH must be between 4 and 10.');
const khField = z.number({ error: 'Enter KH as a number.' }).min(0, 'KH must be 0 or more.').max(40, 'At most 40 °dKH.');
const tapValue = z.number({ error: 'Enter a number.' }).min(0, 'Must be 0 or more.').max(100, 'At most 100 mg/L.');
export const tapWaterInputSchema = z.strictObject({ tanMgN: tapValue, no2MgN: tapValue, no3MgN: tapValue });

/** What a newcomer's tank starts with when only a name and a volume are given. */
export const TANK_DEFAULTS = {
  temperatureC: 25,
  ph: 7.2,
  filterKind: 'hang-on-back',
  /** Common practice: a hobby filter holds roughly 1 L of media per 100 L of tank (from memory). */
  mediaLitresPerTankLitre: 0.01,
  minMediaVolumeL: 0.2,
  lightHoursPerDay: 8,
  /** Common practice: a weekly partial water change of about a quarter of the water. */
  routineWaterChange: { percent: 25, everyDays: 7 },
} as const;

/** A starting setup for a tank of `volumeL`: the filter kind's own default media, gravel, some rock. */
export function defaultSetup(volumeL: number, filterKind: (typeof FILTER_KINDS)[number] = TANK_DEFAULTS.filterKind): TankSetup {
  const media = Math.max(TANK_DEFAULTS.minMediaVolumeL, Math.round(volumeL * TANK_DEFAULTS.mediaLitresPerTankLitre * 10) / 10);
  return {
    filter: { kind: filterKind, mediaVolumeL: media },
    substrate: { grain: 'gravel', depthCm: 5 },
    hardscape: 'some',
    plants: 'none',
    lightHoursPerDay: TANK_DEFAULTS.lightHoursPerDay,
    routineWaterChange: { ...TANK_DEFAULTS.routineWaterChange },
  };
}

/**
 * A new tank: a name and a volume are enough; `filterKind` picks the filter preset when no
 * `setup` is given. Unknown fields (an owner id, say) are refused, never stored.
 */
export const tankCreateSchema = z.strictObject({
  name: nameField,
  volumeL: volumeField,
  temperatureC: temperatureField.optional(),
  ph: phField.optional(),
  khDkh: khField.nullable().optional(),
  tapWater: tapWaterInputSchema.optional(),
  filterKind: z.enum(FILTER_KINDS, { error: 'Choose a filter kind.' }).optional(),
  setup: tankSetupSchema.optional(),
  notes: z.string().max(2000, 'Use at most 2000 characters.').optional(),
  history: tankHistorySchema.nullable().optional(),
});
export type TankCreateInput = z.infer<typeof tankCreateSchema>;

/** A change to a tank: each field given replaces the stored one (`setup` and `tapWater` whole). */
export const tankPatchSchema = z.strictObject({
  name: nameField.optional(),
  volumeL: volumeField.optional(),
  temperatureC: temperatureField.optional(),
  ph: phField.optional(),
  khDkh: khField.nullable().optional(),
  tapWater: tapWaterInputSchema.optional(),
  setup: tankSetupSchema.optional(),
  notes: z.string().max(2000, 'Use at most 2000 characters.').optional(),
  history: tankHistorySchema.nullable().optional(),
});
export type TankPatchInput = z.infer<typeof tankPatchSchema>;

// ---- Livestock edits ------------------------------------------------------------------------

const countField = z
  .number({ error: 'Enter how many.' })
  .int('Use a whole number.')
  .min(1, 'At least 1.')
  .max(10000, 'At most 10 000.');
const lengthField = z.number({ error: 'Enter a length in cm.' }).min(0.2, 'At least 0.2 cm.').max(200, 'At most 200 cm.');

/**
 * Animals added to a tank: a catalogue species by id (length optional: the catalogue's adult
 * length stands in), or a custom fish with a name and a length.
 */
export const livestockCreateSchema = z
  .strictObject({
    speciesId: z.string().trim().min(1, 'Choose a species.').max(64).optional(),
    customName: z.string().trim().min(1, 'Enter a name.').max(80, 'Use at most 80 characters.').optional(),
    count: countField,
    lengthCm: lengthField.nullable().optional(),
  })
  .superRefine((v, ctx) => {
    if (v.speciesId === undefined && v.customName === undefined) {
      ctx.addIssue({ code: 'custom', path: ['speciesId'], message: 'Choose a species, or enter a name for a custom fish.' });
    }
    if (v.speciesId !== undefined && v.customName !== undefined) {
      ctx.addIssue({ code: 'custom', path: ['customName'], message: 'Give a species or a custom name, not both.' });
    }
    if (v.customName !== undefined && (v.lengthCm === undefined || v.lengthCm === null)) {
      ctx.addIssue({ code: 'custom', path: ['lengthCm'], message: 'Enter the length of a custom fish in cm.' });
    }
  });
export type LivestockCreateInput = z.infer<typeof livestockCreateSchema>;

export const livestockPatchSchema = z.strictObject({
  count: countField.optional(),
  lengthCm: lengthField.nullable().optional(),
});
export type LivestockPatchInput = z.infer<typeof livestockPatchSchema>;

// ---- Home status -------------------------------------------------------------------------------

/** ok: below half the limit; watch: at least half of it; over: above it. */
export const limitLevelSchema = z.enum(['ok', 'watch', 'over']);
export type LimitLevel = z.infer<typeof limitLevelSchema>;

export const judgedValueSchema = z.object({
  key: z.enum(['tanMgN', 'no2MgN']),
  valueMgN: z.number(),
  level: limitLevelSchema,
  limit: z.object({ value: z.number(), unit: z.string(), basis: z.string(), source: z.string() }),
});
export type JudgedValue = z.infer<typeof judgedValueSchema>;

export const nextTestSchema = z.object({
  /** Calendar date YYYY-MM-DD (UTC). */
  date: z.string(),
  reason: z.enum(['no-test-yet', 'plan-check-day', 'over-limit', 'routine']),
  /** For a plan check day: why that day (shared/plan-check-days.ts). */
  detail: z.string().optional(),
});
export type NextTest = z.infer<typeof nextTestSchema>;

export const tankStatusSchema = z.object({
  /** Worst level of the judged values; null without a reading. */
  overall: limitLevelSchema.nullable(),
  judged: z.array(judgedValueSchema),
  nextTest: nextTestSchema,
});
export type TankStatus = z.infer<typeof tankStatusSchema>;

export const tankSummaryWithStatusSchema = tankSummarySchema.extend({ status: tankStatusSchema });
export type TankSummaryWithStatus = z.infer<typeof tankSummaryWithStatusSchema>;
export const tankListWithStatusSchema = z.object({ tanks: z.array(tankSummaryWithStatusSchema) });
