import { Router } from 'express';
import { outboxSchema } from '../../shared/schemas/outbox.js';
import type { AppDeps } from '../deps.js';
import { notFound, serviceUnavailable } from '../errors.js';
import { isLoopbackPeer } from '../middleware/client-address.js';

/**
 * Development only (mounted when NODE_ENV is not production and MAIL_FAKE_URL is set): lists
 * the e-mails the local mail fake captured, for the app's outbox page. Answers only to a
 * client on this machine.
 */
export function devRouter({ config }: AppDeps): Router {
  const router = Router();
  router.get('/outbox', async (req, res) => {
    if (!isLoopbackPeer(req) || !config.mailFakeUrl) throw notFound();
    const answer = await fetch(`${config.mailFakeUrl}/messages`, { signal: AbortSignal.timeout(3_000) }).catch(() => null);
    if (!answer?.ok) throw serviceUnavailable();
    const outbox = outboxSchema.safeParse(await answer.json().catch(() => null));
    if (!outbox.success) throw serviceUnavailable();
    res.json(outbox.data);
  });
  return router;
}
