/**
 * Request and response shapes of the advice and calibration layer, for API validation. No
 * server code here: the server imports these. Concentrations mg N/L, days from day 0.
 */
import { z } from 'zod';
import { fishGroupSchema, scenarioSchema } from '../scenario';
import { LIMIT_KEYS } from './tank-limits';

const limitKey = z.enum(LIMIT_KEYS);
const day = z.number().min(0).max(3650);

export const limitSettingsSchema = z.object({
  nitriteBasis: z.enum(['culture-practice', 'chloride']).optional(),
  freeAmmoniaGuideline: z.enum(['ccme', 'eifac']).optional(),
  sensitivityFactor: z.number().min(0.01, 'At least 0.01.').max(1).optional(),
  // A limit above 1000 mg/L is no limit at all (and no tank reaches it).
  overrides: z.partialRecord(limitKey, z.number().gt(0).max(1000)).optional(),
});

export const adviceSettingsSchema = z.object({
  limits: limitSettingsSchema.optional(),
  members: z.number().int().min(64).max(1024).optional(),
  seed: z.number().int().optional(),
  boundingSize: z.number().int().min(1).max(16).optional(),
});

export const ammoniaSolutionSchema = z.object({
  percentNH3: z.number().gt(0).max(35),
  densityGPerMl: z.number().min(0.85).max(1).optional(),
});

export const additionRequestSchema = z.object({
  scenario: scenarioSchema,
  fish: fishGroupSchema,
  constraints: z
    .object({
      minBatch: z.number().int().min(1).max(100000).optional(),
      maxBatches: z.number().int('A whole number.').min(1, 'At least 1 batch.').max(20, 'At most 20 batches.').optional(),
      firstDay: day.optional(),
      latestFinishDay: day.optional(),
      allowedDays: z.array(z.number().int().min(0).max(3650)).max(400).optional(),
    })
    .optional(),
  searchDays: z.number().int().min(1, 'At least 1 day.').max(365, 'At most 365 days.').optional(),
  settings: adviceSettingsSchema.optional(),
  /** The plan's start date: days are then also told as dates. */
  startDate: z.string().regex(/^\d{4}-\d{2}-\d{2}$/, 'A date as YYYY-MM-DD.').optional(),
});

export const removalRequestSchema = z.object({
  scenario: scenarioSchema,
  removals: z.array(z.object({ species: z.string().min(1).optional(), name: z.string().min(1).optional(), count: z.number().int().min(1).max(100000) })).max(200),
  removalDay: day.optional(),
  restockDay: z.number().int().min(1).max(3650),
  restock: z.array(fishGroupSchema).max(200).optional(),
  solution: ammoniaSolutionSchema.optional(),
  // The biofilter settles to a new load within weeks [practice]; four months covers any restock.
  daysAfterRestock: z.number().int().min(1).max(120).optional(),
  settings: adviceSettingsSchema.optional(),
});

export const rescueRequestSchema = z.object({
  scenario: scenarioSchema,
  // A rescue is planned in days and whole-percent water changes (a keeper measures a change by
  // buckets or a marked tank, not to a tenth of a percent): at most 100 candidate sizes a day.
  // A rescue covers the spike in front of the keeper: weeks, not a year [practice].
  horizonDays: z.number().min(1, 'At least 1 day.').max(90, 'At most 90 days.').optional(),
  maxPercent: z.number().min(1, 'At least 1 %.').max(100).optional(),
  stepPercent: z.number().int('Use whole percent.').min(1, 'At least 1 %.').max(50).optional(),
  minPercent: z.number().min(1, 'At least 1 %.').max(100).optional(),
  settings: adviceSettingsSchema.optional(),
});

// The finest kit step in use is a photometer's 0.01 mg/L [practice]; 0.001 leaves room.
export const kitSchema = z.object({ stepMgN: z.number().min(0.001, 'At least 0.001 mg N/L.').max(5), relativeError: z.number().min(0).max(1) });

export const calibrationRequestSchema = z.object({
  scenario: scenarioSchema,
  readings: z
    .array(z.object({ day, tanMgN: z.number().min(0).max(100).optional(), no2MgN: z.number().min(0).max(100).optional() }))
    .min(2)
    .max(2000),
  kits: z.object({ tan: kitSchema.optional(), no2: kitSchema.optional() }).optional(),
  fit: z.array(z.enum(['ao', 'no', 'growth'])).min(1).max(3).optional(),
  // A fit to a few weeks of tests says little about the tank more than three months on.
  forecastDays: z.number().int().min(1).max(90).optional(),
  members: z.number().int().min(64).max(1024).optional(),
  seed: z.number().int().optional(),
});

