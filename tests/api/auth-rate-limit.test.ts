import { randomBytes } from 'node:crypto';
import { afterEach, beforeEach, describe, expect, it, vi } from 'vitest';
import { loadConfig } from '../../server/config.js';
import { ClubInvite } from '../../server/entities/club-invite.js';
import { User } from '../../server/entities/user.js';
import { ATTEMPT_LIMITS, TOO_MANY_ATTEMPTS_MESSAGE } from '../../server/services/attempt-limiter.js';
import { hashPassword } from '../../server/services/passwords.js';
import { GOOD_PASSWORD, addMember, createClub, createUser } from './helpers/factories.js';
import { client, useTestApp, type TestApp } from './helpers/test-app.js';

// Pass-through spy on bcrypt hashing: a refused attempt must not reach the hash at all.
vi.mock('../../server/services/passwords.js', async (importOriginal) => {
  const actual = await importOriginal<typeof import('../../server/services/passwords.js')>();
  return { ...actual, hashPassword: vi.fn(actual.hashPassword) };
});

// The API tests' default config turns the limits off; this file tests them, so they are on.
const ctx = useTestApp({ env: { AUTH_ATTEMPT_LIMITS: 'on' } });
const hashCalls = () => vi.mocked(hashPassword).mock.calls.length;

/** An anonymous browser behind `address` (the test app trusts loopback proxies' X-Forwarded-For). */
const from = (address: string, app: TestApp = ctx.app) => {
  const c = client(app);
  return { post: (url: string, body: object) => c.post(url, body).set('X-Forwarded-For', address) };
};

const NEW_PASSWORD = 'copper-reef-lantern-73';
const userCount = () => ctx.deps.dataSource.getRepository(User).count();
const pendingCount = async () => ((await ctx.deps.dataSource.query(`SELECT count(*)::int AS n FROM pending_sign_ups`)) as { n: number }[])[0].n;
const wellFormedToken = () => randomBytes(32).toString('base64url');

/** Checks a 429 in the project's error shape with a Retry-After inside the window. */
function expectLimited(res: { status: number; body: { error: { code: string; message: string } }; headers: Record<string, string> }, windowSeconds: number) {
  expect(res.status).toBe(429);
  expect(res.body).toEqual({ error: { code: 'too_many_requests', message: TOO_MANY_ATTEMPTS_MESSAGE } });
  const retryAfter = Number(res.headers['retry-after']);
  expect(retryAfter).toBeGreaterThan(0);
  expect(retryAfter).toBeLessThanOrEqual(windowSeconds);
}

/** Every `auth.rate_limited` log entry; none may carry an e-mail, password or token. */
function limitedLogs(secrets: string[]) {
  const entries = ctx.logs.entries.filter((e) => e.event === 'auth.rate_limited');
  for (const e of entries) for (const s of secrets) expect(JSON.stringify(e.fields)).not.toContain(s);
  return entries;
}

beforeEach(() => {
  vi.mocked(hashPassword).mockClear();
});
// Reset e-mails are sent after the answer: let them land before the next test clears the mail fake.
afterEach(() => ctx.deps.background.drain());

