import { describe, expect, it } from 'vitest';
import { GOOD_PASSWORD, createTank, createUser } from '../helpers/factories.js';
import { client, sessionCookie, useTestApp } from '../helpers/test-app.js';

const ctx = useTestApp();

/** The raw session id inside `shoalshift.sid=s%3A<id>.<signature>`. */
function sessionIdOf(cookie: string): string {
  const value = decodeURIComponent(cookie.split('=')[1] ?? '');
  return value.replace(/^s:/, '').split('.')[0] ?? '';
}

describe('logs (ASVS 16.2.5, 16.3.1–16.3.2)', () => {
  it('records sign-ins, failures and denied access, and never a password, session id or cookie', async () => {
    const wrongGuess = 'Wrong-Guess-Very-Secret-99';
    const user = await createUser(ctx.deps.dataSource, { email: 'log.keeper@example.org' });
    const stranger = await createUser(ctx.deps.dataSource, { email: 'stranger@example.org' });
    const strangersTank = await createTank(ctx.deps.dataSource, stranger.id);

    const c = client(ctx.app);
    await c.post('/api/auth/sign-in', { email: user.email, password: wrongGuess }).expect(401);
    const ok = await c.post('/api/auth/sign-in', { email: user.email, password: GOOD_PASSWORD }).expect(200);
    const cookie = sessionCookie(ok)!;
    await c.get('/api/me').expect(200);
    await c.get(`/api/tanks/${strangersTank.id}`).expect(404);
    // Denied: no CSRF header, and no session.
    await c.agent.post('/api/auth/sign-out').expect(403);
    await client(ctx.app).get('/api/tanks').expect(401);
    const signUpPassword = 'Another-Long-Secret-Phrase-7';
    const newcomer = client(ctx.app);
    await newcomer.post('/api/auth/sign-up', { email: 'new@example.org', password: signUpPassword, displayName: 'New' }).expect(202);
    await ctx.deps.background.drain();
    const signUpToken = /confirm-sign-up\?token=([A-Za-z0-9_-]+)/.exec((await ctx.mail.waitFor((m) => m.to.includes('new@example.org'))).text)![1];
    await newcomer.post('/api/auth/confirm-sign-up', { token: signUpToken }).expect(201);
    await c.post('/api/auth/sign-out').expect(204);

    const events = ctx.logs.entries.map((e) => e.event);
    expect(events).toEqual(expect.arrayContaining(['auth.sign_in_failed', 'auth.sign_in', 'auth.sign_up', 'auth.sign_out', 'access.denied']));
    const denied = ctx.logs.entries.filter((e) => e.event === 'access.denied');
    expect(denied.map((e) => e.fields.status).sort()).toEqual(expect.arrayContaining([401, 403]));
    // The CSRF guard runs before the session is read, so its entry has no user id.
    expect(denied.find((e) => e.fields.code === 'csrf')).toBeDefined();
    expect(denied.find((e) => e.fields.code === 'unauthorized')?.fields.route).toBe('/api/tanks');

    const text = JSON.stringify(ctx.logs.entries);
    for (const secret of [wrongGuess, GOOD_PASSWORD, signUpPassword, signUpToken, cookie, cookie.split('=')[1]!, sessionIdOf(cookie)]) {
      expect(secret.length).toBeGreaterThan(10);
      expect(text).not.toContain(secret);
    }
    expect(text).not.toMatch(/\$2[aby]\$\d\d\$/); // no bcrypt hash either
  });

  it('logs a denied request by path, hiding token-like path segments', async () => {
    const token = 'AbCdEfGhIjKlMnOpQrStUvWxYz0123456789';
    await client(ctx.app).agent.post(`/api/share/${token}/comments`).expect(403);
    const entry = ctx.logs.entries.find((e) => e.event === 'access.denied');
    expect(entry?.fields.route).toBe('/api/share/:value/comments');
    expect(JSON.stringify(ctx.logs.entries)).not.toContain(token);
  });
});
