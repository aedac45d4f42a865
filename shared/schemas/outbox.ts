import { z } from 'zod';

/** One e-mail captured by the development mail fake (GET /api/dev/outbox). */
export const outboxMessageSchema = z.object({
  id: z.number().int(),
  to: z.array(z.string()),
  from: z.string(),
  subject: z.string(),
  text: z.string(),
  html: z.string(),
  /** ISO 8601. */
  date: z.string(),
});
export type OutboxMessage = z.infer<typeof outboxMessageSchema>;

/** Newest first. */
export const outboxSchema = z.object({ messages: z.array(outboxMessageSchema) });
export type Outbox = z.infer<typeof outboxSchema>;
