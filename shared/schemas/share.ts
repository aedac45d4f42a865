import { z } from 'zod';
import { scenarioSchema } from '../../simulation/scenario';
import { planEventSchema } from './tank';
import { lessonContentSchema } from './lesson';

export const shareableTypeSchema = z.enum(['plan', 'lesson']);
export type ShareableType = z.infer<typeof shareableTypeSchema>;

/** A link works this many days unless its maker chooses otherwise; none works for ever. */
export const SHARE_LINK_DEFAULT_DAYS = 30;
export const SHARE_LINK_MAX_DAYS = 365;
/** The lifetimes the share panel offers (the API takes any whole number of days up to the maximum). */
export const SHARE_LINK_CHOICES = [7, SHARE_LINK_DEFAULT_DAYS, SHARE_LINK_MAX_DAYS] as const;

/** POST /api/share-links — the owner of a plan, or a manager of a lesson. */
export const createShareLinkSchema = z.strictObject({
  itemType: shareableTypeSchema,
  itemId: z.string().uuid(),
  /** Leave out for the default lifetime. */
  expiresInDays: z
    .number()
    .int('Whole days.')
    .min(1, 'At least 1 day.')
    .max(SHARE_LINK_MAX_DAYS, `At most ${SHARE_LINK_MAX_DAYS} days.`)
    .default(SHARE_LINK_DEFAULT_DAYS),
});

/**
 * A link as the people who manage it see it (its maker; for a lesson, the club's organizers
 * too); the token itself is shown once, at creation.
 */
export const shareLinkSchema = z.object({
  id: z.string().uuid(),
  itemType: shareableTypeSchema,
  createdAt: z.string(),
  expiresAt: z.string(),
  revokedAt: z.string().nullable(),
  /** The maker's display name, and whether that is the caller. */
  madeBy: z.string(),
  mine: z.boolean(),
});
export type ShareLinkItem = z.infer<typeof shareLinkSchema>;
export const createdShareLinkSchema = shareLinkSchema.extend({ url: z.string() });
/**
 * A retry of a keyed create (same Idempotency-Key) gets the link it made without its address:
 * the token is shown in the first answer only and never stored. Revoke it by id and create another.
 */
export const replayedShareLinkSchema = shareLinkSchema.extend({ url: z.null(), urlShownOnce: z.literal(true) });
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
