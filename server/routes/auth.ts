import { Router } from 'express';
import { confirmSignUpSchema, forgotPasswordSchema, resetPasswordSchema, signInSchema, signUpSchema } from '../../shared/schemas/auth.js';
import type { AppDeps } from '../deps.js';
import { invalidCredentials, tooManyRequests } from '../errors.js';
import { clientAddress, clientIp } from '../middleware/client-address.js';
import { validBody, validateBody } from '../middleware/validate.js';
import { presentMe } from '../presenters/me.js';
import { assertPasswordNotCommon, authenticate, listMemberships } from '../services/accounts.js';
import { enforceAttemptLimit } from '../services/attempt-limiter.js';
import { resetPassword, sendPasswordReset } from '../services/password-reset.js';
import { clearSignInFailures, takeSignInAttempt } from '../services/sign-in-limiter.js';
import { SIGN_UP_SENT_MESSAGE, confirmSignUp, requestSignUp } from '../services/sign-up.js';
import { SESSION_COOKIE_NAME, destroySession, startUserSession } from '../session.js';

export function authRouter({ dataSource: ds, config, mailer, logger, background }: AppDeps): Router {
  const router = Router();
  const limits = { dataSource: ds, config, logger };

  // Sign-up, forgot-password and reset-password go through the attempt limiter before any
  // bcrypt hash or e-mail (server/services/attempt-limiter.ts).
  router.post('/sign-up', validateBody(signUpSchema), async (req, res) => {
    const input = validBody(req, signUpSchema);
    // Per target e-mail too, so the form cannot flood one mailbox; counted whether or not an
    // account has it, so a 429 says nothing either.
    await enforceAttemptLimit(limits, 'sign-up', { address: clientAddress(req), email: input.email });
    assertPasswordNotCommon(input.password, input.email);
    // The same answer, at the same speed, whether or not the address has an account: the link
    // or the "you already have one" e-mail is made after the answer (server/services/sign-up.ts).
    background.run('sign-up-mail', () => requestSignUp(ds, mailer, config.appUrl, input));
    res.status(202).json({ message: SIGN_UP_SENT_MESSAGE });
  });

  router.post('/confirm-sign-up', validateBody(confirmSignUpSchema), async (req, res) => {
    const { token } = validBody(req, confirmSignUpSchema);
    const user = await confirmSignUp(ds, token);
    await startUserSession(req, user.id);
    logger.log('info', 'auth.sign_up', { userId: user.id });
    res.status(201).json(presentMe(user, []));
  });

  router.post('/sign-in', validateBody(signInSchema), async (req, res) => {
    const { email, password } = validBody(req, signInSchema);
    const address = clientAddress(req);
    // Counted and recorded as a failure before bcrypt (server/services/sign-in-limiter.ts).
    const refusal = await takeSignInAttempt(ds, email, address);
    if (refusal) {
      logger.log('warn', 'auth.sign_in_limited', { email, address, ip: clientIp(req), by: refusal.by, retryAfter: refusal.retryAfter });
      throw tooManyRequests(refusal.retryAfter, refusal.message);
    }
    const user = await authenticate(ds, email, password);
    if (!user) {
      logger.log('warn', 'auth.sign_in_failed', { email, address, ip: clientIp(req) });
      throw invalidCredentials();
    }
    await clearSignInFailures(ds, email, address);
    await startUserSession(req, user.id);
    logger.log('info', 'auth.sign_in', { userId: user.id, address });
    res.json(presentMe(user, await listMemberships(ds, user.id)));
  });

  router.post('/sign-out', async (req, res) => {
    const userId = req.session?.userId;
    await destroySession(req);
    res.clearCookie(SESSION_COOKIE_NAME, { path: '/', httpOnly: true, sameSite: 'lax' });
    if (userId) logger.log('info', 'auth.sign_out', { userId });
    res.status(204).end();
  });

  router.post('/forgot-password', validateBody(forgotPasswordSchema), async (req, res) => {
    const { email } = validBody(req, forgotPasswordSchema);
    // Counted per address and per target e-mail whether or not an account has it, so a 429
    // says nothing about which e-mails have accounts.
    await enforceAttemptLimit(limits, 'forgot-password', { address: clientAddress(req), email });
    // The work runs after the answer, so neither the answer nor its timing tells whether an
    // account has this e-mail.
    background.run('password-reset-mail', () => sendPasswordReset(ds, mailer, config.appUrl, email));
    res.status(202).json({ message: 'If an account has this e-mail, a reset link is on its way.' });
  });

  router.post('/reset-password', validateBody(resetPasswordSchema), async (req, res) => {
    const { token, password } = validBody(req, resetPasswordSchema);
    await enforceAttemptLimit(limits, 'reset-password', { address: clientAddress(req) });
    await resetPassword(ds, token, password);
    logger.log('info', 'auth.password_reset', {});
    // This browser's own session (if any) ended with all others: clear its cookie too.
    res.clearCookie(SESSION_COOKIE_NAME, { path: '/', httpOnly: true, sameSite: 'lax' });
    res.status(204).end();
  });

  return router;
}
