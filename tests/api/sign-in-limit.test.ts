import { describe, expect, it } from 'vitest';
import {
  ACCOUNT_FREE_FAILURES,
  MAX_FAILURES_PER_ACCOUNT_AND_ADDRESS,
  MAX_FAILURES_PER_ADDRESS,
  SIGN_IN_LIMIT_MESSAGES,
  SIGN_IN_WINDOW_SECONDS,
  accountDelaySeconds,
} from '../../server/services/sign-in-limiter.js';
import { GOOD_PASSWORD, createUser } from './helpers/factories.js';
import { client, useTestApp, type TestApp } from './helpers/test-app.js';

const ctx = useTestApp();
const wrong = (email: string, from = '203.0.113.7', app: TestApp = ctx.app) =>
  client(app).post('/api/auth/sign-in', { email, password: 'wrong-guess-000' }).set('X-Forwarded-For', from);
const right = (email: string, from: string) =>
  client(ctx.app).post('/api/auth/sign-in', { email, password: GOOD_PASSWORD }).set('X-Forwarded-For', from);
/** Moves every recorded failure `seconds` into the past (as if that time had passed). */
const age = (seconds: number) =>
  ctx.deps.dataSource.query(`UPDATE sign_in_failures SET created_at = created_at - make_interval(secs => $1)`, [seconds]);
const NEW_PASSWORD = 'brackish-heron-sunrise-7';

async function resetPasswordOf(email: string): Promise<void> {
  await client(ctx.app).post('/api/auth/forgot-password', { email }).set('X-Forwarded-For', '192.0.2.200').expect(202);
  await ctx.deps.background.drain();
  const mail = await ctx.mail.waitFor((m) => m.to.includes(email));
  const token = /reset-password\?token=([A-Za-z0-9_-]+)/.exec(mail.text)![1];
  await client(ctx.app).post('/api/auth/reset-password', { token, password: NEW_PASSWORD }).expect(204);
}

