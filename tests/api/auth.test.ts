import { describe, expect, it } from 'vitest';
import { meSchema } from '../../shared/schemas/auth.js';
import { User } from '../../server/entities/user.js';
import { INVALID_SIGN_UP_LINK_MESSAGE, SIGN_UP_SENT_MESSAGE } from '../../server/services/sign-up.js';
import { GOOD_PASSWORD, createUser } from './helpers/factories.js';
import { TEST_APP_URL, client, sessionCookie, sessionCookieLine, useTestApp } from './helpers/test-app.js';

const ctx = useTestApp();
const signUpBody = (overrides: Record<string, unknown> = {}) => ({
  email: 'Reed.Keeper@Example.org',
  password: GOOD_PASSWORD,
  displayName: 'Reed',
  ...overrides,
});
const userCount = () => ctx.deps.dataSource.getRepository(User).count();

/** Signs up through the API and opens the e-mailed link: the confirm answer. */
async function signUpAndConfirm(c: ReturnType<typeof client>, body = signUpBody()) {
  await c.post('/api/auth/sign-up', body).expect(202);
  const token = await linkTokenFor(String(body.email).toLowerCase());
  return c.post('/api/auth/confirm-sign-up', { token }).expect(201);
}

/** The token of the newest sign-up link e-mailed to `email`. */
async function linkTokenFor(email: string): Promise<string> {
  await ctx.deps.background.drain();
  const mail = await ctx.mail.waitFor((m) => m.to.includes(email) && m.subject === 'Finish creating your Shoalshift account');
  const link = /https?:\/\/\S+\/confirm-sign-up\?token=([A-Za-z0-9_-]+)/.exec(mail.text);
  expect(link, 'the sign-up e-mail carries the link').not.toBeNull();
  expect(mail.html).toContain(link![1]);
  return link![1];
}