export const capacityTestRequestSchema = z.object({
  scenario: scenarioSchema,
  doseMgNPerL: z.number().min(0.1, 'At least 0.1 mg N/L: less cannot be read on a test kit.').max(10),
  readings: z.array(z.object({ hour: z.number().min(0).max(72), tanMgN: z.number().min(0).max(100), no2MgN: z.number().min(0).max(100).optional() })).min(2).max(50),
  kit: kitSchema.optional(),
});

// --- responses -------------------------------------------------------------------------

const series = z.array(z.number());
const bandSchema = z.object({ p10: series, p50: series, p90: series });
export const ensembleBandSchema = z.object({
  days: series,
  tanMgN: bandSchema,
  freeNh3MgL: bandSchema,
  no2MgN: bandSchema,
  no3MgN: bandSchema,
  aoMgNPerDay: bandSchema,
  noMgNPerDay: bandSchema,
});

export const appliedLimitSchema = z.object({
  key: limitKey,
  label: z.string(),
  series: z.enum(['freeNh3', 'tan', 'no2']),
  value: z.number(),
  unit: z.enum(['mg NH3/L', 'mg N/L']),
  basis: z.string(),
  source: z.string(),
  defaultValue: z.number(),
  adjusted: z.boolean(),
  fixedByKeeper: z.boolean(),
});

const limitVerdictSchema = z.object({
  key: limitKey,
  peakRatio: z.number(),
  peakValue: z.number(),
  peakDay: z.number(),
  firstDayOver: z.number().nullable(),
  daysOver: z.number(),
});
export const verdictSchema = z.object({ safe: z.boolean(), binding: limitKey, peakRatio: z.number(), limits: z.array(limitVerdictSchema) });

export const planOutcomeSchema = z.object({
  band: ensembleBandSchema,
  upperEdge: verdictSchema,
  median: verdictSchema,
  edgePeakRatio: z.number(),
  membersCrossing: z.number().int(),
  members: z.number().int(),
});

const judgementSchema = z.object({
  method: z.literal('bounding-set'),
  ensembleMembers: z.number().int(),
  seed: z.number(),
  boundingMembers: z.array(z.number().int()),
  boundingDraws: z.array(z.object({ index: z.number().int(), parameters: z.record(z.string(), z.number()), feedingMultiplier: z.number() })),
  forecastsRun: z.number().int(),
});
const words = { explanation: z.array(z.string()).min(1), cautions: z.array(z.string()).min(1) };
const eventList = z.array(z.record(z.string(), z.unknown()));

const batchList = z.array(z.object({ day: z.number(), count: z.number().int() }));
export const additionSuggestionSchema = z.object({
  kind: z.enum(['more-batches', 'later-finish', 'water-changes', 'fewer-fish']),
  summary: z.string(),
  count: z.number().int(),
  batches: batchList,
  finishDay: z.number(),
  events: eventList,
  maxBatches: z.number().int(),
  searchDays: z.number().int(),
  routineWaterChange: z.object({ percent: z.number(), everyDays: z.number() }).nullable(),
});
export const additionBlockerSchema = z.object({
  kind: z.enum(['capacity', 'first-batch', 'pace']),
  limit: limitKey,
  day: z.number().nullable(),
  smallestBatch: z.number().int(),
  words: z.string(),
});
export const additionResponseSchema = z.object({
  status: z.enum(['all-at-once-is-safe', 'staged', 'no-safe-schedule']),
  summary: z.string(),
  batches: batchList,
  finishDay: z.number().nullable(),
  finishDate: z.string().nullable(),
  events: eventList,
  earliestDay: z.number(),
  searchDays: z.number().int(),
  maxBatches: z.number().int(),
  staged: planOutcomeSchema.nullable(),
  allAtOnce: planOutcomeSchema,
  binding: appliedLimitSchema,
  limits: z.array(appliedLimitSchema),
  blocker: additionBlockerSchema.nullable(),
  suggestions: z.array(additionSuggestionSchema),
  judgement: judgementSchema,
  ...words,
});

