import express, { Router } from 'express';
import { describe, expect, it } from 'vitest';
import { Reading } from '../../../server/entities/reading.js';
import { currentUser, requireAuth } from '../../../server/middleware/require-auth.js';
import { REPLAYED_HEADER } from '../../../server/middleware/idempotency.js';
import { requestDb } from '../../../server/middleware/request-db.js';
import { Tank } from '../../../server/entities/tank.js';
import { notFound } from '../../../server/errors.js';
import { GOOD_PASSWORD, createTank, createUser } from '../helpers/factories.js';
import { client, sleep, useTestApp, type TestContext } from '../helpers/test-app.js';

/**
 * A write route of the test's own, so the middleware is checked whatever the real routes are:
 * it adds a reading to the caller's tank, after `delayMs` if asked (to make retries overlap).
 */
function probeRoutes(getCtx: () => TestContext): Router {
  const router = Router();
  router.post('/probe/tanks/:id/readings', express.json(), (req, res, next) =>
    requireAuth(getCtx().deps.dataSource, getCtx().deps.config)(req, res, next),
  async (req, res) => {
    // Written the way every keyed route writes: through the key's transaction.
    const ds = requestDb(req, getCtx().deps.dataSource);
    const tank = await ds.getRepository(Tank).findOneBy({ id: req.params.id as string, ownerId: currentUser(req).id });
    if (!tank) throw notFound();
    const body = req.body as { tanMgN?: unknown; delayMs?: number };
    if (typeof body.tanMgN !== 'number') return void res.status(400).json({ error: { code: 'validation', message: 'tanMgN' } });
    if (body.delayMs) await sleep(body.delayMs);
    const saved = await ds.getRepository(Reading).save(
      ds.getRepository(Reading).create({ tankId: tank.id, takenAt: new Date(Date.now() + Math.random() * 1e6), tanMgN: body.tanMgN, basis: 'N' }),
    );
    res.status(201).json({ id: saved.id, tanMgN: saved.tanMgN });
  });
  return router;
}

const ctx: TestContext = useTestApp({ extraApiRoutes: probeRoutes(() => ctx) });
const readingCount = () => ctx.deps.dataSource.getRepository(Reading).count();

async function keeperWithTank() {
  const user = await createUser(ctx.deps.dataSource);
  const tank = await createTank(ctx.deps.dataSource, user.id);
  const c = client(ctx.app);
  await c.post('/api/auth/sign-in', { email: user.email, password: GOOD_PASSWORD }).expect(200);
  return { user, tank, c };
}

describe('Idempotency-Key on signed-in POST routes', () => {
  it('answers a retry of the same key with the first answer, and writes once', async () => {
    const { tank, c } = await keeperWithTank();
    const url = `/api/probe/tanks/${tank.id}/readings`;
    const first = await c.post(url, { tanMgN: 0.5 }).set('Idempotency-Key', 'k-1').expect(201);
    const again = await c.post(url, { tanMgN: 0.5 }).set('Idempotency-Key', 'k-1').expect(201);
    expect(again.body).toEqual(first.body);
    expect(again.headers[REPLAYED_HEADER.toLowerCase()]).toBe('true');
    expect(first.headers[REPLAYED_HEADER.toLowerCase()]).toBeUndefined();
    expect(await readingCount()).toBe(1);
    // A new key is a new write.
    await c.post(url, { tanMgN: 0.5 }).set('Idempotency-Key', 'k-2').expect(201);
    expect(await readingCount()).toBe(2);
  });

  it('makes overlapping retries of one key wait for the first and share its answer', async () => {
    const { tank, c } = await keeperWithTank();
    const url = `/api/probe/tanks/${tank.id}/readings`;
    const answers = await Promise.all(
      [0, 1, 2].map(() => c.post(url, { tanMgN: 0.2, delayMs: 300 }).set('Idempotency-Key', 'overlap')),
    );
    expect(answers.map((a) => a.status)).toEqual([201, 201, 201]);
    expect(new Set(answers.map((a) => a.body.id)).size).toBe(1);
    expect(await readingCount()).toBe(1);
  });

  it('refuses the key reused with a different body with 422, writing nothing more', async () => {
    const { tank, c } = await keeperWithTank();
    const url = `/api/probe/tanks/${tank.id}/readings`;
    await c.post(url, { tanMgN: 0.5 }).set('Idempotency-Key', 'same').expect(201);
    const res = await c.post(url, { tanMgN: 9 }).set('Idempotency-Key', 'same').expect(422);
    expect(res.body.error.code).toBe('idempotency_key_reused');
    expect(await readingCount()).toBe(1);
  });

  it('does not keep a 4xx answer: the corrected retry of the key runs', async () => {
    const { tank, c } = await keeperWithTank();
    const url = `/api/probe/tanks/${tank.id}/readings`;
    await c.post(url, { tanMgN: 'bad' }).set('Idempotency-Key', 'fix-me').expect(400);
    expect(await readingCount()).toBe(0);
    // Same key, same (bad) body again: runs again, still 400, still nothing written.
    await c.post(url, { tanMgN: 'bad' }).set('Idempotency-Key', 'fix-me').expect(400);
    expect(await readingCount()).toBe(0);
  });

  it('scopes keys to the person: another keeper using the same key gets their own answer', async () => {
    const a = await keeperWithTank();
    const b = await keeperWithTank();
    const ra = await a.c.post(`/api/probe/tanks/${a.tank.id}/readings`, { tanMgN: 1 }).set('Idempotency-Key', 'shared').expect(201);
    // B replaying A's key on A's tank must not see A's answer.
    await b.c.post(`/api/probe/tanks/${a.tank.id}/readings`, { tanMgN: 1 }).set('Idempotency-Key', 'shared').expect(404);
    const rb = await b.c.post(`/api/probe/tanks/${b.tank.id}/readings`, { tanMgN: 1 }).set('Idempotency-Key', 'shared').expect(201);
    expect(rb.body.id).not.toBe(ra.body.id);
  });

  it('refuses a malformed key with 400 and ignores the header without a session', async () => {
    const { tank, c } = await keeperWithTank();
    const url = `/api/probe/tanks/${tank.id}/readings`;
    const bad = await c.post(url, { tanMgN: 1 }).set('Idempotency-Key', 'x'.repeat(201)).expect(400);
    expect(bad.body.error.fields).toHaveProperty('Idempotency-Key');
    await client(ctx.app).post(url, { tanMgN: 1 }).set('Idempotency-Key', 'anon').expect(401);
    expect(await readingCount()).toBe(0);
  });
});
