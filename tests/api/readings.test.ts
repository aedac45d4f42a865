import { describe, expect, it } from 'vitest';
import { CSRF_HEADER, CSRF_HEADER_VALUE } from '../../shared/api-error.js';
import { readingPageSchema } from '../../shared/schemas/reading.js';
import { readingSchema } from '../../shared/schemas/tank.js';
import { MOLAR_MASS } from '../../simulation/units.js';
import { Reading } from '../../server/entities/reading.js';
import { createReading, createTank, createUser } from './helpers/factories.js';
import { signedInKeeper } from './helpers/keeper-client.js';
import { client, useTestApp } from './helpers/test-app.js';

const ctx = useTestApp();
const count = () => ctx.deps.dataSource.getRepository(Reading).count();

async function keeperWithTank() {
  const k = await signedInKeeper(ctx, 'ray@example.org');
  const tank = await createTank(ctx.deps.dataSource, k.user.id);
  return { k, tank, url: `/api/tanks/${tank.id}/readings` };
}

describe('POST /api/tanks/:id/readings', () => {
  it('stores a test read "as N" as it is', async () => {
    const { k, url } = await keeperWithTank();
    const res = await k.post(url, { takenAt: '2026-03-01T08:30:00+01:00', basis: 'N', tan: 0.25, no2: 0, no3: 10, ph: 7.4, temperatureC: 24.5, khDkh: 4, note: 'before feeding' }).expect(201);
    expect(readingSchema.parse(res.body)).toMatchObject({ takenAt: '2026-03-01T07:30:00.000Z', basis: 'N', tanMgN: 0.25, no2MgN: 0, no3MgN: 10, ph: 7.4, note: 'before feeding' });
  });

  it('converts a test read "as the ion" to mg N/L with the IUPAC molar masses (MODEL.md §4.6)', async () => {
    const { k, url } = await keeperWithTank();
    const res = await k.post(url, { takenAt: '2026-03-01T08:00:00Z', basis: 'ion', tan: 1, no2: 1, no3: 50 }).expect(201);
    // NH4+ → N 0.7765, NO2− → N 0.3045, NO3− → N 0.2259 (MODEL.md §4.6).
    expect(res.body.tanMgN).toBeCloseTo(0.7765, 4);
    expect(res.body.no2MgN).toBeCloseTo(0.3045, 4);
    expect(res.body.no3MgN).toBeCloseTo(50 * 0.2259, 3);
    expect(res.body.no3MgN).toBeCloseTo((50 * MOLAR_MASS.N) / MOLAR_MASS.NO3, 12);
    expect(res.body.basis).toBe('ion');
  });

  it.each([
    [{ basis: 'N', tan: 0.5 }, 'takenAt'],
    [{ takenAt: 'yesterday', tan: 0.5 }, 'takenAt'],
    [{ takenAt: '2026-03-01T08:00:00', tan: 0.5 }, 'takenAt'],
    [{ takenAt: '2999-01-01T00:00:00Z', tan: 0.5 }, 'takenAt'],
    [{ takenAt: '2026-03-01T08:00:00Z', basis: 'NH3', tan: 0.5 }, 'basis'],
    [{ takenAt: '2026-03-01T08:00:00Z', tan: -0.1 }, 'tan'],
    [{ takenAt: '2026-03-01T08:00:00Z', no2: '0.5' }, 'no2'],
    [{ takenAt: '2026-03-01T08:00:00Z', no3: 5000 }, 'no3'],
    [{ takenAt: '2026-03-01T08:00:00Z', ph: 15 }, 'ph'],
    [{ takenAt: '2026-03-01T08:00:00Z', temperatureC: 77 }, 'temperatureC'],
    [{ takenAt: '2026-03-01T08:00:00Z', khDkh: -1 }, 'khDkh'],
    [{ takenAt: '2026-03-01T08:00:00Z', tan: 0.1, note: 'x'.repeat(201) }, 'note'],
    [{ takenAt: '2026-03-01T08:00:00Z' }, 'tan'],
    [{ takenAt: '2026-03-01T08:00:00Z', tan: 0.1, tankId: '00000000-0000-4000-8000-000000000000' }, '_'],
  ])('refuses %j with 400 naming %s', async (body, field) => {
    const { k, url } = await keeperWithTank();
    const res = await k.post(url, body).expect(400);
    expect(Object.keys(res.body.error.fields)).toContain(field);
    expect(await count()).toBe(0);
  });

  it('refuses a second test at the same moment with 409', async () => {
    const { k, url } = await keeperWithTank();
    await k.post(url, { takenAt: '2026-03-01T08:00:00Z', tan: 0.1 }).expect(201);
    const res = await k.post(url, { takenAt: '2026-03-01T09:00:00+01:00', tan: 0.2 }).expect(409);
    expect(res.body.error.fields).toHaveProperty('takenAt');
    expect(await count()).toBe(1);
  });

  it("answers 404 for another keeper's tank and 401 without a session", async () => {
    const { k } = await keeperWithTank();
    const other = await createUser(ctx.deps.dataSource, { email: 'skate@example.org' });
    const foreign = await createTank(ctx.deps.dataSource, other.id);
    await k.post(`/api/tanks/${foreign.id}/readings`, { takenAt: '2026-03-01T08:00:00Z', tan: 0.1 }).expect(404);
    await client(ctx.app).post(`/api/tanks/${foreign.id}/readings`, { takenAt: '2026-03-01T08:00:00Z', tan: 0.1 }).expect(401);
    expect(await count()).toBe(0);
  });
});

