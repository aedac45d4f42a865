import { describe, expect, it } from 'vitest';
import { planDetailSchema, planReadingsSchema } from '../../shared/schemas/plan.js';
import { tankDetailSchema } from '../../shared/schemas/tank.js';
import { Plan } from '../../server/entities/plan.js';
import { GOOD_PASSWORD, createPlan, createReading, createTank, createUser } from './helpers/factories.js';
import { client, useTestApp } from './helpers/test-app.js';
import { CSRF_HEADER, CSRF_HEADER_VALUE } from '../../shared/api-error.js';

const ctx = useTestApp();
const DAY_MS = 86_400_000;
const today = () => new Date().toISOString().slice(0, 10);
const daysFromToday = (n: number) => new Date(Date.now() + n * DAY_MS).toISOString().slice(0, 10);

async function keeper(email = 'nell@example.org') {
  const user = await createUser(ctx.deps.dataSource, { email });
  const c = client(ctx.app);
  await c.post('/api/auth/sign-in', { email, password: GOOD_PASSWORD }).expect(200);
  const patch = (url: string, body: object) => c.agent.patch(url).set(CSRF_HEADER, CSRF_HEADER_VALUE).send(body);
  const tank = await createTank(ctx.deps.dataSource, user.id, { name: 'Lounge 90' });
  return { user, c, patch, tank };
}

const start = (c: Awaited<ReturnType<typeof keeper>>['c'], id: string, body: object = {}) => c.post(`/api/plans/${id}/start`, body);
const finish = (c: Awaited<ReturnType<typeof keeper>>['c'], id: string) => c.post(`/api/plans/${id}/finish`, {});
const stored = (id: string) => ctx.deps.dataSource.getRepository(Plan).findOneByOrFail({ id });

