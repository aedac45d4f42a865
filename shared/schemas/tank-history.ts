import { z } from 'zod';
import { isoDate } from './iso-date';

/**
 * What the keeper says about the tank's past, the evidence a forecast starts from when no
 * recent test or applied fit says more (shared/tank-start.ts):
 * - settled: running for months with the fish it holds now (nitrifiers match that load);
 * - new: set up recently, nothing has fed its filter yet;
 * - emptied: the filter was mature with `formerFish` until `matureUntil`, and no fish since;
 * - seeded: a new tank whose filter holds `sharePercent` % media from a mature filter.
 */
export const formerFishSchema = z.strictObject({
  speciesId: z.string().trim().min(1, 'Choose a species.').max(64),
  count: z.number({ error: 'Enter how many.' }).int('Use a whole number.').min(1, 'At least 1.').max(10000, 'At most 10 000.'),
});
export const tankHistorySchema = z.discriminatedUnion('kind', [
  z.strictObject({ kind: z.literal('settled') }),
  z.strictObject({ kind: z.literal('new') }),
  z.strictObject({
    kind: z.literal('emptied'),
    matureUntil: isoDate,
    formerFish: z.array(formerFishSchema).min(1, 'Say which fish the filter fed.').max(20, 'At most 20 kinds.'),
  }),
  z.strictObject({
    kind: z.literal('seeded'),
    sharePercent: z.number({ error: 'Enter a percentage.' }).int('Use a whole percentage.').min(5, 'At least 5 %.').max(100, 'At most 100 %.'),
  }),
]);
export type TankHistory = z.infer<typeof tankHistorySchema>;
export type TankHistoryKind = TankHistory['kind'];

/** Nitrifier capacities of one zone, mg N/day at the tank temperature (the engine's explicit start). */
export const zoneCapacitySchema = z.object({ zoneId: z.string(), aoMgNPerDay: z.number(), noMgNPerDay: z.number() });

/**
 * A fit of the model to the tank's tests, kept server-side: the latest one run ("offered") and
 * the one the keeper applied (every later forecast starts from its capacities).
 */
export const tankFitSchema = z.object({
  id: z.string().uuid(),
  /** when the fit ran; its capacities are those at the last test it used */
  fittedAt: z.string(),
  appliedAt: z.string().nullable(),
  lastReadingAt: z.string(),
  readingsUsed: z.number().int(),
  verdict: z.enum(['good', 'fair', 'poor']),
  capacities: z.array(zoneCapacitySchema),
});
export type TankFit = z.infer<typeof tankFitSchema>;
export const applyFitSchema = z.strictObject({ fitId: z.string().uuid('Not a fit id.') });
