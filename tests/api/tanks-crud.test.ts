import { describe, expect, it } from 'vitest';
import { CSRF_HEADER, CSRF_HEADER_VALUE } from '../../shared/api-error.js';
import { TANK_DEFAULTS, tankDetailSchema, tankListWithStatusSchema } from '../../shared/schemas/tank.js';
import { limitRecord, tankLimits, type LimitConditions, type LimitChoices } from '../../simulation/limits.js';

/** The tank's default limits by key, through the one picker. */
const limitsAt = (c: LimitConditions, choices?: LimitChoices) => limitRecord(tankLimits(c, choices), c);
import { Tank } from '../../server/entities/tank.js';
import { createLivestock, createPlan, createReading, createTank, createUser } from './helpers/factories.js';
import { signedInKeeper } from './helpers/keeper-client.js';
import { client, useTestApp } from './helpers/test-app.js';

const ctx = useTestApp();
const tankCount = () => ctx.deps.dataSource.getRepository(Tank).count();

describe('POST /api/tanks', () => {
  it('needs a session (401) and the CSRF header (403)', async () => {
    await client(ctx.app).post('/api/tanks', { name: 'A', volumeL: 60 }).expect(401);
    const k = await signedInKeeper(ctx, 'ray@example.org');
    await k.agent.post('/api/tanks').send({ name: 'A', volumeL: 60 }).expect(403);
    expect(await tankCount()).toBe(0);
  });

  it('creates a tank from a name and a volume, with the newcomer defaults', async () => {
    const k = await signedInKeeper(ctx, 'ray@example.org');
    const res = await k.post('/api/tanks', { name: '  Shrimp 30  ', volumeL: 30 }).expect(201);
    const tank = tankDetailSchema.parse(res.body);
    expect(res.headers.location).toBe(`/api/tanks/${tank.id}`);
    expect(tank).toMatchObject({ name: 'Shrimp 30', volumeL: 30, temperatureC: TANK_DEFAULTS.temperatureC, ph: TANK_DEFAULTS.ph, khDkh: null });
    expect(tank.tapWater).toEqual({ tanMgN: 0, no2MgN: 0, no3MgN: 0 });
    // 1 L of media per 100 L of tank (common practice, from memory), at least 0.2 L.
    expect(tank.setup.filter).toEqual({ kind: 'hang-on-back', mediaVolumeL: 0.3 });
    expect(tank.setup.substrate).toEqual({ grain: 'gravel', depthCm: 5 });
    expect(tank.livestock).toEqual([]);
    await k.get(`/api/tanks/${tank.id}`).expect(200);
  });

  it('takes the filter kind and a full setup when given', async () => {
    const k = await signedInKeeper(ctx, 'ray@example.org');
    const a = tankDetailSchema.parse((await k.post('/api/tanks', { name: 'Sponge', volumeL: 200, filterKind: 'sponge' }).expect(201)).body);
    expect(a.setup.filter).toEqual({ kind: 'sponge', mediaVolumeL: 2 });
    const setup = { filter: { kind: 'canister', mediaVolumeL: 3, media: 'ceramic-rings' }, substrate: 'bare', hardscape: 'lots', plants: 'heavy', aeration: 'air-stone', lightHoursPerDay: 10 };
    const b = tankDetailSchema.parse(
      (await k.post('/api/tanks', { name: 'Full', volumeL: 240, temperatureC: 26, ph: 6.8, khDkh: 3, tapWater: { tanMgN: 0.4, no2MgN: 0, no3MgN: 2 }, setup, notes: 'Chloramine tap water.' }).expect(201)).body,
    );
    expect(b).toMatchObject({ temperatureC: 26, ph: 6.8, khDkh: 3, notes: 'Chloramine tap water.', setup });
    expect(b.tapWater.tanMgN).toBe(0.4);
  });

  it.each([
    [{ volumeL: 60 }, 'name'],
    [{ name: '', volumeL: 60 }, 'name'],
    [{ name: 'x'.repeat(81), volumeL: 60 }, 'name'],
    [{ name: 'A' }, 'volumeL'],
    [{ name: 'A', volumeL: 0 }, 'volumeL'],
    [{ name: 'A', volumeL: '60' }, 'volumeL'],
    [{ name: 'A', volumeL: 60, temperatureC: 41 }, 'temperatureC'],
    [{ name: 'A', volumeL: 60, ph: 3 }, 'ph'],
    [{ name: 'A', volumeL: 60, khDkh: -1 }, 'khDkh'],
    [{ name: 'A', volumeL: 60, tapWater: { tanMgN: -1, no2MgN: 0, no3MgN: 0 } }, 'tapWater.tanMgN'],
    [{ name: 'A', volumeL: 60, filterKind: 'magic' }, 'filterKind'],
    [{ name: 'A', volumeL: 60, setup: { filter: { kind: 'canister', mediaVolumeL: 0 } } }, 'setup.filter.mediaVolumeL'],
    [{ name: 'A', volumeL: 60, setup: { lightHoursPerDay: 25 } }, 'setup.lightHoursPerDay'],
    [{ name: 'A', volumeL: 60, ownerId: '00000000-0000-4000-8000-000000000000' }, '_'],
  ])('refuses %j with 400 naming %s, and stores nothing', async (body, field) => {
    const k = await signedInKeeper(ctx, 'ray@example.org');
    const res = await k.post('/api/tanks', body).expect(400);
    expect(res.body.error.code).toBe('validation');
    expect(Object.keys(res.body.error.fields)).toContain(field);
    expect(await tankCount()).toBe(0);
  });
});

