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
/**
 * Most parts a split dose may have: 8 a day, 3 h apart, as a dosing pump's timer gives
 * [practice]; closer than that is a continuous dose (`delivery: 'continuous'`).
 */
export const MAX_DOSES_PER_DAY = 8;
/** How a dose enters the tank: in pulses (all at once, or split through the day) or as a steady flow. */
export const DOSE_DELIVERIES = ['pulses', 'continuous'] as const;
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

/** How many animals of one kind; a missing or unreadable count says so in words. */
const fishCount = z
  .number({ error: (issue) => (issue.input === undefined ? 'Say how many.' : 'Enter how many as a whole number.') })
  .int('Count must be a whole number.')
  .min(1, 'Count must be at least 1.')
  .max(100000, 'At most 100 000 fish in one group.');

/** Most kinds of fish one fish event names (a shop visit rarely brings more) [practice]. */
export const MAX_GROUPS_PER_EVENT = 20;

/** A catalogue id (simulation/catalogue.ts), e.g. "neon-tetra". */
const speciesId = z.string().min(1, 'Choose a species.');
/** The keeper's own name for a fish (a custom animal, or a label for a catalogue group). */
const ownName = z.string().min(1, 'Give the fish a name.').max(80, 'At most 80 characters.');

/** The groups of one fish event: at least one, at most MAX_GROUPS_PER_EVENT. */
function groupList<T extends z.ZodType>(group: T) {
  return z.array(group).min(1, 'Name at least one kind of fish.').max(MAX_GROUPS_PER_EVENT, `At most ${MAX_GROUPS_PER_EVENT} kinds of fish in one event.`);
}

export const fishGroupSchema = z
  .object({
    species: speciesId.optional(),
    name: ownName.optional(),
    count: fishCount,
    lengthCm: z.number({ error: 'Enter the length in cm as a number.' }).gt(0, 'Length must be above 0 cm.').max(200, 'At most 200 cm.').optional(),
    shape: z.enum(SHAPE_CLASS_IDS).optional(),
    massG: z.number({ error: 'Enter the mass in g as a number.' }).gt(0, 'Mass must be above 0 g.').max(100000, 'At most 100 kg a fish.').optional(),
  })
  .refine((f) => f.species !== undefined || f.name !== undefined, { message: 'Choose a species or name your own fish.', path: ['species'] })
  .refine((f) => f.species !== undefined || f.lengthCm !== undefined || f.massG !== undefined, {
    message: 'A fish that is not in the species list needs its length (or its weight).',
    path: ['lengthCm'],
  });

/**
 * The fish of one add or move event: a list of groups (10 neon tetras and 6 corydoras). A
 * single group, the format before several were allowed, is still read and becomes a list of one.
 */
const fishGroupsSchema = z.union([groupList(fishGroupSchema), fishGroupSchema.transform((g) => [g])], {
  error: 'List the fish: each kind with its species or name and its count.',
});

/** Fish leaving: which (catalogue species or the keeper's own name) and how many. */
export const removalGroupSchema = z
  .object({
    species: speciesId.optional(),
    name: ownName.optional(),
    count: fishCount,
  })
  .refine((f) => f.species !== undefined || f.name !== undefined, { message: 'Say which fish: species or name.', path: ['species'] });

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

/**
 * An ammonia dose. `amount` is one dose; it repeats every `repeatEveryDays` (`repeatCount` times
 * in all, or to the horizon). Each dose goes in at once, or spread over the 24 h from its start:
 * `timesPerDay` equal parts 24/n h apart, or `delivery: 'continuous'` (a dosing pump or drip)
 * at a steady amount/day. Absent fields: one pulse, as before they existed.
 */
export const ammoniaDoseSchema = z
  .object({
    type: z.literal('ammonia-dose'),
    day,
    amount: doseAmountSchema,
    /** Repeat the same dose every N days… */
    // Keepers dose at most a few times a day [practice]; 6 h apart is the shortest repeat.
    repeatEveryDays: z.number().min(MIN_DOSE_REPEAT_DAYS, 'Repeat at most four times a day (0.25 days apart).').max(365).optional(),
    /** …this many times in all (including the first). */
    repeatCount: z.number().int('repeatCount must be a whole number.').min(1, 'repeatCount must be at least 1.').max(1000, 'repeatCount is at most 1000.').optional(),
    /** Pulses (default) or a steady flow over each dose's day. */
    delivery: z.enum(DOSE_DELIVERIES, { error: 'delivery is "pulses" or "continuous".' }).optional(),
    /** Pulses: each dose split into this many equal parts, 24/n h apart (default 1: all at once). */
    timesPerDay: z
      .number({ error: `timesPerDay must be a whole number from 1 to ${MAX_DOSES_PER_DAY}.` })
      .int('timesPerDay must be a whole number.')
      .min(1, 'timesPerDay must be at least 1.')
      .max(MAX_DOSES_PER_DAY, `timesPerDay is at most ${MAX_DOSES_PER_DAY} (3 h apart); for more, dose continuously.`)
      .optional(),
  })
  .superRefine((e, ctx) => {
    const continuous = e.delivery === 'continuous';
    if (continuous && e.timesPerDay !== undefined && e.timesPerDay > 1) {
      ctx.addIssue({ code: 'custom', message: 'A continuous dose is not split: leave timesPerDay out (or 1), or deliver in pulses.', path: ['timesPerDay'] });
    }
    // A spread dose takes its day: the next one may start when it has ended, not before.
    if ((continuous || (e.timesPerDay ?? 1) > 1) && e.repeatEveryDays !== undefined && e.repeatEveryDays < 1) {
      ctx.addIssue({
        code: 'custom',
        message: `A ${continuous ? 'continuous' : 'split'} dose is spread over a day, so repeatEveryDays must be at least 1.`,
        path: ['repeatEveryDays'],
      });
    }
  });

