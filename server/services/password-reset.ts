import { createHash, randomBytes } from 'node:crypto';
import type { DataSource } from 'typeorm';
import { IsNull, MoreThan } from 'typeorm';
import { validationFailed } from '../errors.js';
import { PasswordResetToken } from '../entities/password-reset-token.js';
import { User } from '../entities/user.js';
import type { Mailer } from '../mail/mailer.js';
import { passwordResetMail } from '../mail/templates/password-reset.js';
import { assertPasswordNotCommon } from './accounts.js';
import { hashPassword } from './passwords.js';
import { endAllSessionsOf } from './sessions.js';
import { clearAccountSignInFailures } from './sign-in-limiter.js';
import { returnedRows } from '../data-source.js';

export const RESET_TOKEN_VALID_MINUTES = 60;
/** At most this many reset e-mails per account per hour, so the form cannot flood an inbox. */
export const MAX_RESET_MAILS_PER_HOUR = 3;
export const INVALID_TOKEN_MESSAGE = 'This reset link is not valid or has expired. Ask for a new one.';

const sha256 = (s: string) => createHash('sha256').update(s).digest('hex');

/**
 * Issues a single-use reset link for the user (only the token's SHA-256 is stored; earlier
 * unused links are retired), or null when the account already had MAX_RESET_MAILS_PER_HOUR.
 */
export async function issueResetLink(ds: DataSource, appUrl: string, user: User): Promise<string | null> {
  const token = randomBytes(32).toString('base64url');
  const issued = await ds.transaction(async (tx) => {
    // Lock the user's row so concurrent requests count and insert one after another.
    await tx.getRepository(User).createQueryBuilder('u').setLock('pessimistic_write').where('u.id = :id', { id: user.id }).getOne();
    const tokens = tx.getRepository(PasswordResetToken);
    const recent = await tokens.countBy({ userId: user.id, createdAt: MoreThan(new Date(Date.now() - 60 * 60 * 1000)) });
    if (recent >= MAX_RESET_MAILS_PER_HOUR) return false;
    // Only the newest link works: earlier unused ones are retired.
    await tokens.update({ userId: user.id, usedAt: IsNull() }, { usedAt: new Date() });
    await tokens.insert({
      tokenHash: sha256(token),
      userId: user.id,
      expiresAt: new Date(Date.now() + RESET_TOKEN_VALID_MINUTES * 60 * 1000),
      usedAt: null,
    });
    return true;
  });
  return issued ? `${appUrl}/reset-password?token=${encodeURIComponent(token)}` : null;
}

/**
 * Sends a single-use reset link when an account has the e-mail; does nothing otherwise. The
 * caller answers the same way in both cases.
 */
export async function sendPasswordReset(ds: DataSource, mailer: Mailer, appUrl: string, email: string): Promise<void> {
  const user = await ds.getRepository(User).findOneBy({ email });
  if (!user) return;
  const link = await issueResetLink(ds, appUrl, user);
  if (!link) return;
  await mailer.send(user.email, passwordResetMail({ displayName: user.displayName, link, validMinutes: RESET_TOKEN_VALID_MINUTES }));
}

/**
 * Sets a new password from a valid, unexpired, unused token; marks it used and ends all the
 * user's sessions. The token is claimed with one conditional UPDATE, so it works only once even
 * when two requests race.
 */
export async function resetPassword(ds: DataSource, token: string, password: string): Promise<void> {
  const passwordHash = await hashPassword(password);
  await ds.transaction(async (tx) => {
    const claimed: unknown[] = await tx.query(
      `UPDATE password_reset_tokens SET used_at = now()
        WHERE token_hash = $1 AND used_at IS NULL AND expires_at > now()
        RETURNING user_id`,
      [sha256(token)],
    );
    const rows = returnedRows<{ user_id: string }>(claimed);
    const userId = rows[0]?.user_id;
    if (!userId) throw validationFailed({ token: INVALID_TOKEN_MESSAGE });
    const user = await tx.getRepository(User).findOneByOrFail({ id: userId });
    assertPasswordNotCommon(password, user.email);
    await tx.getRepository(User).update({ id: userId }, { passwordHash, passwordChangedAt: new Date() });
    await tx.getRepository(PasswordResetToken).update({ userId, usedAt: IsNull() }, { usedAt: new Date() });
    await endAllSessionsOf(tx, userId);
    // The new password is signed in with at once, from anywhere (the 429 sign-in message says so).
    await clearAccountSignInFailures(tx, user.email);
  });
}
