import { Router, type Request } from 'express';
import { outboxSchema } from '../../shared/schemas/outbox.js';
import type { AppDeps } from '../deps.js';
import { notFound, serviceUnavailable } from '../errors.js';
import { isLoopbackPeer } from '../middleware/client-address.js';

/** Headers a proxy adds: a request carrying one came through a proxy, so its peer proves nothing. */
const FORWARDING_HEADERS = ['forwarded', 'x-forwarded-for', 'x-forwarded-host', 'x-forwarded-proto', 'x-real-ip', 'via'];

/** A request straight from a browser on this machine: loopback peer and no proxy in between. */
function isDirectLocalRequest(req: Request): boolean {
  return isLoopbackPeer(req) && FORWARDING_HEADERS.every((h) => req.headers[h] === undefined);
}

/**
 * Local development only: mounted only with DEV_OUTBOX=on (which production refuses) and a
 * MAIL_FAKE_URL, it lists the e-mails the local mail fake captured — reset links among them —
 * for the app's outbox page. Even then it answers only a direct request from this machine: a
 * same-host proxy makes every visitor a loopback peer, so a forwarded request is refused.
 */
export function devRouter({ config }: AppDeps): Router {
  const router = Router();
  router.get('/outbox', async (req, res) => {
    if (!config.devOutbox || !config.mailFakeUrl || !isDirectLocalRequest(req)) throw notFound();
    const answer = await fetch(`${config.mailFakeUrl}/messages`, { signal: AbortSignal.timeout(3_000) }).catch(() => null);
    if (!answer?.ok) throw serviceUnavailable();
    const outbox = outboxSchema.safeParse(await answer.json().catch(() => null));
    if (!outbox.success) throw serviceUnavailable();
    res.json(outbox.data);
  });
  return router;
}
