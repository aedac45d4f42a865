import { z } from 'zod';
import { scenarioSchema } from '../../simulation/scenario';
import { planEventSchema } from './tank';
import { lessonContentSchema } from './lesson';

export const shareableTypeSchema = z.enum(['plan', 'lesson']);
export type ShareableType = z.infer<typeof shareableTypeSchema>;

/** POST /api/share-links — the owner of a plan, or a manager of a lesson. */
export const createShareLinkSchema = z.strictObject({
  itemType: shareableTypeSchema,
  itemId: z.string().uuid(),
  /** Leave out for a link that works until revoked. */
  expiresInDays: z.number().int('Whole days.').min(1, 'At least 1 day.').max(365, 'At most 365 days.').optional(),
});

/** A link as its creator sees it; the token itself is shown once, at creation. */
export const shareLinkSchema = z.object({
  id: z.string().uuid(),
  itemType: shareableTypeSchema,
  createdAt: z.string(),
  expiresAt: z.string().nullable(),
  revokedAt: z.string().nullable(),
});
export type ShareLinkItem = z.infer<typeof shareLinkSchema>;
export const createdShareLinkSchema = shareLinkSchema.extend({ url: z.string() });
export const shareLinkListSchema = z.object({ links: z.array(shareLinkSchema) });

/** GET /api/share/:token — a read-only view without an account: content only, no ids or e-mail. */
export const sharedViewSchema = z.discriminatedUnion('itemType', [
  z.object({
    itemType: z.literal('plan'),
    plan: z.object({ name: z.string(), startDate: z.string(), events: z.array(planEventSchema) }),
    /** The tank and plan as a forecast scenario, so the page can draw it; null when it cannot be forecast. */
    scenario: scenarioSchema.nullable(),
  }),
  z.object({ itemType: z.literal('lesson'), lesson: lessonContentSchema }),
]);
export type SharedView = z.infer<typeof sharedViewSchema>;
