import { z } from 'zod';
import { clubRoleSchema, displayNameSchema, passwordSchema } from './auth';
import { scenarioSchema } from '../../simulation/scenario';
import { planSchema, tankDetailSchema } from './tank';

/** GET /api/clubs/:clubId — any member of the club may read it. */
export const clubDetailSchema = z.object({
  id: z.string().uuid(),
  name: z.string(),
  myRole: clubRoleSchema,
  members: z.array(z.object({ userId: z.string().uuid(), displayName: z.string(), role: clubRoleSchema })),
});
export type ClubDetail = z.infer<typeof clubDetailSchema>;

// ---- Clubs, invites, roles, shared items, comments (issue 6) -------------------------------

export const clubNameSchema = z.string({ error: 'Give the club a name.' }).trim().min(2, 'Use at least 2 characters.').max(120, 'Use at most 120 characters.');

/** POST /api/clubs — the creator becomes the club's organizer. */
export const createClubSchema = z.strictObject({ name: clubNameSchema });
export type CreateClubInput = z.infer<typeof createClubSchema>;

/** GET /api/clubs — the caller's clubs. */
export const clubSummarySchema = z.object({ id: z.string().uuid(), name: z.string(), myRole: clubRoleSchema, memberCount: z.number().int() });
export const clubListSchema = z.object({ clubs: z.array(clubSummarySchema) });
export type ClubSummary = z.infer<typeof clubSummarySchema>;

/** POST /api/clubs/:clubId/invites — organizers only. */
export const createInviteSchema = z.strictObject({
  email: z
    .string({ error: 'Enter an e-mail address.' })
    .trim()
    .toLowerCase()
    .max(254, 'That e-mail address is too long.')
    .pipe(z.email({ error: 'Enter a valid e-mail address, like name@example.org.' })),
});
export const inviteSchema = z.object({ id: z.string().uuid(), email: z.string(), expiresAt: z.string() });
export type InviteItem = z.infer<typeof inviteSchema>;

/**
 * GET /api/clubs/:clubId/invites — organizers only: invites still waiting for an answer (not
 * accepted, not expired, not revoked), newest first. Never carries the token or its hash.
 */
export const pendingInviteSchema = z.object({
  id: z.string().uuid(),
  email: z.string(),
  /** Display name of the organizer who sent it. */
  invitedBy: z.string(),
  createdAt: z.string(),
  expiresAt: z.string(),
});
export type PendingInvite = z.infer<typeof pendingInviteSchema>;
export const pendingInviteListSchema = z.object({ invites: z.array(pendingInviteSchema) });

/** GET /api/invites/:token — what the person holding an invite link sees before accepting. */
export const invitePreviewSchema = z.object({
  clubName: z.string(),
  invitedBy: z.string(),
  email: z.string(),
  expiresAt: z.string(),
  /** An account already uses the invited address: accept after signing in. */
  accountExists: z.boolean(),
});
export type InvitePreview = z.infer<typeof invitePreviewSchema>;

/**
 * POST /api/invites/:token/accept — signed in: nothing needed; otherwise a name and a password
 * create an account for the invited address (the link proves the address).
 */
export const acceptInviteSchema = z.strictObject({
  displayName: displayNameSchema.optional(),
  password: passwordSchema.optional(),
});
export const acceptInviteResultSchema = z.object({ clubId: z.string().uuid(), role: clubRoleSchema });

/** PUT /api/clubs/:clubId/members/:userId — organizers grant or remove the mentor role. */
export const memberRoleSchema = z.strictObject({ role: z.enum(['mentor', 'member']) });

export const sharedItemTypeSchema = z.enum(['tank', 'plan']);
export type SharedItemType = z.infer<typeof sharedItemTypeSchema>;

/** POST /api/clubs/:clubId/shares — a member shares one of their own tanks or plans. */
export const createShareSchema = z.strictObject({ itemType: sharedItemTypeSchema, itemId: z.string().uuid('Choose a tank or a plan.') });

export const clubShareSchema = z.object({
  id: z.string().uuid(),
  itemType: sharedItemTypeSchema,
  title: z.string(),
  ownerName: z.string(),
  mine: z.boolean(),
  commentCount: z.number().int(),
  sharedAt: z.string(),
});
export type ClubShare = z.infer<typeof clubShareSchema>;
export const clubShareListSchema = z.object({ shares: z.array(clubShareSchema) });

export const commentSchema = z.object({ id: z.string().uuid(), authorName: z.string(), authorRole: clubRoleSchema, body: z.string(), createdAt: z.string() });
export type CommentItem = z.infer<typeof commentSchema>;
export const commentListSchema = z.object({ comments: z.array(commentSchema) });
/** POST /api/clubs/:clubId/shares/:shareId/comments — mentors and organizers, on plans. */
export const createCommentSchema = z.strictObject({
  body: z.string({ error: 'Write a comment.' }).trim().min(1, 'Write a comment.').max(2000, 'Use at most 2000 characters.'),
});

/**
 * GET /api/clubs/:clubId/shares/:shareId — the shared tank (its plans only when one of them is
 * the shared item), or the shared plan with its tank and a scenario for the forecast.
 */
export const sharedItemDetailSchema = z.object({
  share: clubShareSchema,
  tank: tankDetailSchema,
  plan: planSchema.nullable(),
  scenario: scenarioSchema.nullable(),
  comments: z.array(commentSchema),
});
export type SharedItemDetail = z.infer<typeof sharedItemDetailSchema>;
