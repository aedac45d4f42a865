import { monitorEventLoopDelay } from 'node:perf_hooks';
import request from 'supertest';
import { afterAll, afterEach, describe, expect, it } from 'vitest';
import { startJobs, type JobRunner } from '../../server/jobs/runner.js';
import { stoppedError } from '../../server/services/engine-runs.js';
import { closeEnginePool, DEFAULT_ENGINE_LIMITS } from '../../server/workers/engine-pool.js';
import { Plan } from '../../server/entities/plan.js';
import { CSRF_HEADER, CSRF_HEADER_VALUE } from '../../shared/api-error.js';
import { GOOD_PASSWORD, createLivestock, createTank } from './helpers/factories.js';
import { signedInKeeper } from './helpers/keeper-client.js';
import { sessionCookie, sleep, useTestApp } from './helpers/test-app.js';

/**
 * The engine pool's limits (issue 11): the per-account cap over two server processes, the run
 * time limit, the queue wait, cancellation when the client goes away, and the reading-alert job
 * off the main thread. One engine thread, so a task that was not cancelled would be seen.
 * The pool's limits are per process (configureEnginePool): the app made last sets them.
 */
const previousThreads = process.env.ENGINE_THREADS;
process.env.ENGINE_THREADS = '1';
const ctx = useTestApp({ env: { ENGINE_REQUESTS_PER_ACCOUNT: '1' } });
const runners: JobRunner[] = [];
afterEach(async () => {
  while (runners.length) await runners.pop()!.stop();
});
afterAll(async () => {
  await closeEnginePool();
  if (previousThreads === undefined) delete process.env.ENGINE_THREADS;
  else process.env.ENGINE_THREADS = previousThreads;
});

// 900 members × (180 days + 26 routine water changes) ≈ 185 000 work units: several seconds of
// one core, just within the work budget (simulation/work-budget.ts).
const HEAVY = { members: 900, horizonDays: 180 };
const LIGHT = { members: 64, horizonDays: 10 };

/** A signed-in keeper with a settled tank; `send` posts through any app (any "process") with the session cookie. */
async function keeperWithTank(email: string) {
  const k = await signedInKeeper(ctx, email);
  const tank = await createTank(ctx.deps.dataSource, k.user.id);
  await createLivestock(ctx.deps.dataSource, tank.id, { speciesId: 'neon-tetra', count: 12, lengthCm: 3 });
  const signIn = await request(ctx.app).post('/api/auth/sign-in').set(CSRF_HEADER, CSRF_HEADER_VALUE).send({ email, password: GOOD_PASSWORD });
  const cookie = sessionCookie(signIn) ?? '';
  const send = (app: typeof ctx.app, body: object) =>
    request(app).post(`/api/tanks/${tank.id}/ensemble`).set('Cookie', cookie).set(CSRF_HEADER, CSRF_HEADER_VALUE).send(body);
  return { k, tankId: tank.id, send };
}

describe('the per-account cap on heavy engine requests', () => {
  it('holds over two server processes on one database: a second request while the first runs answers 429 with Retry-After', async () => {
    const otherProcess = ctx.makeApp({ ENGINE_REQUESTS_PER_ACCOUNT: '1' });
    const { send } = await keeperWithTank('cap@example.org');
    const first = send(ctx.app, HEAVY).then((r) => r);
    await sleep(300);
    const second = await send(otherProcess, LIGHT);
    expect(second.status).toBe(429);
    expect(Number(second.headers['retry-after'])).toBeGreaterThanOrEqual(1);
    expect(second.body.error.message).toMatch(/already have 1/);
    expect((await first).status).toBe(200);
    // The slot is given back with the answer.
    expect(await ctx.deps.dataSource.query(`SELECT * FROM engine_slots`)).toEqual([]);
    expect((await send(otherProcess, LIGHT)).status).toBe(200);
  });

  it('counts each account apart: another keeper is not held up by the cap', async () => {
    const a = await keeperWithTank('a@example.org');
    const b = await keeperWithTank('b@example.org');
    const [ra, rb] = await Promise.all([a.send(ctx.app, LIGHT), b.send(ctx.app, LIGHT)]);
    expect([ra.status, rb.status]).toEqual([200, 200]);
  });
});

