import { z } from 'zod';
import { eventSchema, fishGroupSchema, startSchema } from '../../simulation/scenario';
import { planStatusSchema, readingSchema } from './tank';
import { isoDate } from './iso-date';
import { START_REASONS, startStateSchema } from './start-state';
import { tankFitSchema } from './tank-history';
import { MAX_HORIZON_DAYS } from '../tank-scenario';
import { countTimelineEntries, MAX_TIMELINE_ENTRIES, overBudgetMessage } from '../../simulation/work-budget';
import {
  additionRequestSchema,
  adviceSettingsSchema,
  ammoniaSolutionSchema,
  calibrationRequestSchema,
  capacityTestRequestSchema,
  removalRequestSchema,
  rescueRequestSchema,
  calibrationResponseSchema,
  capacityTestResponseSchema,
  ensembleResponseSchema,
  limitSettingsSchema,
} from '../../simulation/advice/schemas';

/**
 * Change plans and their forecasts over the API (issue 5 part B). Events are the engine's own
 * `eventSchema`; days count from the plan's start date.
 */


/** Most events one plan holds (a year of twice-weekly doses fits). */
export const PLAN_EVENT_LIMIT = 200;

const planName = z.string().trim().min(1, 'Give the plan a name.').max(80, 'At most 80 characters.');
/**
 * A saved plan is forecast over at most MAX_HORIZON_DAYS (advice runs it that long), so its
 * events must fit the engine's work budget there: refused when saved, not when a job runs it.
 */
const planEvents = z
  .array(eventSchema)
  .max(PLAN_EVENT_LIMIT, `At most ${PLAN_EVENT_LIMIT} events.`)
  .superRefine((events, ctx) => {
    const count = countTimelineEntries({ tank: {}, events }, MAX_HORIZON_DAYS);
    if (count.entries > MAX_TIMELINE_ENTRIES) ctx.addIssue({ code: 'custom', message: overBudgetMessage(count, MAX_HORIZON_DAYS), path: count.largest.path.slice(1) });
  });

/** How a plan's status changes: only through start and finish (services/plans.ts holds the rules). */
export const STATUS_BY_ACTION_MESSAGE = 'A plan starts as a draft; it changes status only through "Start this plan" and "Mark as done".';

export const planCreateSchema = z.object({
  name: planName,
  startDate: isoDate,
  status: z.literal('draft', { error: STATUS_BY_ACTION_MESSAGE }).default('draft'),
  events: planEvents.default([]),
});
export type PlanCreateInput = z.input<typeof planCreateSchema>;

export const planPatchSchema = z
  .object({
    name: planName.optional(),
    startDate: isoDate.optional(),
    status: z.never({ error: STATUS_BY_ACTION_MESSAGE }).optional(),
    events: planEvents.optional(),
  })
  .refine((p) => Object.values(p).some((v) => v !== undefined), { message: 'Send at least one field to change.', path: ['_'] });
export type PlanPatchInput = z.input<typeof planPatchSchema>;

/**
 * POST /api/plans/:planId/start: day 0 is the day the keeper starts, in their own calendar
 * (sent by the app; the server's UTC today when left out). It must be within a day of the
 * server's today, as every time zone's today is.
 */
export const planStartSchema = z.object({ startDate: isoDate.optional() });
export type PlanStartInput = z.input<typeof planStartSchema>;

/** POST /api/plans/:planId/finish takes no choices. */
export const planFinishSchema = z.object({});

/** One day the keeper should test, and why. */
export const checkDaySchema = z.object({ day: z.number(), date: z.string(), reasons: z.array(z.string()).min(1) });
export type CheckDay = z.infer<typeof checkDaySchema>;

export const planDetailSchema = z.object({
  id: z.string().uuid(),
  tankId: z.string().uuid(),
  tankName: z.string(),
  name: z.string(),
  startDate: z.string(),
  status: planStatusSchema,
  /** When it was started and marked done (ISO instants); null before. */
  startedAt: z.string().nullable(),
  finishedAt: z.string().nullable(),
  events: z.array(eventSchema),
  checkDays: z.array(checkDaySchema),
  createdAt: z.string(),
  updatedAt: z.string(),
});
export type PlanDetail = z.infer<typeof planDetailSchema>;
export const planListSchema = z.object({ plans: z.array(planDetailSchema) });

/** GET /api/plans/:planId/readings: the tank's tests while the plan ran, oldest first (`total` counts all of them). */
export const planReadingsSchema = z.object({ readings: z.array(readingSchema), total: z.number().int() });
export type PlanReadings = z.infer<typeof planReadingsSchema>;

// ---- forecasts -------------------------------------------------------------------------

const series = z.array(z.number());
const peakSchema = z.object({ value: z.number(), day: z.number() });
const excursionSchema = z.object({ days: z.number(), firstDay: z.number().nullable() });
const spreadSchema = z.object({ p10: series, p90: series });

