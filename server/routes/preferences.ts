import { Router } from 'express';
import { preferencesSchema } from '../../shared/schemas/preferences.js';
import type { AppDeps } from '../deps.js';
import { currentUser, requireAuth } from '../middleware/require-auth.js';
import { validateBody, validBody } from '../middleware/validate.js';
import { presentPreferences } from '../presenters/preferences.js';
import { findPreferences, putPreferences } from '../services/preferences.js';

/** /api/me/preferences: display units and reminders of the signed-in person. */
export function preferencesRouter({ dataSource: ds, config }: AppDeps): Router {
  const router = Router();
  const auth = requireAuth(ds, config);
  router.get('/', auth, async (req, res) => {
    res.json(presentPreferences(await findPreferences(ds, currentUser(req).id)));
  });
  router.put('/', auth, validateBody(preferencesSchema), async (req, res) => {
    res.json(presentPreferences(await putPreferences(ds, currentUser(req).id, validBody(req, preferencesSchema))));
  });
  return router;
}
