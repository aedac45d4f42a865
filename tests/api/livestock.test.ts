import { describe, expect, it } from 'vitest';
import { CSRF_HEADER, CSRF_HEADER_VALUE } from '../../shared/api-error.js';
import { livestockSchema } from '../../shared/schemas/tank.js';
import { Livestock } from '../../server/entities/livestock.js';
import { createLivestock, createTank, createUser } from './helpers/factories.js';
import { signedInKeeper } from './helpers/keeper-client.js';
import { client, useTestApp } from './helpers/test-app.js';

const ctx = useTestApp();
const rows = () => ctx.deps.dataSource.getRepository(Livestock).find();

async function keeperWithTank() {
  const k = await signedInKeeper(ctx, 'ray@example.org');
  const tank = await createTank(ctx.deps.dataSource, k.user.id);
  return { k, tank, url: `/api/tanks/${tank.id}/livestock` };
}

describe('POST /api/tanks/:id/livestock', () => {
  it('adds a catalogue species (length optional) and a custom fish (length required)', async () => {
    const { k, url } = await keeperWithTank();
    const a = livestockSchema.parse((await k.post(url, { speciesId: 'neon-tetra', count: 12 }).expect(201)).body);
    expect(a).toMatchObject({ speciesId: 'neon-tetra', customName: null, count: 12, lengthCm: null });
    const b = livestockSchema.parse((await k.post(url, { customName: 'Wild-type guppy', count: 3, lengthCm: 4 }).expect(201)).body);
    expect(b).toMatchObject({ speciesId: null, customName: 'Wild-type guppy', count: 3, lengthCm: 4 });
    expect(await rows()).toHaveLength(2);
  });

  it.each([
    [{ count: 3 }, 'speciesId'],
    [{ speciesId: 'neon-tetra' }, 'count'],
    [{ speciesId: 'neon-tetra', count: 0 }, 'count'],
    [{ speciesId: 'neon-tetra', count: 2.5 }, 'count'],
    [{ speciesId: 'neon-tetra', count: 3, lengthCm: 500 }, 'lengthCm'],
    [{ customName: 'Mystery fish', count: 3 }, 'lengthCm'],
    [{ customName: '', count: 3, lengthCm: 2 }, 'customName'],
    [{ speciesId: 'neon-tetra', customName: 'Both', count: 3 }, 'customName'],
    [{ speciesId: 'unicorn-fish', count: 3 }, 'speciesId'],
    [{ speciesId: 'neon-tetra', count: 3, tankId: '00000000-0000-4000-8000-000000000000' }, '_'],
  ])('refuses %j with 400 naming %s', async (body, field) => {
    const { k, url } = await keeperWithTank();
    const res = await k.post(url, body).expect(400);
    expect(Object.keys(res.body.error.fields)).toContain(field);
    expect(await rows()).toHaveLength(0);
  });

  it("answers 404 for another keeper's tank and 401 without a session", async () => {
    const { k } = await keeperWithTank();
    const other = await createUser(ctx.deps.dataSource, { email: 'skate@example.org' });
    const foreign = await createTank(ctx.deps.dataSource, other.id);
    await k.post(`/api/tanks/${foreign.id}/livestock`, { speciesId: 'neon-tetra', count: 3 }).expect(404);
    await client(ctx.app).post(`/api/tanks/${foreign.id}/livestock`, { speciesId: 'neon-tetra', count: 3 }).expect(401);
    expect(await rows()).toHaveLength(0);
  });
});

describe('PATCH and DELETE /api/tanks/:id/livestock/:livestockId', () => {
  it('changes the count and the length, then removes the row', async () => {
    const { k, tank, url } = await keeperWithTank();
    const item = await createLivestock(ctx.deps.dataSource, tank.id, { count: 10, lengthCm: 3 });
    const res = await k.patch(`${url}/${item.id}`, { count: 7, lengthCm: null }).expect(200);
    expect(res.body).toMatchObject({ id: item.id, count: 7, lengthCm: null });
    await k.del(`${url}/${item.id}`).expect(204);
    expect(await rows()).toHaveLength(0);
    await k.del(`${url}/${item.id}`).expect(404);
  });

  it('refuses a bad count with 400', async () => {
    const { k, tank, url } = await keeperWithTank();
    const item = await createLivestock(ctx.deps.dataSource, tank.id, { count: 10 });
    expect((await k.patch(`${url}/${item.id}`, { count: -2 }).expect(400)).body.error.fields).toHaveProperty('count');
    expect((await k.patch(`${url}/${item.id}`, { speciesId: 'guppy' }).expect(400)).body.error.fields).toHaveProperty('_');
    expect((await rows())[0].count).toBe(10);
  });

  it("answers 404 for another keeper's animals, even through the own tank's path", async () => {
    const ds = ctx.deps.dataSource;
    const { k, url } = await keeperWithTank();
    const other = await createUser(ds, { email: 'skate@example.org' });
    const foreignTank = await createTank(ds, other.id);
    const theirs = await createLivestock(ds, foreignTank.id, { count: 5 });
    await k.patch(`${url}/${theirs.id}`, { count: 1 }).expect(404);
    await k.del(`${url}/${theirs.id}`).expect(404);
    await k.patch(`/api/tanks/${foreignTank.id}/livestock/${theirs.id}`, { count: 1 }).expect(404);
    await k.del(`${url}/not-a-uuid`).expect(404);
    await client(ctx.app).agent.delete(`${url}/${theirs.id}`).set(CSRF_HEADER, CSRF_HEADER_VALUE).expect(401);
    expect((await ds.getRepository(Livestock).findOneByOrFail({ id: theirs.id })).count).toBe(5);
  });
});