describe('attempt limits on the expensive anonymous auth routes (common practice; see server/services/attempt-limiter.ts)', () => {
  it('sign-up: the 11th in an hour from one address → 429 before any hash or e-mail; other addresses and processes agree', async () => {
    const { max, windowSeconds } = ATTEMPT_LIMITS['sign-up'].address;
    expect(max).toBe(10);
    const here = '203.0.113.10';
    const hashesAtStart = hashCalls();
    for (let i = 0; i < max; i++) {
      await from(here).post('/api/auth/sign-up', { email: `fry${i}@example.org`, password: GOOD_PASSWORD, displayName: `Fry ${i}` }).expect(202);
    }
    // The hash and the e-mail are made after the answer.
    await ctx.deps.background.drain();
    const before = { pending: await pendingCount(), hashes: hashCalls(), mails: ctx.mail.messages().length };
    expect(before.hashes - hashesAtStart, 'the spy sees every allowed sign-up hash').toBe(max);
    expect(before.pending).toBe(max);
    const limited = await from(here).post('/api/auth/sign-up', { email: 'late@example.org', password: GOOD_PASSWORD, displayName: 'Late' });
    expectLimited(limited, windowSeconds);
    // The count lives in PostgreSQL: a second server process over the same database refuses too.
    const other = ctx.makeApp();
    expect((await from(here, other).post('/api/auth/sign-up', { email: 'late@example.org', password: GOOD_PASSWORD, displayName: 'Late' })).status).toBe(429);
    await ctx.deps.background.drain();
    expect(await pendingCount()).toBe(before.pending);
    expect(hashCalls()).toBe(before.hashes);
    expect(ctx.mail.messages().length).toBe(before.mails);

    await from('198.51.100.20').post('/api/auth/sign-up', { email: 'late@example.org', password: GOOD_PASSWORD, displayName: 'Late' }).expect(202);
    await ctx.mail.waitFor((m) => m.to.includes('late@example.org'));
    const logs = limitedLogs(['late@example.org', GOOD_PASSWORD]);
    expect(logs.map((e) => e.fields.action)).toEqual(['sign-up', 'sign-up']);
    expect(logs[0].fields).toMatchObject({ by: 'address', address: here });
  });

  it('sign-up: the 4th in an hour for one e-mail (from anywhere) → 429 and no e-mail, the same whether or not it has an account', async () => {
    const { max, windowSeconds } = ATTEMPT_LIMITS['sign-up'].email;
    expect(max).toBe(3);
    await createUser(ctx.deps.dataSource, { email: 'guppy@example.org' });
    const ask = (email: string, i: number) =>
      from(`192.0.2.${60 + i}`).post('/api/auth/sign-up', { email, password: GOOD_PASSWORD, displayName: 'Someone' });
    const answers = { known: [] as { status: number; body: unknown }[], unknown: [] as { status: number; body: unknown }[] };
    for (let i = 0; i <= max; i++) {
      const [k, u] = [await ask('guppy@example.org', i), await ask('nobody-here@example.org', i)];
      answers.known.push({ status: k.status, body: k.body });
      answers.unknown.push({ status: u.status, body: u.body });
    }
    expect(answers.known.map((a) => a.status)).toEqual([202, 202, 202, 429]);
    expect(answers.unknown).toEqual(answers.known);
    await ctx.deps.background.drain();
    expect(ctx.mail.messages().filter((m) => m.to.includes('guppy@example.org'))).toHaveLength(max);
    expect(ctx.mail.messages().filter((m) => m.to.includes('nobody-here@example.org'))).toHaveLength(max);
    expectLimited(await ask('guppy@example.org', 9), windowSeconds);
    expect(limitedLogs(['guppy@example.org', 'nobody-here@example.org']).every((e) => e.fields.by === 'email')).toBe(true);
  });

  it('reset-password: the 11th in 15 minutes from one address → 429 before any hash; the password stays; another address resets', async () => {
    const { max, windowSeconds } = ATTEMPT_LIMITS['reset-password'].address;
    expect(max).toBe(10);
    const user = await createUser(ctx.deps.dataSource, { email: 'loach@example.org' });
    await from('192.0.2.30').post('/api/auth/forgot-password', { email: 'loach@example.org' }).expect(202);
    await ctx.deps.background.drain();
    const mail = await ctx.mail.waitFor((m) => m.to.includes('loach@example.org'));
    const token = /reset-password\?token=([A-Za-z0-9_-]+)/.exec(mail.text)![1];

    const here = '203.0.113.11';
    const hashesAtStart = hashCalls();
    // Wrong tokens still cost a hash each (the hash is made before the token is claimed).
    for (let i = 0; i < max; i++) await from(here).post('/api/auth/reset-password', { token: wellFormedToken(), password: NEW_PASSWORD }).expect(400);
    const hashesBefore = hashCalls();
    expect(hashesBefore - hashesAtStart, 'the spy sees every allowed attempt hash').toBe(max);
    expectLimited(await from(here).post('/api/auth/reset-password', { token, password: NEW_PASSWORD }), windowSeconds);
    expect(hashCalls()).toBe(hashesBefore);
    const stored = await ctx.deps.dataSource.getRepository(User).findOneByOrFail({ id: user.id });
    expect(stored.passwordHash).toBe(user.passwordHash);

    await from('198.51.100.21').post('/api/auth/reset-password', { token, password: NEW_PASSWORD }).expect(204);
    expect(limitedLogs([token, NEW_PASSWORD]).map((e) => e.fields.action)).toEqual(['reset-password']);
  });

  it('forgot-password: the 6th request in an hour for one e-mail → 429 and no e-mail; another e-mail from the same address still works', async () => {
    const { max, windowSeconds } = ATTEMPT_LIMITS['forgot-password'].email;
    expect(max).toBe(5);
    await createUser(ctx.deps.dataSource, { email: 'guppy@example.org' });
    await createUser(ctx.deps.dataSource, { email: 'molly@example.org' });
    // From a different address each time: the per-e-mail limit holds however the requests are spread.
    for (let i = 0; i < max; i++) await from(`203.0.113.${100 + i}`).post('/api/auth/forgot-password', { email: 'guppy@example.org' }).expect(202);
    await ctx.deps.background.drain();
    const mailsBefore = ctx.mail.messages().length;
    expectLimited(await from('203.0.113.200').post('/api/auth/forgot-password', { email: 'guppy@example.org' }), windowSeconds);
    await ctx.deps.background.drain();
    expect(ctx.mail.messages().length).toBe(mailsBefore);

    await from('203.0.113.200').post('/api/auth/forgot-password', { email: 'molly@example.org' }).expect(202);
    await ctx.mail.waitFor((m) => m.to.includes('molly@example.org'));
    const logs = limitedLogs(['guppy@example.org', 'molly@example.org']);
    expect(logs).toHaveLength(1);
    expect(logs[0].fields).toMatchObject({ action: 'forgot-password', by: 'email' });
  });

  it('forgot-password answers the same for an e-mail with and without an account, limited or not', async () => {
    await createUser(ctx.deps.dataSource, { email: 'guppy@example.org' });
    const ask = (email: string, i: number) => from(`192.0.2.${10 + i}`).post('/api/auth/forgot-password', { email });
    const answers = { known: [] as { status: number; body: unknown }[], unknown: [] as { status: number; body: unknown }[] };
    for (let i = 0; i <= ATTEMPT_LIMITS['forgot-password'].email.max; i++) {
      const [k, u] = [await ask('guppy@example.org', i), await ask('nobody-here@example.org', i)];
      answers.known.push({ status: k.status, body: k.body });
      answers.unknown.push({ status: u.status, body: u.body });
    }
    expect(answers.known.map((a) => a.status)).toEqual([202, 202, 202, 202, 202, 429]);
    expect(answers.unknown).toEqual(answers.known);
  });

  it('forgot-password: the 21st request in an hour from one address (any e-mails) → 429 and no e-mail; another address is unaffected', async () => {
    const { max, windowSeconds } = ATTEMPT_LIMITS['forgot-password'].address;
    expect(max).toBe(20);
    await createUser(ctx.deps.dataSource, { email: 'danio@example.org' });
    const here = '203.0.113.12';
    for (let i = 0; i < max; i++) await from(here).post('/api/auth/forgot-password', { email: `stranger${i}@example.org` }).expect(202);
    expectLimited(await from(here).post('/api/auth/forgot-password', { email: 'danio@example.org' }), windowSeconds);
    await ctx.deps.background.drain();
    expect(ctx.mail.messages().filter((m) => m.to.includes('danio@example.org'))).toHaveLength(0);

    await from('198.51.100.22').post('/api/auth/forgot-password', { email: 'danio@example.org' }).expect(202);
    await ctx.mail.waitFor((m) => m.to.includes('danio@example.org'));
    expect(limitedLogs(['danio@example.org'])[0].fields).toMatchObject({ action: 'forgot-password', by: 'address', address: here });
  });

  it('an IPv6 client is counted by its /64: a new address inside it is the same subject; the next /64 is not', async () => {
    const { max } = ATTEMPT_LIMITS['forgot-password'].address;
    for (let i = 0; i < max; i++) await from(`2001:db8:7:7::${(i + 1).toString(16)}`).post('/api/auth/forgot-password', { email: `roamer${i}@example.org` }).expect(202);
    await from('2001:db8:7:7:abcd:ef01:2345:6789').post('/api/auth/forgot-password', { email: 'roamer-late@example.org' }).expect(429);
    await from('2001:db8:7:8::1').post('/api/auth/forgot-password', { email: 'roamer-late@example.org' }).expect(202);
    expect(limitedLogs(['roamer-late@example.org'])[0].fields).toMatchObject({ by: 'address', address: '2001:db8:7:7::/64' });
  });

  it('concurrent requests cannot slip past the limit together (the check and the count are one locked step)', async () => {
    const { max } = ATTEMPT_LIMITS['forgot-password'].email;
    const statuses = await Promise.all(
      Array.from({ length: max + 4 }, (_, i) => from(`198.51.100.${50 + i}`).post('/api/auth/forgot-password', { email: 'swarm@example.org' })),
    ).then((rs) => rs.map((r) => r.status));
    expect(statuses.filter((s) => s === 202)).toHaveLength(max);
    expect(statuses.filter((s) => s === 429)).toHaveLength(4);
  });

  it('invite accept: the 21st in 15 minutes from one address → 429, no account and the invite unused; another address accepts', async () => {
    const { max, windowSeconds } = ATTEMPT_LIMITS['invite-accept'].address;
    expect(max).toBe(20);
    const ds = ctx.deps.dataSource;
    const club = await createClub(ds, { name: 'Reedbank Aquarists' });
    await createUser(ds, { email: 'olive@example.org', displayName: 'Olive' }).then((o) => addMember(ds, club.id, o.id, 'organizer'));
    const org = client(ctx.app);
    await org.post('/api/auth/sign-in', { email: 'olive@example.org', password: GOOD_PASSWORD }).expect(200);
    await org.post(`/api/clubs/${club.id}/invites`, { email: 'newt@example.org' }).expect(201);
    await ctx.deps.background.drain();
    const invite = /\/invite\/([A-Za-z0-9_-]{43})/.exec((await ctx.mail.waitFor((m) => m.to.includes('newt@example.org'))).text)![1];

    const here = '203.0.113.13';
    const body = { displayName: 'Newt', password: NEW_PASSWORD };
    // Guessed tokens answer 404, and still count.
    for (let i = 0; i < max; i++) await from(here).post(`/api/invites/${wellFormedToken()}/accept`, body).expect(404);
    const before = { users: await userCount(), hashes: hashCalls() };
    expectLimited(await from(here).post(`/api/invites/${invite}/accept`, body), windowSeconds);
    expect(await userCount()).toBe(before.users);
    expect(hashCalls()).toBe(before.hashes);
    expect(await ds.getRepository(ClubInvite).countBy({ clubId: club.id })).toBe(1);
    expect((await client(ctx.app).get(`/api/invites/${invite}`).expect(200)).body.clubName).toBe('Reedbank Aquarists');

    await from('198.51.100.23').post(`/api/invites/${invite}/accept`, body).expect(201);
    expect(await ds.getRepository(User).existsBy({ email: 'newt@example.org' })).toBe(true);
    expect(limitedLogs([invite, NEW_PASSWORD]).map((e) => e.fields.action)).toEqual(['invite-accept']);
  });

  it('an address is let through again once its attempts are older than the window, and old rows are pruned', async () => {
    const { max, windowSeconds } = ATTEMPT_LIMITS['forgot-password'].address;
    const here = '203.0.113.14';
    for (let i = 0; i < max; i++) await from(here).post('/api/auth/forgot-password', { email: `eel${i}@example.org` }).expect(202);
    await from(here).post('/api/auth/forgot-password', { email: 'eel-late@example.org' }).expect(429);
    await ctx.deps.dataSource.query(`UPDATE auth_attempts SET created_at = now() - make_interval(secs => $1 + 1)`, [windowSeconds]);
    await from(here).post('/api/auth/forgot-password', { email: 'eel-late@example.org' }).expect(202);
    // The answered request pruned every row past the longest window: only its own two remain.
    const rows: { subject: string }[] = await ctx.deps.dataSource.query(`SELECT subject FROM auth_attempts ORDER BY subject`);
    expect(rows.map((r) => r.subject.split(':')[0])).toEqual(['email', 'ip']);
    // E-mails are kept only as a SHA-256.
    expect(rows[0].subject).toMatch(/^email:[0-9a-f]{64}$/);
  });

  it('with AUTH_ATTEMPT_LIMITS=off (API tests only; refused in production) nothing is counted or refused', async () => {
    const off = ctx.makeApp({ AUTH_ATTEMPT_LIMITS: 'off' });
    for (let i = 0; i <= ATTEMPT_LIMITS['forgot-password'].email.max; i++) {
      await from('203.0.113.15', off).post('/api/auth/forgot-password', { email: 'koi@example.org' }).expect(202);
    }
    expect(await ctx.deps.dataSource.query(`SELECT 1 FROM auth_attempts`)).toHaveLength(0);
    const production = { NODE_ENV: 'production', DATABASE_URL: 'postgres://u:p@127.0.0.1:5432/db', APP_URL: 'https://shoalshift.example', SESSION_SECRET: 'x'.repeat(40), UNSUBSCRIBE_SECRET: 'u'.repeat(40) };
    expect(() => loadConfig({ ...production, AUTH_ATTEMPT_LIMITS: 'off' })).toThrow(/AUTH_ATTEMPT_LIMITS must be on in production/);
    expect(loadConfig(production).attemptLimitsEnabled).toBe(true);
  });
});