describe('sign-up', () => {
  it('answers 202 and e-mails a single-use link; the link makes the account, signs it in, and /api/me answers until sign-out', async () => {
    const c = client(ctx.app);
    const asked = await c.post('/api/auth/sign-up', signUpBody()).expect(202);
    expect(asked.body).toEqual({ message: SIGN_UP_SENT_MESSAGE });
    expect(sessionCookie(asked), 'nobody is signed in before the link is opened').toBeUndefined();
    expect(await userCount()).toBe(0);
    const token = await linkTokenFor('reed.keeper@example.org');
    expect(ctx.mail.messages()[0].text).toContain(`${TEST_APP_URL}/confirm-sign-up?token=`);
    // Only the token's hash is stored.
    const pending: { token_hash: string }[] = await ctx.deps.dataSource.query(`SELECT token_hash FROM pending_sign_ups`);
    expect(pending).toHaveLength(1);
    expect(pending[0].token_hash).toMatch(/^[0-9a-f]{64}$/);

    const created = await c.post('/api/auth/confirm-sign-up', { token }).expect(201);
    const me = meSchema.parse(created.body);
    expect(me).toMatchObject({ email: 'reed.keeper@example.org', displayName: 'Reed', role: 'user', clubs: [] });
    const cookie = sessionCookie(created);
    expect(cookie).toBeDefined();
    expect(ctx.logs.entries.some((e) => e.event === 'auth.sign_up')).toBe(true);

    const read = await c.get('/api/me').expect(200);
    expect(read.body.id).toBe(me.id);
    // The link works once.
    const again = await client(ctx.app).post('/api/auth/confirm-sign-up', { token }).expect(400);
    expect(again.body.error.fields.token).toBe(INVALID_SIGN_UP_LINK_MESSAGE);

    await c.post('/api/auth/sign-out').expect(204);
    await c.get('/api/me').expect(401);
    // The old cookie replayed by hand is dead too: the session was destroyed server-side.
    const replay = await client(ctx.app).get('/api/me').set('Cookie', cookie!).expect(401);
    expect(replay.body.error.code).toBe('unauthorized');
  });

  it('stores a bcrypt hash with cost 12 or more, never the password', async () => {
    await client(ctx.app).post('/api/auth/sign-up', signUpBody()).expect(202);
    await ctx.deps.background.drain();
    const [pending]: { password_hash: string }[] = await ctx.deps.dataSource.query(`SELECT password_hash FROM pending_sign_ups`);
    expect(pending.password_hash).not.toContain(GOOD_PASSWORD);
    await client(ctx.app).post('/api/auth/confirm-sign-up', { token: await linkTokenFor('reed.keeper@example.org') }).expect(201);
    const user = await ctx.deps.dataSource.getRepository(User).findOneByOrFail({ email: 'reed.keeper@example.org' });
    const match = /^\$2[aby]\$(\d\d)\$/.exec(user.passwordHash);
    expect(match).not.toBeNull();
    expect(Number(match![1])).toBeGreaterThanOrEqual(12); // ASVS 6.2 / OWASP Password Storage cheat sheet
    expect(user.passwordHash).not.toContain(GOOD_PASSWORD);
    expect(await ctx.deps.dataSource.query(`SELECT 1 FROM pending_sign_ups`), 'the claimed link is gone').toHaveLength(0);
  });

  it('does not tell whether an e-mail has an account: the same status, body and cookies; the owner gets an e-mail with sign-in and reset links', async () => {
    const owner = await createUser(ctx.deps.dataSource, { email: 'reed.keeper@example.org', displayName: 'Reed' });
    const taken = await client(ctx.app).post('/api/auth/sign-up', signUpBody({ email: 'REED.KEEPER@example.org', password: 'another-fine-passphrase-9' }));
    const fresh = await client(ctx.app).post('/api/auth/sign-up', signUpBody({ email: 'newt.keeper@example.org' }));
    const seen = (r: typeof taken) => ({ status: r.status, body: r.body, cookie: sessionCookie(r) ?? null });
    expect(seen(taken)).toEqual(seen(fresh));
    expect(taken.status).toBe(202);

    await ctx.deps.background.drain();
    const mail = await ctx.mail.waitFor((m) => m.to.includes('reed.keeper@example.org'));
    expect(mail.subject).toBe('You already have a Shoalshift account');
    expect(mail.text).toContain(`${TEST_APP_URL}/sign-in`);
    const reset = /reset-password\?token=([A-Za-z0-9_-]+)/.exec(mail.text);
    expect(reset, 'the owner gets a working reset link').not.toBeNull();
    await client(ctx.app).post('/api/auth/reset-password', { token: reset![1], password: 'brackish-heron-sunrise-7' }).expect(204);
    // Nothing was made or changed by the attempt itself, and no sign-up link went out for it.
    expect(await userCount(), 'the new address has only a pending link').toBe(1);
    const stored = await ctx.deps.dataSource.getRepository(User).findOneByOrFail({ id: owner.id });
    expect(stored.displayName).toBe('Reed');
    const pending: { email: string }[] = await ctx.deps.dataSource.query(`SELECT email FROM pending_sign_ups`);
    expect(pending).toEqual([{ email: 'newt.keeper@example.org' }]);
  });

  it('refuses an expired link, and a link whose address got an account meanwhile', async () => {
    await client(ctx.app).post('/api/auth/sign-up', signUpBody()).expect(202);
    const first = await linkTokenFor('reed.keeper@example.org');
    await ctx.deps.dataSource.query(`UPDATE pending_sign_ups SET expires_at = now() - interval '1 second'`);
    expect((await client(ctx.app).post('/api/auth/confirm-sign-up', { token: first }).expect(400)).body.error.fields.token).toBe(INVALID_SIGN_UP_LINK_MESSAGE);

    ctx.mail.clear();
    await client(ctx.app).post('/api/auth/sign-up', signUpBody()).expect(202);
    const second = await linkTokenFor('reed.keeper@example.org');
    await createUser(ctx.deps.dataSource, { email: 'reed.keeper@example.org' });
    await client(ctx.app).post('/api/auth/confirm-sign-up', { token: second }).expect(400);
    expect(await userCount()).toBe(1);
    await client(ctx.app).post('/api/auth/confirm-sign-up', { token: 'x'.repeat(43) }).expect(400);
  });

  it('two links for one address opened at once make one account', async () => {
    await client(ctx.app).post('/api/auth/sign-up', signUpBody()).expect(202);
    const a = await linkTokenFor('reed.keeper@example.org');
    ctx.mail.clear();
    await client(ctx.app).post('/api/auth/sign-up', signUpBody({ displayName: 'Reed again' })).expect(202);
    const b = await linkTokenFor('reed.keeper@example.org');
    const statuses = await Promise.all([a, b].map((token) => client(ctx.app).post('/api/auth/confirm-sign-up', { token }))).then((rs) => rs.map((r) => r.status).sort());
    expect(statuses).toEqual([201, 400]);
    expect(await userCount()).toBe(1);
  });

  it('refuses a password over 72 UTF-8 bytes with 400 on password', async () => {
    const res = await client(ctx.app)
      .post('/api/auth/sign-up', signUpBody({ password: 'a'.repeat(73) }))
      .expect(400);
    expect(res.body.error.code).toBe('validation');
    expect(Object.keys(res.body.error.fields)).toEqual(['password']);
    // 37 two-byte letters are 74 bytes though only 37 characters.
    const accented = await client(ctx.app).post('/api/auth/sign-up', signUpBody({ password: 'é'.repeat(37) })).expect(400);
    expect(accented.body.error.fields.password).toMatch(/72 bytes/);
    expect(await userCount()).toBe(0);
  });

  it('accepts a 64-character password and a 72-byte one', async () => {
    await signUpAndConfirm(client(ctx.app), signUpBody({ email: 'a@example.org', password: 'x7-'.repeat(21) + 'q' }));
    await signUpAndConfirm(client(ctx.app), signUpBody({ email: 'b@example.org', password: 'é'.repeat(36) }));
  });

  it('refuses a common password with a message on password, and writes nothing', async () => {
    for (const password of ['password123', 'Qwertyuiop', '12345678']) {
      const res = await client(ctx.app).post('/api/auth/sign-up', signUpBody({ password })).expect(400);
      expect(res.body.error.fields.password).toMatch(/common passwords/);
    }
    await ctx.deps.background.drain();
    expect(await userCount()).toBe(0);
    expect(ctx.mail.messages()).toHaveLength(0);
  });

  it('answers invalid fields with their paths', async () => {
    const res = await client(ctx.app)
      .post('/api/auth/sign-up', { email: 'not-an-address', password: 'short', displayName: '' })
      .expect(400);
    expect(res.body.error.code).toBe('validation');
    expect(res.body.error.fields).toEqual({
      email: expect.stringMatching(/valid e-mail/),
      password: expect.stringMatching(/at least 8/),
      displayName: expect.stringMatching(/Enter a name/),
    });
  });

  it('refuses extra fields such as a role (no mass assignment)', async () => {
    const res = await client(ctx.app).post('/api/auth/sign-up', signUpBody({ role: 'admin' })).expect(400);
    expect(res.body.error.fields).toHaveProperty('_');
    expect(await userCount()).toBe(0);
  });
});

