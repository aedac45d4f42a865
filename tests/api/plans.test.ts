import { describe, expect, it } from 'vitest';
import { planDetailSchema, planListSchema } from '../../shared/schemas/plan.js';
import { Plan } from '../../server/entities/plan.js';
import { GOOD_PASSWORD, createLivestock, createPlan, createTank, createUser } from './helpers/factories.js';
import { client, useTestApp } from './helpers/test-app.js';
import { CSRF_HEADER, CSRF_HEADER_VALUE } from '../../shared/api-error.js';

const ctx = useTestApp();

async function keeper(email = 'ray@example.org') {
  const user = await createUser(ctx.deps.dataSource, { email });
  const c = client(ctx.app);
  await c.post('/api/auth/sign-in', { email, password: GOOD_PASSWORD }).expect(200);
  const patch = (url: string, body: object) => c.agent.patch(url).set(CSRF_HEADER, CSRF_HEADER_VALUE).send(body);
  const del = (url: string) => c.agent.delete(url).set(CSRF_HEADER, CSRF_HEADER_VALUE);
  return { user, c, patch, del };
}

const addNeons = (day: number, count = 6) => ({ type: 'add-fish', day, fish: { species: 'neon-tetra', count, lengthCm: 3 } });
const validPlan = { name: 'Neons in two steps', startDate: '2026-04-01', events: [addNeons(0), { type: 'water-change', day: 4, percent: 25 }, addNeons(7)] };

describe('POST /api/tanks/:tankId/plans', () => {
  it('needs a session', async () => {
    await client(ctx.app).post('/api/tanks/00000000-0000-4000-8000-000000000000/plans', validPlan).expect(401);
  });

  it('creates a draft plan on the own tank and answers it with its check days', async () => {
    const { user, c } = await keeper();
    const tank = await createTank(ctx.deps.dataSource, user.id, { name: 'Community 120' });
    const res = await c.post(`/api/tanks/${tank.id}/plans`, validPlan).expect(201);
    const plan = planDetailSchema.parse(res.body);
    expect(plan).toMatchObject({ tankId: tank.id, tankName: 'Community 120', name: 'Neons in two steps', status: 'draft', startDate: '2026-04-01' });
    expect(plan.events).toHaveLength(3);
    // Check days (shared/plan-check-days.ts, common practice): a baseline, then daily after each addition.
    expect(plan.checkDays.slice(0, 4).map((d) => d.day)).toEqual([0, 1, 2, 3]);
    expect(plan.checkDays.find((d) => d.day === 4)!.reasons).toContain('before the 25 % water change');
    expect(plan.checkDays.find((d) => d.day === 8)).toMatchObject({ date: '2026-04-09' });
    expect(await ctx.deps.dataSource.getRepository(Plan).countBy({ tankId: tank.id })).toBe(1);
  });

  it.each([
    ['name', { ...validPlan, name: '' }],
    ['startDate', { ...validPlan, startDate: '2026-02-30' }],
    ['startDate', { ...validPlan, startDate: 'tomorrow' }],
    ['status', { ...validPlan, status: 'paused' }],
    ['events.0.day', { ...validPlan, events: [{ type: 'add-fish', day: -1, fish: { species: 'neon-tetra', count: 2 } }] }],
    ['events.0.fish.count', { ...validPlan, events: [{ type: 'add-fish', day: 0, fish: { species: 'neon-tetra', count: 0 } }] }],
    ['events.0.percent', { ...validPlan, events: [{ type: 'water-change', day: 3, percent: 120 }] }],
    ['events.0.type', { ...validPlan, events: [{ type: 'teleport', day: 3 }] }],
  ] as [string, object][])('refuses a bad %s with 400 naming it, and writes nothing', async (field, body) => {
    const { user, c } = await keeper();
    const tank = await createTank(ctx.deps.dataSource, user.id);
    const res = await c.post(`/api/tanks/${tank.id}/plans`, body).expect(400);
    expect(res.body.error.fields).toHaveProperty([field]);
    expect(await ctx.deps.dataSource.getRepository(Plan).count()).toBe(0);
  });

  it('refuses rinsing a zone the tank does not have, naming the event field', async () => {
    const { user, c } = await keeper();
    const tank = await createTank(ctx.deps.dataSource, user.id);
    const body = { ...validPlan, events: [{ type: 'filter-clean', day: 2, zoneId: 'sump', action: 'rinse', shareLost: 0.3 }] };
    const res = await c.post(`/api/tanks/${tank.id}/plans`, body).expect(400);
    expect(res.body.error.fields['events.0.zoneId']).toMatch(/sump/);
  });

  it('ignores an owner or tank id smuggled into the body', async () => {
    const ds = ctx.deps.dataSource;
    const { user, c } = await keeper();
    const other = await createUser(ds, { email: 'skate@example.org' });
    const tank = await createTank(ds, user.id);
    const foreign = await createTank(ds, other.id);
    const res = await c.post(`/api/tanks/${tank.id}/plans`, { ...validPlan, tankId: foreign.id, ownerId: other.id }).expect(201);
    expect(res.body.tankId).toBe(tank.id);
    expect(await ds.getRepository(Plan).countBy({ tankId: foreign.id })).toBe(0);
  });

  it("answers 404 for another keeper's tank and a malformed id, and writes nothing", async () => {
    const ds = ctx.deps.dataSource;
    const { c } = await keeper();
    const other = await createUser(ds, { email: 'skate@example.org' });
    const foreign = await createTank(ds, other.id);
    await c.post(`/api/tanks/${foreign.id}/plans`, validPlan).expect(404);
    await c.post('/api/tanks/not-a-uuid/plans', validPlan).expect(404);
    expect(await ds.getRepository(Plan).count()).toBe(0);
  });
});

