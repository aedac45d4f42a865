import { z } from 'zod';
import { tankHistorySchema } from './tank-history';

/**
 * What a forecast of a stored tank started from (shared/tank-start.ts decides it; the start
 * line in shared/start-words.ts words it).
 */

/** Where the nitrifiers at day 0 come from. */
export const START_REASONS = [
  'given',
  'fitted',
  'described-settled',
  'described-new',
  'described-emptied',
  'described-seeded',
  'mature-present-load',
  'new-unseeded',
  'new-no-fish',
] as const;
export type StartReason = (typeof START_REASONS)[number];

/** The latest test up to the start day; `used` when recent enough to give the day-0 water. */
export const startTestSchema = z.object({
  takenAt: z.string(),
  tanMgN: z.number().nullable(),
  no2MgN: z.number().nullable(),
  no3MgN: z.number().nullable(),
  /** days from the test to day 0 (0 on the start day) */
  daysBefore: z.number(),
  used: z.boolean(),
});
export type StartTest = z.infer<typeof startTestSchema>;

export const startWarningSchema = z.discriminatedUnion('kind', [
  z.object({ kind: z.literal('test-old'), takenAt: z.string(), daysBefore: z.number() }),
  z.object({ kind: z.literal('test-contradicts-settled'), takenAt: z.string(), tanMgN: z.number().nullable(), no2MgN: z.number().nullable() }),
  z.object({ kind: z.literal('fit-other-zones'), fittedAt: z.string() }),
]);
export type StartWarning = z.infer<typeof startWarningSchema>;

export const startStateSchema = z.object({
  reason: z.enum(START_REASONS),
  /** the forecast's day 0 (YYYY-MM-DD; null when no date was given and tests were not read) */
  startDate: z.string().nullable(),
  test: startTestSchema.nullable(),
  /** when the applied fit the nitrifiers come from ran (null: no fit used) */
  fittedAt: z.string().nullable(),
  history: tankHistorySchema.nullable(),
  warnings: z.array(startWarningSchema),
});
export type StartState = z.infer<typeof startStateSchema>;
