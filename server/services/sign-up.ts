import { createHash, randomBytes } from 'node:crypto';
import type { DataSource } from 'typeorm';
import type { SignUpInput } from '../../shared/schemas/auth.js';
import { returnedRows } from '../data-source.js';
import { validationFailed } from '../errors.js';
import { User } from '../entities/user.js';
import type { Mailer } from '../mail/mailer.js';
import { signUpConfirmMail } from '../mail/templates/sign-up-confirm.js';
import { signUpExistingAccountMail } from '../mail/templates/sign-up-existing-account.js';
import { createAccount } from './accounts.js';
import { lockSubjects } from './attempt-limiter.js';
import { RESET_TOKEN_VALID_MINUTES, issueResetLink } from './password-reset.js';
import { hashPassword } from './passwords.js';

/**
 * Sign-up without account enumeration (OWASP Authentication cheat sheet): the request always
 * answers 202 with SIGN_UP_SENT_MESSAGE and the work happens after the answer. An address
 * without an account gets a single-use link that makes the account and signs it in; an address
 * with one gets an e-mail saying so, with a sign-in link and a reset link. Only the mailbox's
 * owner learns which, and the link also proves the address is theirs.
 */
export const SIGN_UP_LINK_VALID_HOURS = 24;
/** True in both cases, so it says nothing about whether the address has an account. */
export const SIGN_UP_SENT_MESSAGE =
  `We sent an e-mail to this address. If it has no account yet, open the link in it within ${SIGN_UP_LINK_VALID_HOURS} hours to finish creating yours; if it already has one, the e-mail helps you sign in instead.`;
export const INVALID_SIGN_UP_LINK_MESSAGE = 'This sign-up link is not valid, has expired or was used. Sign in, or sign up again.';

const sha256 = (s: string) => createHash('sha256').update(s).digest('hex');

/** Background part of POST /api/auth/sign-up: the link for a new address, or the "you already have an account" e-mail. */
export async function requestSignUp(ds: DataSource, mailer: Mailer, appUrl: string, input: SignUpInput): Promise<void> {
  const existing = await ds.getRepository(User).findOneBy({ email: input.email });
  if (existing) {
    const resetLink = await issueResetLink(ds, appUrl, existing);
    await mailer.send(
      existing.email,
      signUpExistingAccountMail({
        displayName: existing.displayName,
        signInLink: `${appUrl}/sign-in`,
        resetLink: resetLink ?? `${appUrl}/forgot-password`,
        resetValidMinutes: resetLink ? RESET_TOKEN_VALID_MINUTES : null,
      }),
    );
    return;
  }
  const token = randomBytes(32).toString('base64url');
  const passwordHash = await hashPassword(input.password);
  await ds.query(`DELETE FROM pending_sign_ups WHERE expires_at < now()`);
  await ds.query(
    `INSERT INTO pending_sign_ups (token_hash, email, display_name, password_hash, expires_at)
     VALUES ($1, $2, $3, $4, now() + make_interval(hours => $5))`,
    [sha256(token), input.email, input.displayName, passwordHash, SIGN_UP_LINK_VALID_HOURS],
  );
  const link = `${appUrl}/confirm-sign-up?token=${encodeURIComponent(token)}`;
  await mailer.send(input.email, signUpConfirmMail({ displayName: input.displayName, link, validHours: SIGN_UP_LINK_VALID_HOURS }));
}

/**
 * Makes the account from a valid, unexpired sign-up link. Everything runs under an advisory lock
 * on the address, taken before any row is touched (so two links for one address opened at once
 * queue instead of deadlocking); the link is claimed with one DELETE, so it works once, and the
 * address's other pending links go with it. An address that got an account meanwhile (another
 * link, an invite) refuses the link.
 */
export async function confirmSignUp(ds: DataSource, token: string): Promise<User> {
  const tokenHash = sha256(token);
  return ds.transaction(async (tx) => {
    const [found] = (await tx.query(`SELECT email FROM pending_sign_ups WHERE token_hash = $1`, [tokenHash])) as { email: string }[];
    if (!found) throw validationFailed({ token: INVALID_SIGN_UP_LINK_MESSAGE });
    await lockSubjects(tx, [`sign_up|${found.email}`]);
    const claimed: unknown[] = await tx.query(
      `DELETE FROM pending_sign_ups WHERE token_hash = $1 AND expires_at > now()
       RETURNING email, display_name, password_hash`,
      [tokenHash],
    );
    const pending = returnedRows<{ email: string; display_name: string; password_hash: string }>(claimed)[0];
    if (!pending) throw validationFailed({ token: INVALID_SIGN_UP_LINK_MESSAGE });
    await tx.query(`DELETE FROM pending_sign_ups WHERE email = $1`, [pending.email]);
    if (await tx.getRepository(User).existsBy({ email: pending.email })) throw validationFailed({ token: INVALID_SIGN_UP_LINK_MESSAGE });
    return createAccount(tx, { email: pending.email, displayName: pending.display_name, passwordHash: pending.password_hash });
  });
}