describe('sign-in', () => {
  it('signs in with a new session id, and the previous session id stops working', async () => {
    const user = await createUser(ctx.deps.dataSource, { email: 'coral@example.org' });
    const c = client(ctx.app);
    const first = await c.post('/api/auth/sign-in', { email: 'Coral@Example.org', password: GOOD_PASSWORD }).expect(200);
    expect(meSchema.parse(first.body).id).toBe(user.id);
    const before = sessionCookie(first);

    const second = await c.post('/api/auth/sign-in', { email: 'coral@example.org', password: GOOD_PASSWORD }).expect(200);
    const after = sessionCookie(second);
    expect(before).toBeDefined();
    expect(after).toBeDefined();
    expect(after).not.toBe(before);

    await client(ctx.app).get('/api/me').set('Cookie', before!).expect(401);
    await client(ctx.app).get('/api/me').set('Cookie', after!).expect(200);
  });

  it('answers a wrong password and an unknown e-mail the same way: 401, no cookie', async () => {
    await createUser(ctx.deps.dataSource, { email: 'coral@example.org' });
    const wrong = await client(ctx.app).post('/api/auth/sign-in', { email: 'coral@example.org', password: 'not-the-password' }).expect(401);
    const unknown = await client(ctx.app).post('/api/auth/sign-in', { email: 'nobody@example.org', password: 'not-the-password' }).expect(401);
    expect(wrong.body).toEqual({ error: { code: 'invalid_credentials', message: 'E-mail or password is wrong.' } });
    expect(unknown.body).toEqual(wrong.body);
    expect(sessionCookie(wrong)).toBeUndefined();
  });

  it('logs failed sign-ins without the password', async () => {
    await client(ctx.app).post('/api/auth/sign-in', { email: 'coral@example.org', password: 'hunter2-secret-guess' }).expect(401);
    const entry = ctx.logs.entries.find((e) => e.event === 'auth.sign_in_failed');
    expect(entry?.fields.email).toBe('coral@example.org');
    expect(JSON.stringify(ctx.logs.entries)).not.toContain('hunter2-secret-guess');
  });

  it('sets the session cookie with its own name, HttpOnly, SameSite=Lax, Path=/ and an expiry', async () => {
    await createUser(ctx.deps.dataSource, { email: 'coral@example.org' });
    const res = await client(ctx.app).post('/api/auth/sign-in', { email: 'coral@example.org', password: GOOD_PASSWORD }).expect(200);
    const line = sessionCookieLine(res)!;
    expect(line).toMatch(/^shoalshift\.sid=/);
    expect(line).toMatch(/; HttpOnly/i);
    expect(line).toMatch(/; SameSite=Lax/i);
    expect(line).toMatch(/; Path=\//i);
    expect(line).toMatch(/; Expires=/i);
    // Plain http from a trusted local proxy without X-Forwarded-Proto: not Secure ('auto').
    expect(line).not.toMatch(/; Secure/i);
  });

  it('marks the cookie Secure behind a TLS proxy, and in production always', async () => {
    await createUser(ctx.deps.dataSource, { email: 'coral@example.org' });
    const viaTls = await client(ctx.app)
      .post('/api/auth/sign-in', { email: 'coral@example.org', password: GOOD_PASSWORD })
      .set('X-Forwarded-Proto', 'https')
      .expect(200);
    expect(sessionCookieLine(viaTls)).toMatch(/; Secure/i);

    const production = ctx.makeApp({ NODE_ENV: 'production', MAIL_FAKE_URL: undefined });
    const prod = await client(production)
      .post('/api/auth/sign-in', { email: 'coral@example.org', password: GOOD_PASSWORD })
      .set('X-Forwarded-Proto', 'https')
      .expect(200);
    expect(sessionCookieLine(prod)).toMatch(/; Secure/i);
    // Over plain http production sends no session cookie at all.
    const plain = await client(production).post('/api/auth/sign-in', { email: 'coral@example.org', password: GOOD_PASSWORD }).expect(200);
    expect(sessionCookie(plain)).toBeUndefined();
  });

  it('lists the clubs of the signed-in person in /api/me', async () => {
    const { createClub, addMember } = await import('./helpers/factories.js');
    const user = await createUser(ctx.deps.dataSource, { email: 'coral@example.org' });
    const club = await createClub(ctx.deps.dataSource, { name: 'Harbour Aquarists' });
    await addMember(ctx.deps.dataSource, club.id, user.id, 'mentor');
    const c = client(ctx.app);
    await c.post('/api/auth/sign-in', { email: 'coral@example.org', password: GOOD_PASSWORD }).expect(200);
    const me = meSchema.parse((await c.get('/api/me').expect(200)).body);
    expect(me.clubs).toEqual([{ id: club.id, name: 'Harbour Aquarists', role: 'mentor' }]);
  });

  it('/api/me without a session is 401', async () => {
    const res = await client(ctx.app).get('/api/me').expect(401);
    expect(res.body.error.code).toBe('unauthorized');
  });
});
