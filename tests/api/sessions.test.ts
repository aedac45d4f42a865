import { describe, expect, it } from 'vitest';
import { GOOD_PASSWORD, createUser } from './helpers/factories.js';
import { client, sleep, useTestApp } from './helpers/test-app.js';

const ctx = useTestApp();

async function signedIn(app: ReturnType<typeof ctx.makeApp>) {
  await createUser(ctx.deps.dataSource, { email: 'gill@example.org' });
  const c = client(app);
  await c.post('/api/auth/sign-in', { email: 'gill@example.org', password: GOOD_PASSWORD }).expect(200);
  return c;
}

describe('session timeouts (ASVS 7.3.1, 7.3.2)', () => {
  it('ends a session left idle longer than the idle timeout', async () => {
    const app = ctx.makeApp({ SESSION_IDLE_SECONDS: '1', SESSION_ABSOLUTE_SECONDS: '60' });
    const c = await signedIn(app);
    await c.get('/api/me').expect(200);
    await sleep(2_300); // the store keeps whole seconds, rounded up: wait past 2 s
    const res = await c.get('/api/me').expect(401);
    expect(res.body.error.code).toBe('unauthorized');
  });

  it('keeps an active session alive past the idle timeout (rolling)', async () => {
    const app = ctx.makeApp({ SESSION_IDLE_SECONDS: '2', SESSION_ABSOLUTE_SECONDS: '60' });
    const c = await signedIn(app);
    for (let i = 0; i < 4; i++) {
      await sleep(1_000);
      await c.get('/api/me').expect(200);
    }
  });

  it('moves a session row\'s expiry only when it has moved by a tenth of the idle timeout (no write per request)', async () => {
    // 20 s idle → a 2 s step.
    const app = ctx.makeApp({ SESSION_IDLE_SECONDS: '20', SESSION_ABSOLUTE_SECONDS: '3600' });
    const c = await signedIn(app);
    const expiry = async () => new Date((await ctx.deps.dataSource.query(`SELECT expire FROM session`))[0].expire).getTime();
    const atSignIn = await expiry();
    await sleep(1_100);
    await c.get('/api/me').expect(200);
    await sleep(300); // the touch runs off the answer's path
    expect(await expiry()).toBe(atSignIn);
    await sleep(3_200);
    await c.get('/api/me').expect(200);
    await expect.poll(expiry).toBeGreaterThan(atSignIn + 2_000);
  });

  it('ends an active session at the absolute timeout, counted from sign-in', async () => {
    // Idle timeout as long as the absolute one: the idle gaps below stay well under it.
    const app = ctx.makeApp({ SESSION_IDLE_SECONDS: '4', SESSION_ABSOLUTE_SECONDS: '4' });
    const c = await signedIn(app);
    const started = Date.now();
    while (Date.now() - started < 3_000) {
      await c.get('/api/me').expect(200);
      await sleep(600);
    }
    await sleep(Math.max(0, 4_500 - (Date.now() - started)));
    const res = await c.get('/api/me').expect(401);
    expect(res.body.error.message).toMatch(/session has ended/);
    const rows = await ctx.deps.dataSource.query(`SELECT count(*)::int AS n FROM session`);
    expect(rows[0].n).toBe(0);
  });

  it('a session made by one server process works on another over the same database', async () => {
    const c = await signedIn(ctx.app);
    const other = ctx.makeApp();
    const cookie = (await c.get('/api/me').expect(200)).request.cookies;
    expect(cookie).toMatch(/shoalshift\.sid=/);
    await client(other).get('/api/me').set('Cookie', cookie).expect(200);
  });
});
