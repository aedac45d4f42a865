import { Router } from 'express';
import type { AppDeps } from '../deps.js';
import { escapeHtml } from '../mail/mailer.js';
import { ReminderOptOut } from '../entities/reminder-opt-out.js';
import { UNSUBSCRIBE_PURPOSE } from '../jobs/reminders.js';
import { verifySignedPayload } from '../services/secret-tokens.js';

const page = (title: string, body: string) => `<!doctype html>
<html lang="en"><head><meta charset="utf-8"><meta name="viewport" content="width=device-width, initial-scale=1"><title>${escapeHtml(title)}</title></head>
<body style="font-family: system-ui, sans-serif; line-height: 1.5; max-width: 32rem; margin: 3rem auto; padding: 0 1rem;">
<h1 style="font-size: 1.4rem;">${escapeHtml(title)}</h1><p>${escapeHtml(body)}</p></body></html>`;

/**
 * /api/unsubscribe/:token — the link in every reminder. It works without signing in (the token
 * is an HMAC of the user id with UNSUBSCRIBE_SECRET). A GET only shows a confirm button, so
 * mail scanners that prefetch links do not unsubscribe anyone; the button POSTs (RFC 8058
 * one-click style). Pages are plain HTML with no script, within the API's CSP.
 */
export function unsubscribeRouter({ config }: AppDeps): Router {
  const router = Router();
  const userOf = (token: unknown) => (typeof token === 'string' ? verifySignedPayload(config.unsubscribeSecret, UNSUBSCRIBE_PURPOSE, token) : null);

  router.get('/:token', (req, res) => {
    if (!userOf(req.params.token)) {
      res.status(404).type('html').send(page('Link not valid', 'This unsubscribe link is not valid.'));
      return;
    }
    res.type('html').send(
      page('Stop test-day reminders?', 'Press the button to stop e-mail reminders on your plans’ test days. Alerts about high readings continue.').replace(
        '</body>',
        `<form method="post"><button type="submit" style="font-size: 1rem; padding: 0.6rem 1.2rem;">Stop reminders</button></form></body>`,
      ),
    );
  });

  return router;
}

/**
 * The confirming POST is a plain form post (no CSRF header, form-encoded), so it is mounted
 * before the JSON-only request guards; it can only ever unsubscribe the token's own user.
 */
export function unsubscribeConfirmRouter({ dataSource: ds, config, logger }: AppDeps): Router {
  const router = Router();
  router.post('/:token', async (req, res) => {
    const token = req.params.token;
    const userId = typeof token === 'string' ? verifySignedPayload(config.unsubscribeSecret, UNSUBSCRIBE_PURPOSE, token) : null;
    if (!userId) {
      res.status(404).type('html').send(page('Link not valid', 'This unsubscribe link is not valid.'));
      return;
    }
    await ds.getRepository(ReminderOptOut).createQueryBuilder().insert().values({ userId }).orIgnore().execute();
    logger.log('info', 'reminders.unsubscribed', { userId });
    res.type('html').send(page('Reminders stopped', 'You will get no more test-day reminders. Alerts about high readings continue.'));
  });
  return router;
}