export const removalResponseSchema = z.object({
  targetCapacityMgNPerDay: z.number(),
  capacityAtRestock: z.object({ withAdvice: z.number(), withoutAdvice: z.number() }),
  dose: z.object({
    mgNPerLPerDay: z.number(),
    ammoniumChlorideGPerDay: z.number(),
    ammoniaSolutionMlPerDay: z.number().nullable(),
    solution: ammoniaSolutionSchema.nullable(),
  }),
  delivery: z.object({
    method: z.enum(['once-a-day', 'split', 'continuous']),
    timesPerDay: z.number().int().min(1).nullable(),
    perDose: z.object({ mgNPerL: z.number(), ammoniumChlorideG: z.number(), ammoniaSolutionMl: z.number().nullable() }).nullable(),
    underLimitsWhileDosing: z.boolean(),
    reducedFrom: z.number().nullable(),
    reason: z.string(),
  }),
  feeding: z.object({ before: z.string(), after: z.string(), cutShare: z.number() }),
  events: eventList,
  withAdvice: planOutcomeSchema,
  withoutAdvice: planOutcomeSchema,
  limits: z.array(appliedLimitSchema),
  ...words,
});

export const rescueResponseSchema = z.object({
  status: z.enum(['no-changes-needed', 'rescued', 'cannot-rescue']),
  changes: z.array(z.object({ day: z.number(), percent: z.number() })),
  events: eventList,
  without: planOutcomeSchema,
  withChanges: planOutcomeSchema.nullable(),
  binding: appliedLimitSchema,
  limits: z.array(appliedLimitSchema),
  judgement: judgementSchema,
  ...words,
});

export const calibrationResponseSchema = z.object({
  fitted: z.object({ aoFactor: z.number(), noFactor: z.number(), growthMultiplier: z.number() }),
  capacity: z.object({
    startAoMgNPerDay: z.number(),
    startNoMgNPerDay: z.number(),
    presentAoMgNPerDay: z.number(),
    presentNoMgNPerDay: z.number(),
    presentAoMgNH3PerDay: z.number(),
    /** per zone at the last reading: the explicit start a later forecast takes when the fit is applied */
    presentByZone: z.array(z.object({ zoneId: z.string(), aoMgNPerDay: z.number(), noMgNPerDay: z.number() })),
  }),
  standardErrors: z.object({ ao: z.number().nullable(), no: z.number().nullable(), growth: z.number().nullable() }),
  quality: z.object({
    rmseKitSteps: z.number(),
    reducedChiSquare: z.number(),
    readings: z.number().int(),
    verdict: z.enum(['good', 'fair', 'poor']),
    iterations: z.number().int(),
    stop: z.enum(['gradient', 'step', 'gain', 'iterations']),
    forecasts: z.number().int(),
  }),
  calibratedScenario: scenarioSchema,
  calibratedParameters: z.record(z.string(), z.number()),
  band: z.object({
    prior: ensembleBandSchema,
    calibrated: ensembleBandSchema,
    meanWidthTan: z.object({ prior: z.number(), calibrated: z.number() }),
    meanWidthNo2: z.object({ prior: z.number(), calibrated: z.number() }),
  }),
  /** capacity test only: spare capacity at the tank's own load (simulation/forecast/spare-capacity.ts) */
  spareCapacity: z.object({ times: z.number(), showsFirst: z.enum(['ammonia', 'nitrite']) }).nullable().optional(),
  ...words,
});

export const capacityTestProtocolSchema = z.object({
  doseMgNPerL: z.number(),
  ammoniumChlorideG: z.number(),
  ammoniaSolutionMl: z.number().nullable(),
  readingHours: z.array(z.number()),
  expectedTanMgN: z.array(z.number()),
  steps: z.array(z.string()).min(1),
  cautions: z.array(z.string()).min(1),
});

/** The ensemble band of a scenario with its words (server/workers/engine-tasks.ts builds it from runEnsemble). */
export const ensembleResponseSchema = z.object({
  band: ensembleBandSchema,
  members: z.number().int(),
  failed: z.number().int(),
  ...words,
});
/** A capacity test's protocol and, once its readings are given, the capacity they show. */
export const capacityTestResponseSchema = z.object({
  protocol: capacityTestProtocolSchema,
  estimate: calibrationResponseSchema.nullable(),
});

export type AdditionRequestInput = z.input<typeof additionRequestSchema>;
export type CalibrationRequestInput = z.input<typeof calibrationRequestSchema>;
export type CapacityTestRequest = z.output<typeof capacityTestRequestSchema>;
