import { createHash } from 'node:crypto';
import type { DataSource } from 'typeorm';
import type { Config } from '../config.js';
import { tooManyRequests } from '../errors.js';
import type { Logger } from '../logger.js';

/** Anything that runs SQL: a DataSource or a transaction's EntityManager. */
export interface Queryable {
  query(sql: string, parameters?: unknown[]): Promise<unknown>;
}

/** Tables counted over sliding windows, and the columns a window may filter on. */
interface WindowTables {
  sign_in_failures: 'email' | 'address';
  auth_attempts: 'action' | 'subject';
}

export interface WindowCount {
  count: number;
  /** Seconds until the oldest counted row leaves the window (at least 1). */
  retryAfter: number;
  /** Seconds since the newest counted row (null when none). */
  sinceNewest: number | null;
}

/**
 * The one sliding-window query behind every attempt limit (sign-in failures and the attempt
 * limits below): rows matching `filters` created within the last `windowSeconds`. Table and
 * column names come from the WindowTables type, never from a request.
 */
export async function countInWindow<T extends keyof WindowTables>(
  q: Queryable,
  table: T,
  filters: Partial<Record<WindowTables[T], string>>,
  windowSeconds: number,
): Promise<WindowCount> {
  const entries = Object.entries(filters) as [string, string][];
  if (entries.length === 0) throw new Error('countInWindow needs at least one filter');
  const where = entries.map(([column], i) => `"${column}" = $${i + 2}`).join(' AND ');
  const rows = (await q.query(
    `SELECT count(*) AS n,
            ceil(extract(epoch FROM (min(created_at) + make_interval(secs => $1) - now()))) AS retry_after,
            extract(epoch FROM (now() - max(created_at))) AS since_newest
       FROM "${table}"
      WHERE ${where} AND created_at > now() - make_interval(secs => $1)`,
    [windowSeconds, ...entries.map(([, value]) => value)],
  )) as { n: string; retry_after: string | null; since_newest: string | null }[];
  const sinceNewest = rows[0]?.since_newest;
  return {
    count: Number(rows[0]?.n ?? 0),
    retryAfter: Math.max(1, Number(rows[0]?.retry_after ?? 1)),
    sinceNewest: sinceNewest === null || sinceNewest === undefined ? null : Number(sinceNewest),
  };
}

/**
 * Takes a transaction-scoped advisory lock per key, in a fixed order so two callers sharing
 * keys cannot deadlock. Every check-then-record limit runs its count and insert under these
 * locks, so concurrent requests in any number of server processes see each other's rows.
 */
export async function lockSubjects(tx: Queryable, keys: string[]): Promise<void> {
  for (const key of [...new Set(keys)].sort()) await tx.query(`SELECT pg_advisory_xact_lock(hashtextextended($1, 0))`, [key]);
}

/** The anonymous auth routes that cost a bcrypt hash (cost 12, ~0.2 s) or send an e-mail. */
export type AttemptAction = 'sign-up' | 'reset-password' | 'forgot-password' | 'invite-accept';

export interface AttemptLimit {
  max: number;
  windowSeconds: number;
}

const MINUTE = 60;
const HOUR = 60 * MINUTE;

/**
 * Attempts allowed per window (common practice: a few times what one household or club evening
 * behind one address needs, far below what an attacker needs to burn CPU or fill a mailbox).
 * Attempts refused by a limit are not counted, so the window always ends.
 */
export const ATTEMPT_LIMITS = {
  // A new account costs a bcrypt hash and an e-mail; ten from one address in an hour covers a family or a
  // club table, and three per target e-mail (a retyped form, a lost link) cannot flood a mailbox.
  'sign-up': { address: { max: 10, windowSeconds: HOUR }, email: { max: 3, windowSeconds: HOUR } },
  // Reset tokens are 32 random bytes (no guessing); the limit bounds the bcrypt hash done before the token is checked.
  'reset-password': { address: { max: 10, windowSeconds: 15 * MINUTE } },
  // Each request may send an e-mail: per target e-mail so one mailbox cannot be flooded, per address for spraying.
  'forgot-password': { address: { max: 20, windowSeconds: HOUR }, email: { max: 5, windowSeconds: HOUR } },
  // Accepting may create an account (a bcrypt hash); a club evening on one network stays well below.
  'invite-accept': { address: { max: 20, windowSeconds: 15 * MINUTE } },
} as const satisfies Record<AttemptAction, { address: AttemptLimit; email?: AttemptLimit }>;

