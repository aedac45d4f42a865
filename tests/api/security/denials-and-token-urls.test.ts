import { Router } from 'express';
import request from 'supertest';
import { describe, expect, it } from 'vitest';
import { createPlan, createReading, createTank, createUser } from '../helpers/factories.js';
import { signedInKeeper } from '../helpers/keeper-client.js';
import { useTestApp } from '../helpers/test-app.js';

/** Routes that fail on purpose with a token in their URL, as a bug in a token route would. */
const failing = Router();
failing.get(['/share/:token/broken', '/unsubscribe-broken/:token', '/broken'], () => {
  throw new Error('boom');
});

const ctx = useTestApp({ extraApiRoutes: failing });
const TOKEN = 'Zx9_secretTokenValue-0123456789abcdefghijk';

describe('denied access and failures in the logs (hardening S15)', () => {
  it('logs another keeper’s object (404) as access.denied with the route that refused it, and no ids', async () => {
    const me = await signedInKeeper(ctx, 'pike@example.org');
    const stranger = await createUser(ctx.deps.dataSource, { email: 'perch@example.org' });
    const theirTank = await createTank(ctx.deps.dataSource, stranger.id);
    const theirReading = await createReading(ctx.deps.dataSource, theirTank.id);
    const theirPlan = await createPlan(ctx.deps.dataSource, theirTank.id);
    const myTank = await createTank(ctx.deps.dataSource, me.user.id);

    await me.get(`/api/tanks/${theirTank.id}`).expect(404);
    await me.get(`/api/plans/${theirPlan.id}`).expect(404);
    await me.del(`/api/tanks/${myTank.id}/readings/${theirReading.id}`).expect(404);

    const denied = ctx.logs.entries.filter((e) => e.event === 'access.denied');
    expect(denied.map((e) => [e.fields.status, e.fields.matched])).toEqual([
      [404, 'GET /api/tanks/:tankId'],
      [404, 'GET /api/plans/:planId'],
      [404, 'DELETE /api/tanks/:value/readings/:readingId'],
    ]);
    for (const e of denied) expect(e.fields.userId).toBe(me.user.id);
    const text = JSON.stringify(ctx.logs.entries);
    for (const id of [theirTank.id, theirPlan.id, theirReading.id, myTank.id]) expect(text).not.toContain(id);
  });

  it('an unknown API path is a 404 from no route (matched: none), not an ownership refusal', async () => {
    await request(ctx.app).get('/api/nothing-here').expect(404);
    expect(ctx.logs.entries.filter((e) => e.event === 'access.denied')).toEqual([]);
  });

  it('a 500 logs its URL with share, unsubscribe and query tokens hidden', async () => {
    await request(ctx.app).get(`/api/share/${TOKEN}/broken`).expect(500);
    await request(ctx.app).get(`/api/unsubscribe-broken/${TOKEN}`).expect(500);
    await request(ctx.app).get(`/api/broken?token=${TOKEN}&page=2`).expect(500);
    const failed = ctx.logs.entries.filter((e) => e.event === 'request.failed');
    expect(failed.map((e) => e.fields.path)).toEqual(['/api/share/:value/broken', '/api/unsubscribe-broken/:value', '/api/broken?token=:value&page=:value']);
    expect(JSON.stringify(ctx.logs.entries)).not.toContain(TOKEN);
    expect(JSON.stringify(ctx.logs.entries)).not.toContain(TOKEN.slice(0, 20));
  });
});
