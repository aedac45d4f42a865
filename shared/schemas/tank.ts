import { z } from 'zod';
import { FILTER_KINDS } from '../../simulation/presets';
import { AERATION_LEVELS, MEDIA_TYPES, PLANTING_LEVELS, eventSchema, zoneSchema, type ScenarioEvent } from './scenario';

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
  fishCount: z.number().int(),
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

export const planStatusSchema = z.enum(['draft', 'active', 'done']);
export type PlanStatus = z.infer<typeof planStatusSchema>;

/**
 * How the tank is built, as the keeper describes it: the engine's `TankDescription` (filter
 * preset with media volume, substrate, rock and wood) plus planting, aeration and light, and
 * optional explicit zones that replace the ones built from the description. Stored as JSON;
 * every part is optional so a tank can start from its volume alone.
 */
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
});
export type ReadingItem = z.infer<typeof readingSchema>;

/** A plan's events are the engine's scenario events (shared/schemas/scenario.ts), stored as parsed. */
export const planEventSchema = eventSchema;
export type PlanEvent = ScenarioEvent;

export const planSchema = z.object({
  id: z.string().uuid(),
  name: z.string(),
  startDate: z.string(),
  status: planStatusSchema,
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
  livestock: z.array(livestockSchema),
  readings: z.array(readingSchema),
  plans: z.array(planSchema),
});
export type TankDetail = z.infer<typeof tankDetailSchema>;