describe('a plan’s life: draft → running → done', () => {
  it('starts a draft today (day 0 = today), lists it on the tank as running, then marks it done and keeps it', async () => {
    const { c, tank } = await keeper();
    const plan = await createPlan(ctx.deps.dataSource, tank.id, { name: 'Six neons', startDate: '2026-01-10' });
    const started = planDetailSchema.parse((await start(c, plan.id).expect(200)).body);
    expect(started).toMatchObject({ status: 'active', startDate: today(), finishedAt: null });
    expect(Date.parse(started.startedAt!)).toBeGreaterThan(Date.now() - 60_000);
    // Check days move with day 0 (shared/plan-check-days.ts): day 1 is tomorrow.
    expect(started.checkDays.find((d) => d.day === 1)?.date).toBe(daysFromToday(1));
    const detail = tankDetailSchema.parse((await c.get(`/api/tanks/${tank.id}`).expect(200)).body);
    expect(detail.plans.find((p) => p.id === plan.id)).toMatchObject({ status: 'active', startedAt: started.startedAt });
    const list = (await c.get('/api/tanks').expect(200)).body.tanks;
    expect(list[0].activePlan).toMatchObject({ id: plan.id, name: 'Six neons' });

    const done = planDetailSchema.parse((await finish(c, plan.id).expect(200)).body);
    expect(done).toMatchObject({ status: 'done', startDate: today(), startedAt: started.startedAt });
    expect(Date.parse(done.finishedAt!)).toBeGreaterThanOrEqual(Date.parse(started.startedAt!));
    expect((await c.get('/api/tanks').expect(200)).body.tanks[0].activePlan).toBeNull();
  });

  it('takes the keeper’s own today (a day either side of UTC) and refuses any other start date, naming startDate', async () => {
    const { c, tank } = await keeper();
    const plan = await createPlan(ctx.deps.dataSource, tank.id);
    for (const startDate of [daysFromToday(-3), daysFromToday(2), '2026-02-30']) {
      const res = await start(c, plan.id, { startDate }).expect(400);
      expect(res.body.error.fields).toHaveProperty('startDate');
    }
    expect((await stored(plan.id)).status).toBe('draft');
    expect((await start(c, plan.id, { startDate: daysFromToday(-1) }).expect(200)).body.startDate).toBe(daysFromToday(-1));
  });

  it.each([
    ['start a running plan', 'active', 'start', /already running/],
    ['start a finished plan', 'done', 'start', /finished/],
    ['finish a draft', 'draft', 'finish', /not been started/],
    ['finish a finished plan', 'done', 'finish', /already done/],
  ] as const)('refuses to %s with 409 saying why, and changes nothing', async (_what, status, action, reason) => {
    const { c, tank } = await keeper();
    const plan = await createPlan(ctx.deps.dataSource, tank.id, { status });
    const before = await stored(plan.id);
    const res = await (action === 'start' ? start(c, plan.id) : finish(c, plan.id)).expect(409);
    expect(res.body.error).toMatchObject({ code: 'plan_state', message: expect.stringMatching(reason) });
    expect(await stored(plan.id)).toEqual(before);
  });

  it('refuses to start a plan with no events (it would have no check days)', async () => {
    const { c, tank } = await keeper();
    const plan = await createPlan(ctx.deps.dataSource, tank.id, { events: [] });
    const res = await start(c, plan.id).expect(409);
    expect(res.body.error.message).toMatch(/at least one event/);
    expect(res.body.error.fields).toHaveProperty('events');
  });

  it('runs one plan per tank: a second start names the running plan and leaves both as they were', async () => {
    const { c, tank } = await keeper();
    const running = await createPlan(ctx.deps.dataSource, tank.id, { name: 'Rasboras first', status: 'active' });
    const next = await createPlan(ctx.deps.dataSource, tank.id, { name: 'Then corydoras' });
    const res = await start(c, next.id).expect(409);
    expect(res.body.error.message).toContain('"Rasboras first" is already running');
    expect((await stored(running.id)).status).toBe('active');
    expect((await stored(next.id)).status).toBe('draft');
    // Once the first is done, the second starts; a plan on another tank never stood in the way.
    await finish(c, running.id).expect(200);
    await start(c, next.id).expect(200);
  });

  it('lets two simultaneous starts on one tank through only once (the unique index decides)', async () => {
    const { c, tank } = await keeper();
    const a = await createPlan(ctx.deps.dataSource, tank.id, { name: 'A' });
    const b = await createPlan(ctx.deps.dataSource, tank.id, { name: 'B' });
    const answers = await Promise.all([start(c, a.id), start(c, b.id)]);
    expect(answers.map((r) => r.status).sort()).toEqual([200, 409]);
    expect(await ctx.deps.dataSource.getRepository(Plan).countBy({ tankId: tank.id, status: 'active' })).toBe(1);
  });

  it('keeps a running plan’s day 0 but lets its name and events change; a finished plan is read-only', async () => {
    const { c, patch, tank } = await keeper();
    const plan = await createPlan(ctx.deps.dataSource, tank.id);
    await start(c, plan.id).expect(200);
    const moved = await patch(`/api/plans/${plan.id}`, { startDate: daysFromToday(5) }).expect(409);
    expect(moved.body.error.fields).toHaveProperty('startDate');
    await patch(`/api/plans/${plan.id}`, { name: 'Renamed while running', events: [{ type: 'water-change', day: 3, percent: 20 }] }).expect(200);
    await finish(c, plan.id).expect(200);
    const frozen = await patch(`/api/plans/${plan.id}`, { name: 'After the end' }).expect(409);
    expect(frozen.body.error.message).toMatch(/finished/);
    expect((await stored(plan.id)).name).toBe('Renamed while running');
  });

  it("answers 404 for another keeper's plan on start, finish and readings, and changes nothing", async () => {
    const ds = ctx.deps.dataSource;
    const { c } = await keeper();
    const other = await createUser(ds, { email: 'orla@example.org' });
    const foreign = await createPlan(ds, (await createTank(ds, other.id)).id, { status: 'active' });
    const before = await stored(foreign.id);
    await start(c, foreign.id).expect(404);
    await finish(c, foreign.id).expect(404);
    await c.get(`/api/plans/${foreign.id}/readings`).expect(404);
    await start(c, 'not-a-uuid').expect(404);
    expect(await stored(foreign.id)).toEqual(before);
  });

  it('answers the tests logged while the plan ran, oldest first: from day 0 (in any time zone) to when it was marked done', async () => {
    const ds = ctx.deps.dataSource;
    const { c, tank } = await keeper();
    const plan = await createPlan(ds, tank.id);
    await createReading(ds, tank.id, { takenAt: new Date(Date.now() - 3 * DAY_MS), tanMgN: 0.9 });
    expect(planReadingsSchema.parse((await c.get(`/api/plans/${plan.id}/readings`).expect(200)).body)).toEqual({ readings: [], total: 0 });
    await start(c, plan.id).expect(200);
    const first = await c.post(`/api/tanks/${tank.id}/readings`, { takenAt: new Date(Date.now() - 60_000).toISOString(), basis: 'N', tan: 0.25, no2: 0.05 }).expect(201);
    const second = await c.post(`/api/tanks/${tank.id}/readings`, { takenAt: new Date().toISOString(), basis: 'N', tan: 0.5 }).expect(201);
    // Day 0 starts up to 14 h before UTC midnight (UTC+14): a test then is day 0 in the keeper's own calendar.
    const midnight = Date.parse(`${today()}T00:00:00Z`);
    const east = await createReading(ds, tank.id, { takenAt: new Date(midnight - 10 * 3_600_000), tanMgN: 0.2 });
    await createReading(ds, tank.id, { takenAt: new Date(midnight - 15 * 3_600_000), tanMgN: 0.3 });
    const running = planReadingsSchema.parse((await c.get(`/api/plans/${plan.id}/readings`).expect(200)).body);
    expect(running.readings.map((r) => r.id)).toEqual([east.id, first.body.id, second.body.id]);
    expect(running.total).toBe(3);
    await finish(c, plan.id).expect(200);
    // A test after the end is not the plan's.
    await createReading(ds, tank.id, { takenAt: new Date(Date.now() + 60_000), tanMgN: 0.1 });
    const done = planReadingsSchema.parse((await c.get(`/api/plans/${plan.id}/readings`).expect(200)).body);
    expect(done.readings.map((r) => r.id)).toEqual([east.id, first.body.id, second.body.id]);
  });
});