/**
 * A removal: `fish`, a list of groups; or, the format before several were allowed (still read),
 * one group as `species`/`name` and `count` on the event itself.
 */
const removalEvent = z
  .object({
    type: z.literal('remove-fish'),
    day,
    fish: groupList(removalGroupSchema).optional(),
    species: speciesId.optional(),
    name: ownName.optional(),
    count: fishCount.optional(),
  })
  .superRefine((e, ctx) => {
    const single = e.species !== undefined || e.name !== undefined || e.count !== undefined;
    if (e.fish !== undefined && single) ctx.addIssue({ code: 'custom', message: 'Give the fish as a list, or one species with its count, not both.', path: ['fish'] });
    if (e.fish !== undefined) return;
    if (e.species === undefined && e.name === undefined) ctx.addIssue({ code: 'custom', message: 'Say which fish: species or name.', path: ['fish'] });
    else if (e.count === undefined) ctx.addIssue({ code: 'custom', message: 'Say how many.', path: ['count'] });
  });

/** Every event kind as written; `eventSchema` below is what the engine reads. */
export const eventShapesSchema = z.discriminatedUnion('type', [
  z.object({ type: z.literal('add-fish'), day, fish: fishGroupsSchema }),
  removalEvent,
  z.object({
    type: z.literal('move-fish'),
    direction: z.enum(['in', 'out']),
    otherTank: z.string().max(80).optional(),
    day,
    fish: fishGroupsSchema,
  }),
  z.object({ type: z.literal('feeding'), day, feeding: feedingSchema }),
  z.object({ type: z.literal('water-change'), day, percent: z.number().gt(0, 'Percent must be above 0.').max(100, 'At most 100 %.') }),
  ammoniaDoseSchema,
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

type EventShape = z.output<typeof eventShapesSchema>;
type RemovalGroup = z.output<typeof removalGroupSchema>;
type NormalEvent = Exclude<EventShape, { type: 'remove-fish' }> | { type: 'remove-fish'; day: number; fish: RemovalGroup[] };

/** One shape per kind: a removal always lists its groups (`fish`), whichever format it came in. */
function normalEvent(e: EventShape): NormalEvent {
  if (e.type !== 'remove-fish') return e;
  const { type, day, fish, species, name, count } = e;
  return { type, day, fish: fish ?? [{ ...(species !== undefined ? { species } : {}), ...(name !== undefined ? { name } : {}), count: count ?? 0 }] };
}

/** A timeline event; fish events carry a list of groups (`fish`), each with its count. */
export const eventSchema = eventShapesSchema.transform(normalEvent);

export const startSchema = z.discriminatedUnion('kind', [
  /** A new, unseeded tank: each population starts at a small inoculum. */
  z.object({ kind: z.literal('new'), inoculumMgNPerLPerDay: z.number().gt(0).max(1).optional() }),
  /** A tank in steady state at a load (mg TAN-N/day); default: the starting fish and feeding. */
  z.object({ kind: z.literal('mature'), loadMgNPerDay: z.number().min(0).max(1e7).optional() }),
  /**
   * A filter that was mature at a load (mg TAN-N/day, or the fish that made it) and has had no
   * fish for `starvedDays` before day 0 (an emptied tank): steady state, then starved.
   */
  z.object({
    kind: z.literal('starved'),
    loadMgNPerDay: z.number().min(0).max(1e7).optional(),
    formerFish: z.array(fishGroupSchema).min(1).max(200).optional(),
    starvedDays: z.number().min(0, 'Days count from 0.').max(3650, 'At most 10 years.'),
  }),
  /**
   * A new tank seeded with mature media: its filter zones start with `share` of the capacity a
   * mature filter carries at the load (default: the starting fish, else the fish the events add).
   */
  z.object({ kind: z.literal('seeded'), share: z.number().gt(0, 'Share must be above 0.').max(1, 'At most 1 (all of it).'), loadMgNPerDay: z.number().min(0).max(1e7).optional() }),
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
    if (s.start.kind === 'starved' && (s.start.loadMgNPerDay === undefined) === (s.start.formerFish === undefined)) {
      ctx.addIssue({ code: 'custom', message: 'Give the load the filter carried or the fish that made it (one of them).', path: ['start', 'formerFish'] });
    }
    if (s.start.kind === 'explicit') {
      s.start.capacities.forEach((c, i) => {
        if (!ids.has(c.zoneId)) ctx.addIssue({ code: 'custom', message: `This tank has no surface called "${c.zoneId}".`, path: ['start', 'capacities', i, 'zoneId'] });
      });
    }
    s.events.forEach((e, i) => {
      if (e.type === 'filter-clean' && !ids.has(e.zoneId)) {
        ctx.addIssue({ code: 'custom', message: `This tank has no "${e.zoneId}" to clean (its filter bacteria live on: ${[...ids].join(', ')}).`, path: ['events', i, 'zoneId'] });
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
export type FishRemoval = z.output<typeof removalGroupSchema>;
export type FeedingInput = z.output<typeof feedingSchema>;
export type DoseAmount = z.output<typeof doseAmountSchema>;
export type ScenarioEvent = z.output<typeof eventSchema>;
export type AmmoniaDoseEvent = z.output<typeof ammoniaDoseSchema>;
export type DoseDelivery = (typeof DOSE_DELIVERIES)[number];
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
