import { z } from 'zod';

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
