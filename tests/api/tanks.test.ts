import { describe, expect, it } from 'vitest';
import { TANK_DETAIL_READING_LIMIT, tankDetailSchema, tankListSchema } from '../../shared/schemas/tank.js';
import { GOOD_PASSWORD, createLivestock, createPlan, createReading, createTank, createUser } from './helpers/factories.js';
import { client, useTestApp } from './helpers/test-app.js';

const ctx = useTestApp();

async function keeper(email: string) {
  const user = await createUser(ctx.deps.dataSource, { email });
  const c = client(ctx.app);
  await c.post('/api/auth/sign-in', { email, password: GOOD_PASSWORD }).expect(200);
  return { user, c };
}

describe('GET /api/tanks', () => {
  it('needs a session', async () => {
    await client(ctx.app).get('/api/tanks').expect(401);
  });

  it("lists only the keeper's own tanks, with fish and species counts, latest reading and active plan", async () => {
    const ds = ctx.deps.dataSource;
    const { user, c } = await keeper('ray@example.org');
    const other = await createUser(ds, { email: 'skate@example.org' });
    const community = await createTank(ds, user.id, { name: 'Community 120' });
    const empty = await createTank(ds, user.id, { name: 'Quarantine 40', volumeL: 40 });
    const foreign = await createTank(ds, other.id, { name: 'Not yours' });
    await createLivestock(ds, community.id, { speciesId: 'neon-tetra', count: 12 });
    await createLivestock(ds, community.id, { speciesId: 'bronze-corydoras', count: 6 });
    await createLivestock(ds, community.id, { speciesId: null, customName: 'Nerite snail', count: 2 });
    await createReading(ds, community.id, { takenAt: new Date('2026-03-01T08:00:00Z'), tanMgN: 0.4 });
    await createReading(ds, community.id, { takenAt: new Date('2026-03-03T08:00:00Z'), tanMgN: 0.2, no2MgN: 0.05, no3MgN: 8 });
    await createReading(ds, community.id, { takenAt: new Date('2026-03-02T08:00:00Z'), tanMgN: 0.3 });
    await createPlan(ds, community.id, { name: 'Old draft', status: 'draft' });
    const active = await createPlan(ds, community.id, { name: 'Add rasboras in three steps', status: 'active' });
    await createReading(ds, foreign.id);

    const res = await c.get('/api/tanks').expect(200);
    const { tanks } = tankListSchema.parse(res.body);
    expect(tanks.map((t) => t.name)).toEqual(['Community 120', 'Quarantine 40']);
    expect(JSON.stringify(res.body)).not.toContain(foreign.id);
    const [first, second] = tanks;
    expect(first).toMatchObject({ id: community.id, fishCount: 20, speciesCount: 3, activePlan: { id: active.id, name: active.name } });
    expect(first.latestReading).toEqual({ takenAt: '2026-03-03T08:00:00.000Z', tanMgN: 0.2, no2MgN: 0.05, no3MgN: 8 });
    expect(second).toMatchObject({ id: empty.id, fishCount: 0, speciesCount: 0, latestReading: null, activePlan: null, volumeL: 40 });
  });

  it('answers an empty list for a keeper without tanks', async () => {
    const { c } = await keeper('ray@example.org');
    expect((await c.get('/api/tanks').expect(200)).body).toEqual({ tanks: [] });
  });
});

describe('GET /api/tanks/:id', () => {
  it('answers the own tank with livestock, the newest 50 readings first, and plans', async () => {
    const ds = ctx.deps.dataSource;
    const { user, c } = await keeper('ray@example.org');
    const tank = await createTank(ds, user.id, { name: 'Planted 90', tapTanMgN: 0.3 });
    await createLivestock(ds, tank.id, { speciesId: 'harlequin-rasbora', count: 8, lengthCm: 3.5 });
    const base = Date.parse('2026-01-01T09:00:00Z');
    for (let d = 0; d < 55; d++) await createReading(ds, tank.id, { takenAt: new Date(base + d * 86_400_000), tanMgN: d / 100 });
    const plan = await createPlan(ds, tank.id, { status: 'active' });

    const detail = tankDetailSchema.parse((await c.get(`/api/tanks/${tank.id}`).expect(200)).body);
    expect(detail.name).toBe('Planted 90');
    expect(detail.tapWater).toEqual({ tanMgN: 0.3, no2MgN: 0, no3MgN: 1 });
    expect(detail.livestock).toEqual([expect.objectContaining({ speciesId: 'harlequin-rasbora', count: 8, lengthCm: 3.5 })]);
    expect(detail.readings).toHaveLength(TANK_DETAIL_READING_LIMIT);
    expect(detail.readings[0].takenAt).toBe(new Date(base + 54 * 86_400_000).toISOString());
    expect(detail.readings[49].tanMgN).toBeCloseTo(0.05, 10);
    expect(detail.plans).toEqual([expect.objectContaining({ id: plan.id, status: 'active', startDate: '2026-01-10' })]);
    expect(detail.plans[0].events[0]).toEqual({ type: 'add-fish', day: 0, fish: [{ species: 'neon-tetra', count: 6 }] });
  });

  it("answers 404 (not 403) for another keeper's tank, a missing one and a malformed id", async () => {
    const ds = ctx.deps.dataSource;
    const { c } = await keeper('ray@example.org');
    const other = await createUser(ds, { email: 'skate@example.org' });
    const foreign = await createTank(ds, other.id);
    for (const id of [foreign.id, '00000000-0000-4000-8000-000000000000', 'not-a-uuid', "1' or '1'='1"]) {
      const res = await c.get(`/api/tanks/${encodeURIComponent(id)}`).expect(404);
      expect(res.body.error.code).toBe('not_found');
    }
  });

  it('needs a session', async () => {
    const ds = ctx.deps.dataSource;
    const owner = await createUser(ds);
    const tank = await createTank(ds, owner.id);
    await client(ctx.app).get(`/api/tanks/${tank.id}`).expect(401);
  });
});