describe('GET /api/tanks/:id/readings', () => {
  it('pages the tests newest first', async () => {
    const { k, tank, url } = await keeperWithTank();
    const base = Date.parse('2026-01-01T08:00:00Z');
    for (let d = 0; d < 7; d++) await createReading(ctx.deps.dataSource, tank.id, { takenAt: new Date(base + d * 86_400_000), tanMgN: d / 10 });
    const p1 = readingPageSchema.parse((await k.get(`${url}?pageSize=3`).expect(200)).body);
    expect(p1).toMatchObject({ page: 1, pageSize: 3, total: 7 });
    expect(p1.readings.map((r) => r.tanMgN)).toEqual([0.6, 0.5, 0.4]);
    const p3 = readingPageSchema.parse((await k.get(`${url}?page=3&pageSize=3`).expect(200)).body);
    expect(p3.readings.map((r) => r.tanMgN)).toEqual([0]);
  });

  it.each([
    ['page=0', 'page'],
    ['pageSize=500', 'pageSize'],
    ['pageSize=abc', 'pageSize'],
    ['sort=asc', '_'],
  ])('refuses ?%s with 400 naming %s', async (query, field) => {
    const { k, url } = await keeperWithTank();
    expect(Object.keys((await k.get(`${url}?${query}`).expect(400)).body.error.fields)).toContain(field);
  });

  it("answers 404 for another keeper's tank", async () => {
    const { k } = await keeperWithTank();
    const other = await createUser(ctx.deps.dataSource, { email: 'skate@example.org' });
    const foreign = await createTank(ctx.deps.dataSource, other.id);
    await createReading(ctx.deps.dataSource, foreign.id);
    await k.get(`/api/tanks/${foreign.id}/readings`).expect(404);
    await client(ctx.app).get(`/api/tanks/${foreign.id}/readings`).expect(401);
  });
});

describe('DELETE /api/tanks/:id/readings/:readingId', () => {
  it('deletes the own test; another tank\'s test id through the own tank answers 404', async () => {
    const ds = ctx.deps.dataSource;
    const { k, tank, url } = await keeperWithTank();
    const mine = await createReading(ds, tank.id);
    const other = await createUser(ds, { email: 'skate@example.org' });
    const foreignTank = await createTank(ds, other.id);
    const theirs = await createReading(ds, foreignTank.id);
    await k.del(`${url}/${theirs.id}`).expect(404);
    await k.del(`/api/tanks/${foreignTank.id}/readings/${theirs.id}`).expect(404);
    await k.del(`${url}/not-a-uuid`).expect(404);
    await client(ctx.app).agent.delete(`${url}/${mine.id}`).set(CSRF_HEADER, CSRF_HEADER_VALUE).expect(401);
    await k.del(`${url}/${mine.id}`).expect(204);
    expect(await count()).toBe(1);
  });
});
