import { describe, expect, it } from 'vitest';
import { MAX_FAILURES_PER_ACCOUNT, MAX_FAILURES_PER_ADDRESS, SIGN_IN_WINDOW_SECONDS } from '../../server/services/sign-in-limiter.js';
import { GOOD_PASSWORD, createUser } from './helpers/factories.js';
import { client, useTestApp } from './helpers/test-app.js';

const ctx = useTestApp();
const wrong = (email: string, from = '203.0.113.7') =>
  client(ctx.app).post('/api/auth/sign-in', { email, password: 'wrong-guess-000' }).set('X-Forwarded-For', from);

describe('sign-in brute-force limit (ASVS 6.3.1)', () => {
  it('refuses the 6th attempt after 5 failures with 429 and Retry-After; other accounts still sign in', async () => {
    expect(MAX_FAILURES_PER_ACCOUNT).toBe(5);
    await createUser(ctx.deps.dataSource, { email: 'eel@example.org' });
    await createUser(ctx.deps.dataSource, { email: 'carp@example.org' });
    for (let i = 0; i < 5; i++) await wrong('eel@example.org').expect(401);

    const limited = await wrong('eel@example.org').expect(429);
    expect(limited.body.error.code).toBe('too_many_requests');
    const retryAfter = Number(limited.headers['retry-after']);
    expect(retryAfter).toBeGreaterThan(0);
    expect(retryAfter).toBeLessThanOrEqual(SIGN_IN_WINDOW_SECONDS);
    // The right password does not get through while the account is limited.
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

  it('a successful sign-in clears the account count', async () => {
    await createUser(ctx.deps.dataSource, { email: 'eel@example.org' });
    for (let i = 0; i < 4; i++) await wrong('eel@example.org').expect(401);
    await client(ctx.app).post('/api/auth/sign-in', { email: 'eel@example.org', password: GOOD_PASSWORD }).expect(200);
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
});
