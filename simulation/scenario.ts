import { z } from 'zod';
import { fieldErrors, ScenarioError } from './scenario-error';
import { countTimelineEntries, MAX_TIMELINE_ENTRIES, overBudgetMessage } from './work-budget';

export { ScenarioError } from './scenario-error';

/**
 * The scenario format: one tank, how it starts, and a timeline of events: the engine's input,
 * one source of truth for the engine, the API server and the app. Concentrations are
 * "as N" (mg N/L); days count from the forecast start (day 0).
 */

export const ZONE_KINDS = ['filter', 'substrate', 'surfaces'] as const;
export const MEDIA_TYPES = [
  'sponge-coarse',
  'sponge-fine',
  'ceramic-rings',
  'plastic-carriers',
  'lava-rock',
  'sand',
  'fine-gravel',
  'gravel',
  'coarse-gravel',
] as const;
export const AERATION_LEVELS = ['none', 'gentle', 'surface-agitation', 'air-stone', 'strong'] as const;
export const PLANTING_LEVELS = ['none', 'light', 'moderate', 'heavy'] as const;
export const SHAPE_CLASS_IDS = ['eel-like', 'slender', 'ordinary', 'deep', 'shrimp', 'snail'] as const;

const day = z.number().min(0, 'Days count from 0.').max(3650, 'At most 10 years ahead.');
const concentration = z.number().min(0, 'Must be 0 or more.').max(1000, 'Above 1000 mg/L is not a tank.');
const share = z.number().min(0, 'Must be between 0 and 1.').max(1, 'Must be between 0 and 1.');
const factor = z.number().gt(0, 'Must be above 0.').max(1, 'At most 1.');

/** Shortest dose repeat, days: 6 h (keepers dose at most a few times a day) [practice]. */
export const MIN_DOSE_REPEAT_DAYS = 0.25;
/** Shortest medication, aeration loss or forecast, days: an hour; less is below what a test or the model resolves. */
export const MIN_DURATION_DAYS = 1 / 24;

export const zoneSchema = z
  .object({
    /** Stable id used by events, e.g. "filter". */
    id: z.string().min(1, 'Give the zone an id.').max(40),
    kind: z.enum(ZONE_KINDS),
    /** Effective colonisable area, m². Give this or `media`. */
    areaM2: z.number().gt(0, 'Area must be above 0.').max(100000).optional(),
    /** Media amount; area then comes from the media preset. */
    media: z.object({ type: z.enum(MEDIA_TYPES), volumeL: z.number().gt(0, 'Volume must be above 0.').max(10000) }).optional(),
    /** Suitability 0–1 for water flow past the biofilm (1 = strong flow). Preset by kind when absent. */
    flow: factor.optional(),
    /** Share 0–1 of the tank's dissolved oxygen that reaches the biofilm. */
    oxygen: factor.optional(),
    /** Share 0–1 of the zone lit during the photoperiod. */
    light: share.optional(),
  })
  .refine((z) => (z.areaM2 === undefined) !== (z.media === undefined), {
    message: 'Give either areaM2 or media, not both and not neither.',
    path: ['areaM2'],
  });

export const tapWaterSchema = z.object({
  tanMgN: concentration.default(0),
  no2MgN: concentration.default(0),
  no3MgN: concentration.default(0),
  /** Tap-water carbonate hardness; defaults to the tank's. */
  khDegrees: z.number().min(0).max(40).optional(),
});

export const tankSchema = z
  .object({
    volumeL: z.number().gt(0, 'Volume must be above 0 L.').max(100000, 'At most 100 000 L.'),
    temperatureC: z.number().min(0, 'Temperature must be 0–40 °C.').max(40, 'Temperature must be 0–40 °C.'),
    ph: z.number().min(4, 'pH must be between 4 and 10.').max(10, 'pH must be between 4 and 10.'),
    /** Carbonate hardness, °dKH. Needed when phModel is "carbonate". */
    khDegrees: z.number().min(0, 'KH must be 0 or more.').max(40, 'At most 40 °dKH.').optional(),
    /**
     * "carbonate": KH is a state consumed by nitrification and pH follows it at the tank's
     * CO2; "fixed": pH stays as given. Default: carbonate when khDegrees > 0, else fixed.
     */
    phModel: z.enum(['fixed', 'carbonate']).optional(),
    tapWater: tapWaterSchema.default({ tanMgN: 0, no2MgN: 0, no3MgN: 0 }),
    zones: z.array(zoneSchema).min(1, 'A tank needs at least one zone.').max(8, 'At most 8 zones.'),
    aeration: z.enum(AERATION_LEVELS).default('surface-agitation'),
    lightHoursPerDay: z.number().min(0).max(24).default(8),
    plants: z.enum(PLANTING_LEVELS).default('none'),
    /** Chloride, mg Cl/L, for the chloride-based nitrite limit. */
    chlorideMgL: z.number().min(0).max(20000).optional(),
    /**
     * The keeper's usual water change, repeated every `everyDays` from day `everyDays` to the
     * horizon, beside the timeline's own events. Absent: none.
     */
    routineWaterChange: z
      .object({
        percent: z.number().gt(0, 'Percent must be above 0.').max(90, 'At most 90 %.'),
        // At most daily, as the tank form allows: a shorter interval only multiplies timeline entries.
        everyDays: z.number().min(1, 'At least 1 day apart.').max(365, 'At most 365 days.'),
      })
      .optional(),
  })
  .superRefine((t, ctx) => {
    const seen = new Set<string>();
    t.zones.forEach((zone, i) => {
      if (seen.has(zone.id)) ctx.addIssue({ code: 'custom', message: `The surface "${zone.id}" is listed twice.`, path: ['zones', i, 'id'] });
      seen.add(zone.id);
    });
    if (t.phModel === 'carbonate' && !(t.khDegrees !== undefined && t.khDegrees > 0)) {
      ctx.addIssue({ code: 'custom', message: 'Letting the pH follow the carbonate hardness needs a KH above 0.', path: ['khDegrees'] });
    }
  });

