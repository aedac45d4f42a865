import { afterAll, beforeEach, describe, expect, it } from 'vitest';
import { planForecastResponseSchema } from '../../shared/schemas/plan.js';
import { forgetRememberedResults } from '../../server/services/forecast-cache.js';
import { closeEnginePool, engineTasksRun } from '../../server/workers/engine-pool.js';
import { GOOD_PASSWORD, createLivestock, createPlan, createTank, createUser } from './helpers/factories.js';
import { client, useTestApp } from './helpers/test-app.js';

const ctx = useTestApp();

beforeEach(async () => {
  await ctx.deps.dataSource.query('TRUNCATE forecast_cache');
  forgetRememberedResults();
});
afterAll(async () => {
  await closeEnginePool();
});

async function keeper(email = 'ray@example.org') {
  const user = await createUser(ctx.deps.dataSource, { email });
  const c = client(ctx.app);
  await c.post('/api/auth/sign-in', { email, password: GOOD_PASSWORD }).expect(200);
  return { user, c };
}

/** A settled 120 L tank with 12 neons and a plan adding 8 more (invented). */
async function settledTankWithPlan(ownerId: string, events: object[] = [{ type: 'add-fish', day: 2, fish: { species: 'harlequin-rasbora', count: 8, lengthCm: 3 } }]) {
  const ds = ctx.deps.dataSource;
  const tank = await createTank(ds, ownerId);
  await createLivestock(ds, tank.id, { speciesId: 'neon-tetra', count: 12, lengthCm: 3 });
  const plan = await createPlan(ds, tank.id, { events: events as never });
  return { tank, plan };
}

