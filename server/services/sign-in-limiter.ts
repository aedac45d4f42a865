import type { DataSource } from 'typeorm';
import { countInWindow, lockSubjects, type Queryable } from './attempt-limiter.js';

/**
 * Brute-force limits for sign-in (ASVS 6.3.1, OWASP Authentication cheat sheet), as rows in
 * PostgreSQL (`sign_in_failures`) so they hold across server processes:
 *
 * - a hard lock per (account, address): 5 failures in 15 minutes from one network lock that
 *   pair until the oldest leaves the window; the owner elsewhere is not locked out;
 * - a progressive delay per account from any address: past 10 failures in a day, each try
 *   waits 1 s, 2 s, 4 s … (at most 15 minutes) after the last failure, which bounds guessing
 *   spread over many addresses without letting anyone lock an account out for good;
 * - a cap per address across accounts (password spraying from one place).
 *
 * Every attempt is counted and recorded as a failure in one locked transaction BEFORE bcrypt;
 * a correct password then removes its (account, address) rows. Refused attempts are not
 * recorded, so every window ends. A password reset clears the account's rows.
 */
export const SIGN_IN_WINDOW_SECONDS = 15 * 60;
/** Failures allowed per account from one address in the window; the next attempt is refused. */
export const MAX_FAILURES_PER_ACCOUNT_AND_ADDRESS = 5;
/** Failures allowed per address across all accounts in the window. */
export const MAX_FAILURES_PER_ADDRESS = 20;
/** The progressive delay counts an account's failures over this window (rows are kept as long). */
export const ACCOUNT_DELAY_WINDOW_SECONDS = 24 * 60 * 60;
/** Failures an account takes in the delay window before tries are spaced out (two networks' worth). */
export const ACCOUNT_FREE_FAILURES = 2 * MAX_FAILURES_PER_ACCOUNT_AND_ADDRESS;
export const ACCOUNT_DELAY_MAX_SECONDS = 15 * 60;

/** Seconds an attempt must wait after the account's last failure, given its failures in the day. */
export function accountDelaySeconds(failures: number): number {
  if (failures < ACCOUNT_FREE_FAILURES) return 0;
  return Math.min(ACCOUNT_DELAY_MAX_SECONDS, 2 ** (failures - ACCOUNT_FREE_FAILURES));
}

/** Which limit refused an attempt. */
export type SignInLimit = 'account-address' | 'account' | 'address';

export interface SignInRefusal {
  by: SignInLimit;
  retryAfter: number;
  message: string;
}

/** Words for each refusal; the app adds "Try again in …" from Retry-After (lib/form-errors.ts). */
export const SIGN_IN_LIMIT_MESSAGES: Record<SignInLimit, string> = {
  'account-address': 'Too many wrong passwords for this account from your network. Resetting your password lifts this at once.',
  account: 'This account has had many wrong passwords lately, so each new try has to wait. Resetting your password lifts this at once.',
  // A reset clears the account's failures, not the other accounts' tried from this network.
  address: 'Too many wrong passwords from your network.',
};

/**
 * Counts this attempt and records it as a failure, or refuses it without recording. The three
 * counts and the insert run under advisory locks on the account and the address, so parallel
 * attempts (in any process) are serialised: at most MAX_FAILURES_PER_ACCOUNT_AND_ADDRESS of a
 * burst get as far as bcrypt. Returns the refusal, or null when the password may be checked.
 */
export async function takeSignInAttempt(ds: DataSource, email: string, address: string): Promise<SignInRefusal | null> {
  const subject = address.slice(0, 64);
  return ds.transaction(async (tx) => {
    await lockSubjects(tx, [`sign_in|email|${email}`, `sign_in|address|${subject}`]);
    const pair = await countInWindow(tx, 'sign_in_failures', { email, address: subject }, SIGN_IN_WINDOW_SECONDS);
    const byAddress = await countInWindow(tx, 'sign_in_failures', { address: subject }, SIGN_IN_WINDOW_SECONDS);
    const account = await countInWindow(tx, 'sign_in_failures', { email }, ACCOUNT_DELAY_WINDOW_SECONDS);
    const waits: [SignInLimit, number][] = [];
    if (pair.count >= MAX_FAILURES_PER_ACCOUNT_AND_ADDRESS) waits.push(['account-address', pair.retryAfter]);
    if (byAddress.count >= MAX_FAILURES_PER_ADDRESS) waits.push(['address', byAddress.retryAfter]);
    const delay = accountDelaySeconds(account.count) - (account.sinceNewest ?? Infinity);
    if (delay > 0) waits.push(['account', Math.ceil(delay)]);
    if (waits.length > 0) {
      const retryAfter = Math.max(...waits.map(([, s]) => s));
      // The message must hold for every limit in the way: only the address limit outlives a reset.
      const by = waits.some(([l]) => l === 'address') ? 'address' : waits.some(([l]) => l === 'account-address') ? 'account-address' : 'account';
      return { by, retryAfter, message: SIGN_IN_LIMIT_MESSAGES[by] };
    }
    await tx.query(`INSERT INTO sign_in_failures (email, address) VALUES ($1, $2)`, [email, subject]);
    // Keep the table small; rows older than the longest window no longer count anywhere.
    await tx.query(`DELETE FROM sign_in_failures WHERE created_at < now() - make_interval(secs => $1)`, [ACCOUNT_DELAY_WINDOW_SECONDS]);
    return null;
  });
}

/**
 * A correct password removes this account's failures from this address (the attempt's own row
 * among them). Failures from other addresses stay: they are someone else's guesses.
 */
export async function clearSignInFailures(ds: DataSource, email: string, address: string): Promise<void> {
  await ds.query(`DELETE FROM sign_in_failures WHERE email = $1 AND address = $2`, [email, address.slice(0, 64)]);
}

/** A password reset ends every limit on the account: old guesses say nothing about the new password. */
export async function clearAccountSignInFailures(q: Queryable, email: string): Promise<void> {
  await q.query(`DELETE FROM sign_in_failures WHERE email = $1`, [email]);
}