describe('PATCH /api/tanks/:id', () => {
  it('changes only the fields given', async () => {
    const k = await signedInKeeper(ctx, 'ray@example.org');
    const tank = await createTank(ctx.deps.dataSource, k.user.id, { name: 'Old', notes: 'keep me' });
    const res = await k.patch(`/api/tanks/${tank.id}`, { name: 'New name', volumeL: 150, tapWater: { tanMgN: 0.2, no2MgN: 0, no3MgN: 5 } }).expect(200);
    const detail = tankDetailSchema.parse(res.body);
    expect(detail).toMatchObject({ name: 'New name', volumeL: 150, temperatureC: 25, notes: 'keep me' });
    expect(detail.tapWater).toEqual({ tanMgN: 0.2, no2MgN: 0, no3MgN: 5 });
  });

  it('refuses a bad field with 400 and changes nothing', async () => {
    const k = await signedInKeeper(ctx, 'ray@example.org');
    const tank = await createTank(ctx.deps.dataSource, k.user.id, { name: 'Old' });
    const res = await k.patch(`/api/tanks/${tank.id}`, { name: 'New', ph: 12 }).expect(400);
    expect(res.body.error.fields).toHaveProperty('ph');
    const res2 = await k.patch(`/api/tanks/${tank.id}`, { name: 'New', ownerId: k.user.id }).expect(400);
    expect(res2.body.error.fields).toHaveProperty('_');
    expect((await ctx.deps.dataSource.getRepository(Tank).findOneByOrFail({ id: tank.id })).name).toBe('Old');
  });

  it("answers 404 for another keeper's tank and leaves it alone", async () => {
    const k = await signedInKeeper(ctx, 'ray@example.org');
    const other = await createUser(ctx.deps.dataSource, { email: 'skate@example.org' });
    const foreign = await createTank(ctx.deps.dataSource, other.id, { name: 'Theirs' });
    await k.patch(`/api/tanks/${foreign.id}`, { name: 'Mine now' }).expect(404);
    await k.patch(`/api/tanks/not-a-uuid`, { name: 'x' }).expect(404);
    expect((await ctx.deps.dataSource.getRepository(Tank).findOneByOrFail({ id: foreign.id })).name).toBe('Theirs');
  });

  it('needs a session', async () => {
    const other = await createUser(ctx.deps.dataSource, { email: 'skate@example.org' });
    const tank = await createTank(ctx.deps.dataSource, other.id);
    await client(ctx.app).agent.patch(`/api/tanks/${tank.id}`).set(CSRF_HEADER, CSRF_HEADER_VALUE).send({ name: 'x' }).expect(401);
  });
});