describe('POST /api/plans/:id/forecast', () => {
  it('needs a session', async () => {
    await client(ctx.app).post('/api/plans/00000000-0000-4000-8000-000000000000/forecast').expect(401);
  });

  it('runs the engine once for simultaneous requests of the same uncached plan', async () => {
    const { user, c } = await keeper();
    const { plan } = await settledTankWithPlan(user.id);
    const before = engineTasksRun();
    const answers = await Promise.all(Array.from({ length: 5 }, () => c.post(`/api/plans/${plan.id}/forecast`)));
    expect(answers.map((a) => a.status)).toEqual([200, 200, 200, 200, 200]);
    expect(engineTasksRun()).toBe(before + 1);
    const hashes = new Set(answers.map((a) => planForecastResponseSchema.parse(a.body).inputHash));
    expect(hashes.size).toBe(1);
  });

  it('runs the saved plan on the engine pool, then answers a repeat from the cache without recomputing', async () => {
    const { user, c } = await keeper();
    const { plan } = await settledTankWithPlan(user.id);
    const before = engineTasksRun();
    const first = planForecastResponseSchema.parse((await c.post(`/api/plans/${plan.id}/forecast`).expect(200)).body);
    expect(first.cached).toBe(false);
    expect(engineTasksRun()).toBe(before + 1);
    expect(first.startReason).toBe('mature-present-load');
    // The horizon covers the last event plus three weeks (shared/tank-scenario.ts): day 2 + 21 → 30-day minimum.
    expect(first.forecast.days.at(-1)).toBe(30);
    expect(first.forecast.band?.members).toBe(64);
    // The central forecast lies inside its 10–90 % band at the ammonia peak (ensemble.ts: band of 64 members).
    const i = first.forecast.days.indexOf(first.forecast.peaks.tan.day);
    expect(first.forecast.band!.tanMgN.p90[i]).toBeGreaterThanOrEqual(first.forecast.band!.tanMgN.p10[i]);
    expect(first.explanation[0]).toMatch(/settled tank/);
    expect(first.explanation.join(' ')).toMatch(/Total ammonia peaks at/);
    expect(first.cautions.join(' ')).toMatch(/water tests decide/);

    const second = planForecastResponseSchema.parse((await c.post(`/api/plans/${plan.id}/forecast`).expect(200)).body);
    expect(second.cached).toBe(true);
    expect(engineTasksRun()).toBe(before + 1);
    expect(second.inputHash).toBe(first.inputHash);
    expect(second.forecast).toEqual(first.forecast);
    const rows = await ctx.deps.dataSource.query('SELECT count(*)::int AS n FROM forecast_cache');
    expect(rows[0].n).toBe(1);
  });

  it('answers from the shared table when this process has not seen the inputs (as another process would), without rewriting the row on each hit', async () => {
    const { user, c } = await keeper();
    const { plan } = await settledTankWithPlan(user.id);
    const ds = ctx.deps.dataSource;
    const first = (await c.post(`/api/plans/${plan.id}/forecast`).expect(200)).body;
    const before = engineTasksRun();
    const [{ used: usedBefore }] = await ds.query('SELECT last_used_at AS used FROM forecast_cache');
    forgetRememberedResults();
    const second = planForecastResponseSchema.parse((await c.post(`/api/plans/${plan.id}/forecast`).expect(200)).body);
    expect(second).toMatchObject({ cached: true, inputHash: first.inputHash });
    expect(engineTasksRun()).toBe(before);
    await c.post(`/api/plans/${plan.id}/forecast`).expect(200);
    // Used within the day: the pruning date is not rewritten (a write per hit queued readers on the row).
    const [{ used: usedAfter }] = await ds.query('SELECT last_used_at AS used FROM forecast_cache');
    expect(new Date(usedAfter).getTime()).toBe(new Date(usedBefore).getTime());
    // A row last used over a day ago is moved forward by the next read from the table.
    await ds.query(`UPDATE forecast_cache SET last_used_at = now() - interval '3 days'`);
    forgetRememberedResults();
    await c.post(`/api/plans/${plan.id}/forecast`).expect(200);
    await expect
      .poll(async () => (await ds.query(`SELECT last_used_at > now() - interval '1 hour' AS fresh FROM forecast_cache`))[0].fresh)
      .toBe(true);
  });

  it('recomputes after the plan changes, and shares the cache between plans with the same inputs', async () => {
    const { user, c } = await keeper();
    const { plan } = await settledTankWithPlan(user.id);
    const first = (await c.post(`/api/plans/${plan.id}/forecast`).expect(200)).body;
    await c.agent
      .patch(`/api/plans/${plan.id}`)
      .set('x-shoalshift-csrf', '1')
      .send({ events: [{ type: 'add-fish', day: 2, fish: { species: 'harlequin-rasbora', count: 16, lengthCm: 3 } }] })
      .expect(200);
    const changed = (await c.post(`/api/plans/${plan.id}/forecast`).expect(200)).body;
    expect(changed.cached).toBe(false);
    expect(changed.inputHash).not.toBe(first.inputHash);
    // Twice the fish on a settled biofilter: a higher ammonia peak (MODEL.md §9.2: the spike grows with the added load).
    expect(changed.forecast.peaks.tan.value).toBeGreaterThan(first.forecast.peaks.tan.value);
    // Another plan on the same tank with the same events under another name: the same inputs.
    const twin = await createPlan(ctx.deps.dataSource, plan.tankId, {
      name: 'Same fish, other name',
      events: [{ type: 'add-fish', day: 2, fish: [{ species: 'harlequin-rasbora', count: 16, lengthCm: 3 }] }],
    });
    const shared = (await c.post(`/api/plans/${twin.id}/forecast`).expect(200)).body;
    expect(shared).toMatchObject({ cached: true, inputHash: changed.inputHash, planId: twin.id });
  });

  it('forecasts an empty tank without tests as new and unseeded', async () => {
    const ds = ctx.deps.dataSource;
    const { user, c } = await keeper();
    const tank = await createTank(ds, user.id);
    const plan = await createPlan(ds, tank.id, { events: [{ type: 'ammonia-dose', day: 0, amount: { unit: 'mgN-per-L', value: 1 } }] });
    const body = planForecastResponseSchema.parse((await c.post(`/api/plans/${plan.id}/forecast`).expect(200)).body);
    expect(body.startReason).toBe('new-unseeded');
    expect(body.cautions.join(' ')).toMatch(/gloves/);
  });

  it('answers 400 with the field when the engine refuses the tank, never 500', async () => {
    const ds = ctx.deps.dataSource;
    const { user, c } = await keeper();
    const tank = await createTank(ds, user.id);
    await createLivestock(ds, tank.id, { speciesId: null, customName: 'Mystery loach', count: 3, lengthCm: null });
    const plan = await createPlan(ds, tank.id);
    const res = await c.post(`/api/plans/${plan.id}/forecast`).expect(400);
    expect(res.body.error.fields).toHaveProperty(['livestock.0.lengthCm']);
  });

  it("answers 404 for another keeper's plan and a malformed id", async () => {
    const ds = ctx.deps.dataSource;
    const { c } = await keeper();
    const other = await createUser(ds, { email: 'skate@example.org' });
    const { plan } = await settledTankWithPlan(other.id);
    await c.post(`/api/plans/${plan.id}/forecast`).expect(404);
    await c.post('/api/plans/xyz/forecast').expect(404);
    const rows = await ds.query('SELECT count(*)::int AS n FROM forecast_cache');
    expect(rows[0].n).toBe(0);
  });
});