/** A forecast shaped for the chart and its text summary (shared/forecast-view.ts). */
export const forecastViewSchema = z.object({
  days: series,
  tanMgN: series,
  freeNh3MgL: series,
  no2MgN: series,
  no3MgN: series,
  /** total ammonia- and nitrite-oxidiser capacity over all zones, mg N/day */
  aoMgNPerDay: series,
  noMgNPerDay: series,
  /** TAN supplied by fish and detritus (doses excluded), mg N/day */
  loadMgNPerDay: series,
  limits: z.object({ freeNh3MgNH3: z.number(), tanChronicMgN: z.number(), tanAcuteMgN: z.number(), no2MgN: z.number() }),
  peaks: z.object({ tan: peakSchema, freeNh3: peakSchema, no2: peakSchema, no3: peakSchema }),
  daysOver: z.object({ freeNh3: excursionSchema, tanChronic: excursionSchema, tanAcute: excursionSchema, no2: excursionSchema }),
  band: z.object({ tanMgN: spreadSchema, freeNh3MgL: spreadSchema, no2MgN: spreadSchema, no3MgN: spreadSchema, members: z.number().int() }).nullable(),
  /**
   * Times today's load the nitrifiers could clear at once before a kit shows a colour, with
   * the ensemble's 10–90 % range when there is one (simulation/forecast/spare-capacity.ts).
   */
  spareCapacity: z
    .object({ times: z.number(), showsFirst: z.enum(['ammonia', 'nitrite']), low: z.number().nullable(), high: z.number().nullable() })
    .nullable()
    // Views stored before the figure existed (lesson snapshots) read as "none".
    .default(null),
});
export type ForecastView = z.infer<typeof forecastViewSchema>;

/** How much a fit narrowed the band: mean widths (mg N/L) with the fit and with the start the tank would have without it. */
export const fitBandSchema = z.object({
  tanMgN: z.object({ prior: z.number(), calibrated: z.number() }),
  no2MgN: z.object({ prior: z.number(), calibrated: z.number() }),
});
export type FitBand = z.infer<typeof fitBandSchema>;

export const planForecastResponseSchema = z.object({
  planId: z.string().uuid(),
  /** true when the stored result for the same inputs was returned without running the engine */
  cached: z.boolean(),
  inputHash: z.string().length(64),
  engineVersion: z.string(),
  startReason: z.enum(START_REASONS),
  /** what the forecast started from (the start line and its warnings are worded from it) */
  startState: startStateSchema,
  /** with an applied fit: the band's width with it and without it (null otherwise) */
  fitBand: fitBandSchema.nullable(),
  computedAt: z.string(),
  forecast: forecastViewSchema,
  explanation: z.array(z.string()).min(1),
  cautions: z.array(z.string()).min(1),
});
export type PlanForecastResponse = z.infer<typeof planForecastResponseSchema>;

// ---- advice request bodies: only what the keeper chooses; tank and plan come from the database

const planRef = { planId: z.string().uuid('Not a plan id.').optional() };

/** The plan's start date comes from the plan itself (it dates the answer). */
export const additionAdviceBodySchema = additionRequestSchema.omit({ scenario: true, startDate: true }).extend(planRef);
export const removalAdviceBodySchema = removalRequestSchema.omit({ scenario: true }).extend(planRef);
export const rescueAdviceBodySchema = rescueRequestSchema.omit({ scenario: true }).extend(planRef);
export const ensembleBodySchema = z.object({
  ...planRef,
  members: z.number().int().min(64).max(1024).optional(),
  seed: z.number().int().optional(),
  horizonDays: z.number().min(1, 'At least 1 day.').max(365).optional(),
});
/** Readings the calibration uses by default: the last eight weeks (common practice: recent tests describe the present biofilter). */
export const CALIBRATION_DEFAULT_DAYS = 56;
export const calibrationBodySchema = calibrationRequestSchema
  .omit({ scenario: true, readings: true })
  .extend({ sinceDays: z.number().int().min(1).max(365).optional() });
export const capacityTestBodySchema = z.object({
  solution: ammoniaSolutionSchema.optional(),
  limits: limitSettingsSchema.optional(),
  /** The test's readings, once taken: the answer then carries the capacity estimate. */
  test: capacityTestRequestSchema.omit({ scenario: true }).optional(),
  start: startSchema.optional(),
});

export const calibrationAdviceResponseSchema = calibrationResponseSchema.extend({
  readingsUsed: z.number().int(),
  firstReadingAt: z.string(),
  /** the fit as kept for the tank, ready to apply (POST /api/tanks/:tankId/fit) */
  fit: tankFitSchema,
  /** why a poor or fair fit is so, and which test would help most (empty for a good fit) */
  advice: z.array(z.string()),
});
export type CalibrationAdviceResponse = z.infer<typeof calibrationAdviceResponseSchema>;
/** The engine's own answers, passed through unchanged. */
export { adviceSettingsSchema, capacityTestResponseSchema, ensembleResponseSchema, fishGroupSchema };
