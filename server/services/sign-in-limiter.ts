import type { DataSource } from 'typeorm';
import { tooManyRequests } from '../errors.js';
import { countInWindow } from './attempt-limiter.js';

/**
 * Brute-force limit for sign-in (ASVS 6.3.1, OWASP Authentication cheat sheet): failures are
 * rows in PostgreSQL, counted over a sliding window per account and per client address, so
 * the limit holds across server processes. Attempts refused by the limit are not counted, so
 * the window always ends.
 */
export const SIGN_IN_WINDOW_SECONDS = 15 * 60;
/** Failures allowed per account in the window; the next attempt is refused. */
export const MAX_FAILURES_PER_ACCOUNT = 5;
/** Failures allowed per address across all accounts (password spraying from one place). */
export const MAX_FAILURES_PER_ADDRESS = 20;

/** This account's or this address's failures in the window (the shared sliding-window query). */
async function countWindow(ds: DataSource, column: 'email' | 'address', value: string): Promise<{ failures: number; retryAfter: number }> {
  const { count, retryAfter } = await countInWindow(ds, 'sign_in_failures', { [column]: value }, SIGN_IN_WINDOW_SECONDS);
  return { failures: count, retryAfter };
}

/** Throws 429 with Retry-After when the account or the address has used up its failures. */
export async function assertSignInAllowed(ds: DataSource, email: string, address: string): Promise<void> {
  const [byAccount, byAddress] = await Promise.all([countWindow(ds, 'email', email), countWindow(ds, 'address', address)]);
  const blocked = [
    byAccount.failures >= MAX_FAILURES_PER_ACCOUNT ? byAccount.retryAfter : 0,
    byAddress.failures >= MAX_FAILURES_PER_ADDRESS ? byAddress.retryAfter : 0,
  ];
  const wait = Math.max(...blocked);
  if (wait > 0) throw tooManyRequests(wait, 'Too many failed sign-ins. Wait a few minutes, or reset your password.');
}

export async function recordSignInFailure(ds: DataSource, email: string, address: string): Promise<void> {
  await ds.query(`INSERT INTO sign_in_failures (email, address) VALUES ($1, $2)`, [email, address.slice(0, 64)]);
  // Keep the table small; old rows no longer count towards any window.
  await ds.query(`DELETE FROM sign_in_failures WHERE created_at < now() - interval '1 day'`);
}

/** A successful sign-in clears that account's count (not the address's other failures). */
export async function clearSignInFailures(ds: DataSource, email: string): Promise<void> {
  await ds.query(`DELETE FROM sign_in_failures WHERE email = $1`, [email]);
}