describe('the pool stops work over its limits', () => {
  it('a task over the run-time limit is stopped and answers 422 saying so', async () => {
    const app = ctx.makeApp({ ENGINE_TASK_SECONDS: '1' });
    const { send } = await keeperWithTank('slow@example.org');
    const t0 = performance.now();
    const res = await send(app, HEAVY);
    expect(res.status).toBe(422);
    expect(res.body.error.code).toBe('engine_time_limit');
    // Stopped at the limit, not when the work would have ended (the worker is terminated).
    expect(performance.now() - t0).toBeLessThan(HEAVY_SECONDS_AT_LEAST * 1000);
    ctx.makeApp({}); // back to the default limits for the next tests
  });

  it('a task that waits too long for a thread answers 503 with Retry-After, as a full queue does', async () => {
    const app = ctx.makeApp({ ENGINE_QUEUE_WAIT_SECONDS: '1' });
    const a = await keeperWithTank('busy-a@example.org');
    const b = await keeperWithTank('busy-b@example.org');
    const heavy = a.send(app, HEAVY).then((r) => r);
    await sleep(300);
    const waiting = await b.send(app, LIGHT);
    expect(waiting.status).toBe(503);
    expect(waiting.body.error.code).toBe('engine_busy');
    expect(Number(waiting.headers['retry-after'])).toBeGreaterThanOrEqual(1);
    expect((await heavy).status).toBe(200);
    const full = stoppedError('queue-full', DEFAULT_ENGINE_LIMITS);
    expect([full.status, full.headers?.['Retry-After']]).toEqual([503, '5']);
    ctx.makeApp({});
  });

  it('a client that disconnects cancels its task: the slot is free at once and the thread answers the next request', async () => {
    const { k, tankId } = await keeperWithTank('gone@example.org');
    const t0 = performance.now();
    await expect(k.post(`/api/tanks/${tankId}/ensemble`, HEAVY).timeout(400)).rejects.toThrow(/timeout/i);
    // Without cancellation the slot would stay held until the heavy task ended (seconds).
    let left = 1;
    while (left > 0 && performance.now() - t0 < 2000) {
      left = Number((await ctx.deps.dataSource.query(`SELECT count(*) AS n FROM engine_slots`))[0].n);
      if (left > 0) await sleep(50);
    }
    expect(left).toBe(0);
    // The thread it ran on was ended (piscina terminates a running task's worker on abort); a new one answers.
    const next = await k.post(`/api/tanks/${tankId}/ensemble`, LIGHT);
    expect(next.status).toBe(200);
  });
});

/** The heavy ensemble takes at least this long on one core (~4 s measured unloaded). */
const HEAVY_SECONDS_AT_LEAST = 3;

describe('the reading-alert job runs its forecast on the pool', () => {
  it('a saved plan with the worst accepted dose schedule, then a logged test with jobs on: no crash, the event loop stays free, the alert is sent', async () => {
    const ds = ctx.deps.dataSource;
    const { k, tankId } = await keeperWithTank('dose@example.org');
    const runner = await startJobs(ctx.deps, { schedule: false, pollingIntervalSeconds: 0.5 });
    runners.push(runner);
    ctx.deps.jobs = runner;
    try {
      // Four doses a day with no count: the most the schema accepts (1461 entries over a year).
      const startDate = new Date(Date.now() - 200 * 86_400_000).toISOString().slice(0, 10);
      const created = await k.post(`/api/tanks/${tankId}/plans`, {
        name: 'Dosing',
        startDate,
        events: [{ type: 'ammonia-dose', day: 0, amount: { unit: 'mgN-per-L', value: 0.5 }, repeatEveryDays: 0.25 }],
      });
      expect(created.status).toBe(201);
      // Running since 200 days ago (the API starts a plan today only).
      await ds.query(`UPDATE plans SET status = 'active', started_at = $2::date WHERE id = $1`, [created.body.id, startDate]);
      // And what an older plan could hold before the minimums: a dose every 1e-9 days.
      await ds.getRepository(Plan).insert({
        tankId,
        name: 'From before',
        startDate,
        status: 'draft',
        events: [{ type: 'ammonia-dose', day: 0, amount: { unit: 'mgN-per-L', value: 0.5 }, repeatEveryDays: 1e-9 }],
      });
      const loop = monitorEventLoopDelay({ resolution: 10 });
      loop.enable();
      const logged = await k.post(`/api/tanks/${tankId}/readings`, { takenAt: new Date().toISOString(), basis: 'N', no2: 0.5, ph: 7.2, temperatureC: 25 });
      expect(logged.status).toBe(201);
      const alerts = () => ctx.mail.messages().filter((m) => m.subject.startsWith('Water test alert'));
      const deadline = Date.now() + 60_000;
      while (alerts().length === 0 && Date.now() < deadline) await sleep(100);
      loop.disable();
      expect(alerts()).toHaveLength(1);
      const failed = await ds.query(`SELECT name FROM pgboss.job WHERE state IN ('retry', 'failed')`);
      expect(failed).toEqual([]);
      console.log(`[alert job] worst accepted dose plan: event-loop delay max ${(loop.max / 1e6).toFixed(0)} ms while the job ran`);
      expect(loop.max / 1e6).toBeLessThan(500);

      // The old plan made active: the engine refuses it before building anything; the limit alert still goes.
      await ds.query(`UPDATE plans SET status = CASE WHEN name = 'From before' THEN 'active' ELSE 'draft' END, started_at = now() WHERE tank_id = $1`, [tankId]);
      const second = await k.post(`/api/tanks/${tankId}/readings`, { takenAt: new Date(Date.now() - 60_000).toISOString(), basis: 'N', no2: 0.5, ph: 7.2, temperatureC: 25 });
      expect(second.status).toBe(201);
      const deadline2 = Date.now() + 60_000;
      while (alerts().length < 2 && Date.now() < deadline2) await sleep(100);
      expect(alerts()).toHaveLength(2);
      const refused = ctx.logs.entries.find((e) => e.event === 'jobs.alert_forecast_failed');
      expect(String(refused?.fields.error)).toMatch(/events\.0\.repeatEveryDays/);
    } finally {
      ctx.deps.jobs = undefined;
      await ds.query(`DELETE FROM mail_sends`);
    }
  }, 120_000);
});