describe('GET /api/plans, /api/tanks/:tankId/plans and /api/plans/:id', () => {
  it("lists only the keeper's own plans, active first", async () => {
    const ds = ctx.deps.dataSource;
    const { user, c } = await keeper();
    const other = await createUser(ds, { email: 'skate@example.org' });
    const tank = await createTank(ds, user.id);
    const draft = await createPlan(ds, tank.id, { name: 'Later', status: 'draft' });
    const active = await createPlan(ds, tank.id, { name: 'Now', status: 'active' });
    const foreign = await createPlan(ds, (await createTank(ds, other.id)).id);
    const all = planListSchema.parse((await c.get('/api/plans').expect(200)).body);
    expect(all.plans.map((p) => p.id)).toEqual([active.id, draft.id]);
    const mine = planListSchema.parse((await c.get(`/api/tanks/${tank.id}/plans`).expect(200)).body);
    expect(mine.plans).toHaveLength(2);
    expect(JSON.stringify(all)).not.toContain(foreign.id);
  });

  it("answers one own plan, and 404 for another keeper's plan, a missing one and a malformed id", async () => {
    const ds = ctx.deps.dataSource;
    const { user, c } = await keeper();
    const other = await createUser(ds, { email: 'skate@example.org' });
    const plan = await createPlan(ds, (await createTank(ds, user.id)).id);
    const foreign = await createPlan(ds, (await createTank(ds, other.id)).id);
    expect(planDetailSchema.parse((await c.get(`/api/plans/${plan.id}`).expect(200)).body).id).toBe(plan.id);
    for (const id of [foreign.id, '00000000-0000-4000-8000-000000000000', 'nope']) await c.get(`/api/plans/${id}`).expect(404);
    await c.get(`/api/tanks/${foreign.tankId}/plans`).expect(404);
  });
});

describe('PATCH /api/plans/:id', () => {
  it('changes name and events; check days follow the new events; the status stays', async () => {
    const ds = ctx.deps.dataSource;
    const { user, patch } = await keeper();
    await createLivestock(ds, (await createTank(ds, user.id)).id);
    const plan = await createPlan(ds, (await createTank(ds, user.id)).id);
    const res = await patch(`/api/plans/${plan.id}`, { name: 'Renamed', events: [addNeons(10)] }).expect(200);
    const body = planDetailSchema.parse(res.body);
    expect(body).toMatchObject({ name: 'Renamed', status: 'draft', startedAt: null, finishedAt: null });
    expect(body.checkDays.map((d) => d.day)).toEqual([0, 11, 12, 13, 15, 17, 20, 24]);
    // Stored as the engine reads it: the single group sent becomes a list of one.
    expect((await ds.getRepository(Plan).findOneByOrFail({ id: plan.id })).events).toEqual([{ ...addNeons(10), fish: [addNeons(10).fish] }]);
  });

  it('refuses an empty change and a bad event with 400 naming the field, and changes nothing', async () => {
    const ds = ctx.deps.dataSource;
    const { user, patch } = await keeper();
    const plan = await createPlan(ds, (await createTank(ds, user.id)).id, { name: 'Keep me' });
    expect((await patch(`/api/plans/${plan.id}`, {}).expect(400)).body.error.fields).toHaveProperty('_');
    expect((await patch(`/api/plans/${plan.id}`, { events: [{ type: 'temperature', day: 2, temperatureC: 55 }] }).expect(400)).body.error.fields).toHaveProperty([
      'events.0.temperatureC',
    ]);
    expect((await patch(`/api/plans/${plan.id}`, { status: 'finished' }).expect(400)).body.error.fields).toHaveProperty('status');
    // Status moves only through start and finish (tests/api/plan-life.test.ts), never through a patch.
    expect((await patch(`/api/plans/${plan.id}`, { status: 'active' }).expect(400)).body.error.fields.status).toMatch(/Start this plan/);
    expect((await ds.getRepository(Plan).findOneByOrFail({ id: plan.id })).name).toBe('Keep me');
  });

  it("answers 404 for another keeper's plan and leaves it alone", async () => {
    const ds = ctx.deps.dataSource;
    const { patch } = await keeper();
    const other = await createUser(ds, { email: 'skate@example.org' });
    const foreign = await createPlan(ds, (await createTank(ds, other.id)).id, { name: 'Theirs' });
    await patch(`/api/plans/${foreign.id}`, { name: 'Mine now' }).expect(404);
    expect((await ds.getRepository(Plan).findOneByOrFail({ id: foreign.id })).name).toBe('Theirs');
  });
});

describe('DELETE /api/plans/:id', () => {
  it("deletes the own plan (204) and answers 404 for another keeper's", async () => {
    const ds = ctx.deps.dataSource;
    const { user, del } = await keeper();
    const other = await createUser(ds, { email: 'skate@example.org' });
    const plan = await createPlan(ds, (await createTank(ds, user.id)).id);
    const foreign = await createPlan(ds, (await createTank(ds, other.id)).id);
    await del(`/api/plans/${plan.id}`).expect(204);
    await del(`/api/plans/${plan.id}`).expect(404);
    await del(`/api/plans/${foreign.id}`).expect(404);
    expect(await ds.getRepository(Plan).countBy({ id: foreign.id })).toBe(1);
  });

  it('refuses a delete without the CSRF header', async () => {
    const ds = ctx.deps.dataSource;
    const { user, c } = await keeper();
    const plan = await createPlan(ds, (await createTank(ds, user.id)).id);
    await c.agent.delete(`/api/plans/${plan.id}`).expect(403);
    expect(await ds.getRepository(Plan).countBy({ id: plan.id })).toBe(1);
  });
});