describe('sign-in brute-force limit (ASVS 6.3.1)', () => {
  it('refuses the 6th attempt after 5 failures with 429 and Retry-After; other accounts still sign in', async () => {
    expect(MAX_FAILURES_PER_ACCOUNT_AND_ADDRESS).toBe(5);
    await createUser(ctx.deps.dataSource, { email: 'eel@example.org' });
    await createUser(ctx.deps.dataSource, { email: 'carp@example.org' });
    for (let i = 0; i < 5; i++) await wrong('eel@example.org').expect(401);

    const limited = await wrong('eel@example.org').expect(429);
    expect(limited.body.error).toEqual({ code: 'too_many_requests', message: SIGN_IN_LIMIT_MESSAGES['account-address'] });
    const retryAfter = Number(limited.headers['retry-after']);
    expect(retryAfter).toBeGreaterThan(0);
    expect(retryAfter).toBeLessThanOrEqual(SIGN_IN_WINDOW_SECONDS);
    // The right password does not get through from this address while the pair is locked.
    await client(ctx.app)
      .post('/api/auth/sign-in', { email: 'eel@example.org', password: GOOD_PASSWORD })
      .set('X-Forwarded-For', '203.0.113.7')
      .expect(429);
    // Same address, another account: unaffected.
    await client(ctx.app)
      .post('/api/auth/sign-in', { email: 'carp@example.org', password: GOOD_PASSWORD })
      .set('X-Forwarded-For', '203.0.113.7')
      .expect(200);
    expect(ctx.logs.entries.some((e) => e.event === 'auth.sign_in_limited')).toBe(true);
  });

  it('keeps the count in PostgreSQL: a second server process over the same database also refuses', async () => {
    await createUser(ctx.deps.dataSource, { email: 'eel@example.org' });
    for (let i = 0; i < 5; i++) await wrong('eel@example.org').expect(401);
    const other = ctx.makeApp();
    await client(other)
      .post('/api/auth/sign-in', { email: 'eel@example.org', password: GOOD_PASSWORD })
      .set('X-Forwarded-For', '203.0.113.7')
      .expect(429);
  });

  it('lets the account in again once its failures are older than the window', async () => {
    await createUser(ctx.deps.dataSource, { email: 'eel@example.org' });
    for (let i = 0; i < 5; i++) await wrong('eel@example.org').expect(401);
    await ctx.deps.dataSource.query(`UPDATE sign_in_failures SET created_at = now() - make_interval(secs => $1 + 1)`, [SIGN_IN_WINDOW_SECONDS]);
    await client(ctx.app).post('/api/auth/sign-in', { email: 'eel@example.org', password: GOOD_PASSWORD }).expect(200);
  });

  it('a successful sign-in clears the account count from that address', async () => {
    await createUser(ctx.deps.dataSource, { email: 'eel@example.org' });
    for (let i = 0; i < 4; i++) await wrong('eel@example.org').expect(401);
    await right('eel@example.org', '203.0.113.7').expect(200);
    for (let i = 0; i < 5; i++) await wrong('eel@example.org').expect(401);
    await wrong('eel@example.org').expect(429);
  });

  it('limits one address spraying many accounts', async () => {
    const from = '198.51.100.9';
    for (let i = 0; i < MAX_FAILURES_PER_ADDRESS; i++) await wrong(`spray${i}@example.org`, from).expect(401);
    await createUser(ctx.deps.dataSource, { email: 'carp@example.org' });
    await client(ctx.app)
      .post('/api/auth/sign-in', { email: 'carp@example.org', password: GOOD_PASSWORD })
      .set('X-Forwarded-For', from)
      .expect(429);
    // From elsewhere the account is fine.
    await client(ctx.app)
      .post('/api/auth/sign-in', { email: 'carp@example.org', password: GOOD_PASSWORD })
      .set('X-Forwarded-For', '192.0.2.44')
      .expect(200);
  });

  it('50 parallel wrong sign-ins for one account from one address, across two server processes: at most 5 reach the password check, the rest 429', async () => {
    await createUser(ctx.deps.dataSource, { email: 'eel@example.org' });
    const other = ctx.makeApp();
    const statuses = await Promise.all(
      Array.from({ length: 50 }, (_, i) => wrong('eel@example.org', '203.0.113.7', i % 2 ? other : ctx.app)),
    ).then((rs) => rs.map((r) => r.status));
    expect(statuses.filter((s) => s === 401).length).toBeLessThanOrEqual(MAX_FAILURES_PER_ACCOUNT_AND_ADDRESS);
    expect(statuses.filter((s) => s === 401).length + statuses.filter((s) => s === 429).length).toBe(50);
    const [{ n }] = await ctx.deps.dataSource.query(`SELECT count(*)::int AS n FROM sign_in_failures`);
    expect(n, 'refused attempts are not recorded').toBe(MAX_FAILURES_PER_ACCOUNT_AND_ADDRESS);

    // The lock is per (account, address): the owner elsewhere signs in with the right password…
    await right('eel@example.org', '198.51.100.30').expect(200);
    // …while this address stays locked for this account, and says a reset lifts it.
    const locked = await right('eel@example.org', '203.0.113.7').expect(429);
    expect(locked.body.error.message).toMatch(/Resetting your password lifts this at once/);
  });

  it('a password reset lifts the lock at once: the new password signs in from the locked address', async () => {
    await createUser(ctx.deps.dataSource, { email: 'eel@example.org' });
    await Promise.all(Array.from({ length: 20 }, () => wrong('eel@example.org')));
    await right('eel@example.org', '203.0.113.7').expect(429);
    await resetPasswordOf('eel@example.org');
    await client(ctx.app).post('/api/auth/sign-in', { email: 'eel@example.org', password: NEW_PASSWORD }).set('X-Forwarded-For', '203.0.113.7').expect(200);
  });

  it('spreads guesses from many addresses out with a growing delay per account, not a lockout; a reset lifts it too', async () => {
    expect(ACCOUNT_FREE_FAILURES).toBe(10);
    expect([9, 10, 11, 12, 30].map(accountDelaySeconds)).toEqual([0, 1, 2, 4, 900]);
    await createUser(ctx.deps.dataSource, { email: 'eel@example.org' });
    // Two networks use up their five each: ten failures on the account.
    for (const from of ['203.0.113.7', '203.0.113.8']) for (let i = 0; i < 5; i++) await wrong('eel@example.org', from).expect(401);
    // A third network, right away: the account asks it to wait a second.
    const waiting = await wrong('eel@example.org', '203.0.113.9').expect(429);
    expect(waiting.body.error.message).toBe(SIGN_IN_LIMIT_MESSAGES.account);
    expect(Number(waiting.headers['retry-after'])).toBe(1);
    // Once the second has passed the try is checked (and fails), and the next wait is two seconds.
    await age(1.5);
    await wrong('eel@example.org', '203.0.113.9').expect(401);
    // (Retry-After counts from the last failure, so time spent between requests comes off it.)
    const longer = await right('eel@example.org', '192.0.2.50').expect(429);
    expect(Number(longer.headers['retry-after'])).toBeGreaterThanOrEqual(1);
    expect(Number(longer.headers['retry-after'])).toBeLessThanOrEqual(accountDelaySeconds(11));
    // After the wait the owner gets in from anywhere: nobody can keep the account shut.
    await age(2.5);
    await right('eel@example.org', '192.0.2.50').expect(200);

    // The guesses from elsewhere still count: one more, and the wait is up to four seconds.
    await wrong('eel@example.org', '203.0.113.10').expect(401);
    const wait = Number((await right('eel@example.org', '192.0.2.51').expect(429)).headers['retry-after']);
    expect(wait).toBeGreaterThanOrEqual(1);
    expect(wait).toBeLessThanOrEqual(accountDelaySeconds(12));
    // A reset clears the account's failures, so the delay is gone at once.
    await resetPasswordOf('eel@example.org');
    await client(ctx.app).post('/api/auth/sign-in', { email: 'eel@example.org', password: NEW_PASSWORD }).set('X-Forwarded-For', '192.0.2.51').expect(200);
  });

  it('counts an IPv6 client by its /64: rotating addresses inside it does not buy more guesses', async () => {
    await createUser(ctx.deps.dataSource, { email: 'eel@example.org' });
    for (let i = 1; i <= 5; i++) await wrong('eel@example.org', `2001:db8:1:2::${i.toString(16)}`).expect(401);
    await wrong('eel@example.org', '2001:db8:1:2:ffff:ffff:ffff:ffff').expect(429);
    // The neighbouring /64 is another network.
    await right('eel@example.org', '2001:db8:1:3::1').expect(200);
    const rows: { address: string }[] = await ctx.deps.dataSource.query(`SELECT DISTINCT address FROM sign_in_failures`);
    expect(rows).toEqual([{ address: '2001:db8:1:2::/64' }]);
  });

  it('says nothing about whether an account exists: an unknown e-mail is limited the same way', async () => {
    await createUser(ctx.deps.dataSource, { email: 'eel@example.org' });
    const burst = (email: string) =>
      Promise.all(Array.from({ length: 12 }, () => wrong(email))).then((rs) => rs.map((r) => r.status).sort());
    expect(await burst('nobody@example.org')).toEqual(await burst('eel@example.org'));
  });
});