/** Rows older than the longest window no longer count anywhere. */
const LONGEST_WINDOW_SECONDS = Math.max(
  ...Object.values(ATTEMPT_LIMITS).flatMap((perSubject): AttemptLimit[] => Object.values(perSubject)).map((l) => l.windowSeconds),
);

export interface AttemptRefusal {
  /** Which limit was reached. */
  by: 'address' | 'email';
  retryAfter: number;
}

const sha256 = (s: string) => createHash('sha256').update(s).digest('hex');

/**
 * Counts one attempt at `action` from `address` (and for `email` when the action has a per-email
 * limit), or refuses it without counting. Check and insert run in one transaction holding an
 * advisory lock per subject, so concurrent attempts in any number of server processes cannot
 * all slip under the limit together. Returns the refusal, or null when the attempt may go on.
 */
export async function takeAttempt(ds: DataSource, action: AttemptAction, who: { address: string; email?: string }): Promise<AttemptRefusal | null> {
  const limits: { address: AttemptLimit; email?: AttemptLimit } = ATTEMPT_LIMITS[action];
  const checks: { by: AttemptRefusal['by']; subject: string; limit: AttemptLimit }[] = [
    { by: 'address', subject: `ip:${who.address.slice(0, 64)}`, limit: limits.address },
  ];
  if (limits.email && who.email !== undefined) {
    checks.push({ by: 'email', subject: `email:${sha256(who.email.trim().toLowerCase())}`, limit: limits.email });
  }
  return ds.transaction(async (tx) => {
    await lockSubjects(tx, checks.map((c) => `auth_attempts|${action}|${c.subject}`));
    let refusal: AttemptRefusal | null = null;
    for (const c of checks) {
      const { count, retryAfter } = await countInWindow(tx, 'auth_attempts', { action, subject: c.subject }, c.limit.windowSeconds);
      if (count >= c.limit.max && (!refusal || retryAfter > refusal.retryAfter)) refusal = { by: c.by, retryAfter };
    }
    if (refusal) return refusal;
    for (const c of checks) await tx.query(`INSERT INTO auth_attempts (action, subject) VALUES ($1, $2)`, [action, c.subject]);
    await tx.query(`DELETE FROM auth_attempts WHERE created_at < now() - make_interval(secs => $1)`, [LONGEST_WINDOW_SECONDS]);
    return null;
  });
}

/** The app adds the wait from Retry-After (lib/form-errors.ts). */
export const TOO_MANY_ATTEMPTS_MESSAGE = 'Too many attempts for now.';

/**
 * For routes: counts the attempt, or throws 429 with Retry-After and logs `auth.rate_limited`
 * (the action, the address and which limit; never the e-mail, a password or a token). Does
 * nothing when limits are off (AUTH_ATTEMPT_LIMITS=off, API tests only). Call it before any
 * bcrypt hash or e-mail.
 */
export async function enforceAttemptLimit(
  deps: { dataSource: DataSource; config: Pick<Config, 'attemptLimitsEnabled'>; logger: Logger },
  action: AttemptAction,
  who: { address: string; email?: string },
): Promise<void> {
  if (!deps.config.attemptLimitsEnabled) return;
  const refusal = await takeAttempt(deps.dataSource, action, who);
  if (!refusal) return;
  deps.logger.log('warn', 'auth.rate_limited', { action, by: refusal.by, address: who.address, retryAfter: refusal.retryAfter });
  throw tooManyRequests(refusal.retryAfter, TOO_MANY_ATTEMPTS_MESSAGE);
}