export const fishGroupSchema = z
  .object({
    /** Catalogue id (see simulation/catalogue.ts), e.g. "neon-tetra". */
    species: z.string().min(1).optional(),
    /** Name of a custom animal, or a label for a catalogue group. */
    name: z.string().min(1).max(80).optional(),
    count: z.number().int('Count must be a whole number.').min(1, 'Count must be at least 1.').max(100000),
    lengthCm: z.number().gt(0, 'Length must be above 0 cm.').max(200).optional(),
    shape: z.enum(SHAPE_CLASS_IDS).optional(),
    massG: z.number().gt(0, 'Mass must be above 0 g.').max(100000).optional(),
  })
  .refine((f) => f.species !== undefined || f.name !== undefined, { message: 'Give a species or a name.', path: ['species'] })
  .refine((f) => f.species !== undefined || f.lengthCm !== undefined || f.massG !== undefined, {
    message: 'A fish that is not in the species list needs its length (or its weight).',
    path: ['lengthCm'],
  });

const proteinShare = z.number().gt(0, 'Protein share must be above 0.').max(0.8, 'Protein share is a fraction (0.45 = 45 %).');
export const feedingSchema = z.discriminatedUnion('mode', [
  z.object({ mode: z.literal('grams'), gramsPerDay: z.number().min(0).max(100000), proteinShare: proteinShare.optional() }),
  z.object({ mode: z.literal('body-mass'), percentPerDay: z.number().min(0).max(20).optional(), proteinShare: proteinShare.optional() }),
]);

export const doseAmountSchema = z.discriminatedUnion('unit', [
  z.object({ unit: z.literal('mgN-per-L'), value: z.number().gt(0).max(50, 'More than 50 mg N/L in one dose is refused.') }),
  z.object({ unit: z.literal('ammonium-chloride-g'), grams: z.number().gt(0).max(10000) }),
  z.object({
    unit: z.literal('ammonia-solution-mL'),
    mL: z.number().gt(0).max(100000),
    percentNH3: z.number().gt(0).max(35, 'percentNH3 is % w/w NH3, at most 35.'),
    densityGPerMl: z.number().min(0.85).max(1.0).optional(),
  }),
]);

const removal = {
  day,
  species: z.string().min(1).optional(),
  name: z.string().min(1).optional(),
  count: z.number().int('Count must be a whole number.').min(1, 'Count must be at least 1.').max(100000),
};

export const eventSchema = z.discriminatedUnion('type', [
  z.object({ type: z.literal('add-fish'), day, fish: fishGroupSchema }),
  z.object({ type: z.literal('remove-fish'), ...removal }),
  z.object({
    type: z.literal('move-fish'),
    direction: z.enum(['in', 'out']),
    otherTank: z.string().max(80).optional(),
    day,
    fish: fishGroupSchema,
  }),
  z.object({ type: z.literal('feeding'), day, feeding: feedingSchema }),
  z.object({ type: z.literal('water-change'), day, percent: z.number().gt(0, 'Percent must be above 0.').max(100, 'At most 100 %.') }),
  z.object({
    type: z.literal('ammonia-dose'),
    day,
    amount: doseAmountSchema,
    /** Repeat the same dose every N days… */
    // Keepers dose at most a few times a day [practice]; 6 h apart is the shortest repeat.
    repeatEveryDays: z.number().min(MIN_DOSE_REPEAT_DAYS, 'Repeat at most four times a day (0.25 days apart).').max(365).optional(),
    /** …this many times in all (including the first). */
    repeatCount: z.number().int().min(1).max(1000).optional(),
  }),
  z.object({
    type: z.literal('filter-clean'),
    day,
    zoneId: z.string().min(1).default('filter'),
    action: z.enum(['rinse', 'replace']),
    /** Share of the zone's nitrifiers lost (0–1). */
    shareLost: share,
  }),
  z.object({
    type: z.literal('medication'),
    day,
    name: z.string().max(80).optional(),
    durationDays: z.number().min(MIN_DURATION_DAYS, 'At least an hour (1/24 day).').max(365),
    /** Multiplier on nitrifier activity and growth while it acts (0 = full stop, 1 = harmless). */
    oxidationMultiplier: share,
  }),
  z.object({ type: z.literal('temperature'), day, temperatureC: z.number().min(0).max(40) }),
  z.object({
    type: z.literal('aeration-loss'),
    day,
    durationDays: z.number().min(MIN_DURATION_DAYS, 'At least an hour (1/24 day).').max(365),
    /** Share of the usual dissolved oxygen left while it lasts (0–1). */
    oxygenShare: share,
  }),
]);