describe('DELETE /api/tanks/:id', () => {
  it('deletes the own tank with its livestock and readings', async () => {
    const ds = ctx.deps.dataSource;
    const k = await signedInKeeper(ctx, 'ray@example.org');
    const tank = await createTank(ds, k.user.id);
    await createLivestock(ds, tank.id);
    await createReading(ds, tank.id);
    await k.del(`/api/tanks/${tank.id}`).expect(204);
    await k.get(`/api/tanks/${tank.id}`).expect(404);
    expect(Number((await ds.query('SELECT count(*) AS n FROM readings'))[0].n)).toBe(0);
  });

  it("answers 404 for another keeper's tank, 401 without a session", async () => {
    const ds = ctx.deps.dataSource;
    const k = await signedInKeeper(ctx, 'ray@example.org');
    const other = await createUser(ds, { email: 'skate@example.org' });
    const foreign = await createTank(ds, other.id);
    await k.del(`/api/tanks/${foreign.id}`).expect(404);
    await client(ctx.app).agent.delete(`/api/tanks/${foreign.id}`).set(CSRF_HEADER, CSRF_HEADER_VALUE).expect(401);
    expect(await tankCount()).toBe(1);
  });
});

describe('GET /api/tanks status', () => {
  const NOW = Date.now();
  const day = (n: number) => new Date(NOW + n * 86_400_000);
  const ymd = (d: Date) => d.toISOString().slice(0, 10);

  it('judges the latest test against the default limits and says when the next test is due', async () => {
    const ds = ctx.deps.dataSource;
    const k = await signedInKeeper(ctx, 'ray@example.org');
    const calm = await createTank(ds, k.user.id, { name: 'A calm', ph: 7.2, temperatureC: 25 });
    const spiking = await createTank(ds, k.user.id, { name: 'B spiking', ph: 7.2, temperatureC: 25 });
    const fresh = await createTank(ds, k.user.id, { name: 'C fresh' });
    await createReading(ds, calm.id, { takenAt: day(-1), tanMgN: 0.05, no2MgN: 0, ph: 7.2, temperatureC: 25 });
    // Nitrite 0.3 mg N/L is over the 0.1 culture-practice limit (Boyd); 0.06 is at least half of it.
    await createReading(ds, spiking.id, { takenAt: day(-3), tanMgN: 0.05, no2MgN: 0.3, ph: 8.2, temperatureC: 28 });
    await createPlan(ds, spiking.id, { status: 'active', startDate: ymd(day(-2)), events: [{ type: 'add-fish', day: 3, fish: [{ species: 'neon-tetra', count: 6 }] }] });

    const { tanks } = tankListWithStatusSchema.parse((await k.get('/api/tanks').expect(200)).body);
    const [a, b, c] = tanks;
    expect(a.status.overall).toBe('ok');
    expect(a.status.judged.map((j) => j.key)).toEqual(['tanMgN', 'no2MgN']);
    expect(a.status.judged[0].limit.value).toBeCloseTo(limitsAt({ ph: 7.2, temperatureC: 25 }).freeNh3AsTan.value, 10);
    expect(a.status.nextTest).toEqual({ date: ymd(day(6)), reason: 'routine' });

    expect(b.status.overall).toBe('over');
    expect(b.status.judged[1]).toMatchObject({ key: 'no2MgN', level: 'over', valueMgN: 0.3, limit: { value: 0.1, unit: 'mg N/L' } });
    // The test's own pH and temperature set the free-ammonia limit (Emerson et al. 1975).
    expect(b.status.judged[0].limit.value).toBeCloseTo(limitsAt({ ph: 8.2, temperatureC: 28 }).freeNh3AsTan.value, 10);
    // The plan's first check day after the last test (its start, two days ago) was missed: overdue.
    expect(b.status.nextTest).toEqual({ date: ymd(day(-2)), reason: 'plan-check-day', detail: 'before the plan starts, to know the starting water' });

    expect(c.status).toEqual({ overall: null, judged: [], nextTest: { date: ymd(day(0)), reason: 'no-test-yet' } });
  });
});
