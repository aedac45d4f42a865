import { Router } from 'express';
import type { AppDeps } from '../deps.js';
import { currentUser, requireAuth } from '../middleware/require-auth.js';
import { presentMe } from '../presenters/me.js';
import { listMemberships } from '../services/accounts.js';

export function meRouter({ dataSource: ds, config }: AppDeps): Router {
  const router = Router();
  router.get('/', requireAuth(ds, config), async (req, res) => {
    const user = currentUser(req);
    res.json(presentMe(user, await listMemberships(ds, user.id)));
  });
  return router;
}
