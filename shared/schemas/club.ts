import { z } from 'zod';
import { clubRoleSchema } from './auth';

/** GET /api/clubs/:clubId — any member of the club may read it. */
export const clubDetailSchema = z.object({
  id: z.string().uuid(),
  name: z.string(),
  myRole: clubRoleSchema,
  members: z.array(z.object({ userId: z.string().uuid(), displayName: z.string(), role: clubRoleSchema })),
});
export type ClubDetail = z.infer<typeof clubDetailSchema>;