export const startSchema = z.discriminatedUnion('kind', [
  /** A new, unseeded tank: each population starts at a small inoculum. */
  z.object({ kind: z.literal('new'), inoculumMgNPerLPerDay: z.number().gt(0).max(1).optional() }),
  /** A tank in steady state at a load (mg TAN-N/day); default: the starting fish and feeding. */
  z.object({ kind: z.literal('mature'), loadMgNPerDay: z.number().min(0).max(1e7).optional() }),
  /** Capacities (mg N/day at the tank temperature) given per zone, e.g. from calibration. */
  z.object({
    kind: z.literal('explicit'),
    capacities: z.array(z.object({ zoneId: z.string().min(1), aoMgNPerDay: z.number().min(0).max(1e7), noMgNPerDay: z.number().min(0).max(1e7) })).max(8),
  }),
]);

export const initialWaterSchema = z.object({
  tanMgN: concentration.optional(),
  no2MgN: concentration.optional(),
  no3MgN: concentration.optional(),
  orgMgN: concentration.optional(),
});

export const scenarioSchema = z
  .object({
    name: z.string().max(200).optional(),
    tank: tankSchema,
    start: startSchema,
    /** Water at day 0; defaults: tap water (new tank) or the steady state (mature). */
    initialWater: initialWaterSchema.default({}),
    fish: z.array(fishGroupSchema).max(200).default([]),
    feeding: feedingSchema.default({ mode: 'body-mass' }),
    events: z.array(eventSchema).max(2000).default([]),
    /** Forecast length when the caller gives none. */
    horizonDays: z.number().min(MIN_DURATION_DAYS, 'At least an hour (1/24 day).').max(3650).optional(),
  })
  .superRefine((s, ctx) => {
    const ids = new Set(s.tank.zones.map((z) => z.id));
    if (s.start.kind === 'explicit') {
      s.start.capacities.forEach((c, i) => {
        if (!ids.has(c.zoneId)) ctx.addIssue({ code: 'custom', message: `This tank has no surface called "${c.zoneId}".`, path: ['start', 'capacities', i, 'zoneId'] });
      });
    }
    s.events.forEach((e, i) => {
      if (e.type === 'filter-clean' && !ids.has(e.zoneId)) {
        ctx.addIssue({ code: 'custom', message: `This tank has no "${e.zoneId}" to clean (its filter bacteria live on: ${[...ids].join(', ')}).`, path: ['events', i, 'zoneId'] });
      }
      if (e.type === 'remove-fish' && e.species === undefined && e.name === undefined) {
        ctx.addIssue({ code: 'custom', message: 'Say which fish: species or name.', path: ['events', i, 'species'] });
      }
      if (s.horizonDays !== undefined && e.day > s.horizonDays) {
        ctx.addIssue({ code: 'custom', message: `Day ${e.day} is after the forecast horizon (${s.horizonDays}).`, path: ['events', i, 'day'] });
      }
    });
    // The engine's work budget (simulation/work-budget.ts), at the edge when the horizon is known.
    if (s.horizonDays !== undefined) {
      const count = countTimelineEntries(s, s.horizonDays);
      if (count.entries > MAX_TIMELINE_ENTRIES) ctx.addIssue({ code: 'custom', message: overBudgetMessage(count, s.horizonDays), path: count.largest.path });
    }
  });

export type Zone = z.output<typeof zoneSchema>;
export type ZoneKind = (typeof ZONE_KINDS)[number];
export type MediaType = (typeof MEDIA_TYPES)[number];
export type AerationLevel = (typeof AERATION_LEVELS)[number];
export type PlantingLevel = (typeof PLANTING_LEVELS)[number];
export type ShapeClassId = (typeof SHAPE_CLASS_IDS)[number];
export type Tank = z.output<typeof tankSchema>;
export type FishGroup = z.output<typeof fishGroupSchema>;
export type FeedingInput = z.output<typeof feedingSchema>;
export type DoseAmount = z.output<typeof doseAmountSchema>;
export type ScenarioEvent = z.output<typeof eventSchema>;
export type Start = z.output<typeof startSchema>;
export type Scenario = z.output<typeof scenarioSchema>;
/** What a caller may write (defaults not yet filled in). */
export type ScenarioInput = z.input<typeof scenarioSchema>;

/** Parses and defaults a scenario, or throws ScenarioError naming each bad field. */
export function parseScenario(input: unknown): Scenario {
  const result = scenarioSchema.safeParse(input);
  if (!result.success) throw new ScenarioError(fieldErrors(result.error.issues));
  return result.data;
}
