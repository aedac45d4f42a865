import { describe, expect, it } from 'vitest';
import { planDetailSchema } from '../../shared/schemas/plan.js';
import { Plan } from '../../server/entities/plan.js';
import { FishEventGroups1796330000000, eventToGroups, eventToSingles } from '../../server/migrations/1796330000000-fish-event-groups.js';
import { CSRF_HEADER, CSRF_HEADER_VALUE } from '../../shared/api-error.js';
import { GOOD_PASSWORD, createPlan, createTank, createUser } from './helpers/factories.js';
import { client, useTestApp } from './helpers/test-app.js';

/** Several kinds of fish in one event (issue 15): over the API, and plans stored before it. */
const ctx = useTestApp();

async function keeper() {
  const user = await createUser(ctx.deps.dataSource, { email: 'mira@example.org' });
  const c = client(ctx.app);
  await c.post('/api/auth/sign-in', { email: 'mira@example.org', password: GOOD_PASSWORD }).expect(200);
  return { user, c };
}

const twoKinds = { type: 'add-fish', day: 0, fish: [{ species: 'neon-tetra', count: 10 }, { species: 'bronze-corydoras', count: 6 }] };
// The shapes plans were stored in before an event could carry several groups.
const OLD_EVENTS = [
  { type: 'add-fish', day: 0, fish: { species: 'neon-tetra', count: 10, lengthCm: 3 } },
  { type: 'water-change', day: 4, percent: 25 },
  { type: 'remove-fish', day: 9, species: 'neon-tetra', count: 2 },
  { type: 'move-fish', day: 12, direction: 'in', otherTank: 'Quarantine', fish: { name: 'Big red', count: 1, lengthCm: 9 } },
];

describe('fish events with several groups', () => {
  it('saves an add event with two species and forecasts it', async () => {
    const { user, c } = await keeper();
    const tank = await createTank(ctx.deps.dataSource, user.id, { volumeL: 120 });
    const res = await c.post(`/api/tanks/${tank.id}/plans`, { name: 'Neons and corydoras', startDate: '2026-04-01', events: [twoKinds] }).expect(201);
    const plan = planDetailSchema.parse(res.body);
    expect(plan.events[0]).toEqual(twoKinds);
    expect(plan.checkDays[1]!.reasons).toContain('16 fish added on day 0');
    await c.post(`/api/plans/${plan.id}/forecast`, {}).expect(200);
  });

  it("refuses a custom fish without its size with 400 naming that group's length", async () => {
    const { user, c } = await keeper();
    const tank = await createTank(ctx.deps.dataSource, user.id);
    const bad = { ...twoKinds, fish: [twoKinds.fish[0], { name: 'Big red', count: 1 }] };
    const res = await c.post(`/api/tanks/${tank.id}/plans`, { name: 'Bad', startDate: '2026-04-01', events: [bad] }).expect(400);
    expect(res.body.error.fields).toEqual({ 'events.0.fish.1.lengthCm': 'A fish that is not in the species list needs its length (or its weight).' });
    expect(await ctx.deps.dataSource.getRepository(Plan).count()).toBe(0);
  });

  it('refuses fish that could not fit in the water, naming the event, and warns only on the screen below that', async () => {
    const { user, c } = await keeper();
    const tank = await createTank(ctx.deps.dataSource, user.id, { volumeL: 120 });
    // 10,000 neon tetras (about 0.27 g each) in 120 L: about 22 g a litre, crowded but physically possible: saved.
    const crowded = { type: 'add-fish', day: 0, fish: [{ species: 'neon-tetra', count: 10000 }] };
    await c.post(`/api/tanks/${tank.id}/plans`, { name: 'Crowded', startDate: '2026-04-01', events: [crowded] }).expect(201);
    // 100,000 oscars cannot be in 120 L of water at all.
    const absurd = { type: 'add-fish', day: 0, fish: [{ species: 'oscar', count: 100000 }] };
    const res = await c.post(`/api/tanks/${tank.id}/plans`, { name: 'Absurd', startDate: '2026-04-01', events: [absurd] }).expect(400);
    expect(res.body.error.fields['events.0.fish']).toMatch(/no tank can hold that/);
  });

  it('migrates plans stored in the single-group shape to lists, and back down to one event per group', async () => {
    const { user, c } = await keeper();
    const ds = ctx.deps.dataSource;
    const tank = await createTank(ds, user.id, { volumeL: 120 });
    const old = await createPlan(ds, tank.id, { events: OLD_EVENTS as never });
    const multi = await createPlan(ds, tank.id, { events: [twoKinds] as never });
    const q = ds.createQueryRunner();
    try {
      const migration = new FishEventGroups1796330000000();
      await migration.up(q);
      const up = await ds.getRepository(Plan).findOneByOrFail({ id: old.id });
      expect(up.events).toEqual(OLD_EVENTS.map(eventToGroups));
      expect(up.events[2]).toEqual({ type: 'remove-fish', day: 9, fish: [{ species: 'neon-tetra', count: 2 }] });
      // The migrated plan reads and forecasts as before.
      const read = await c.agent.get(`/api/plans/${old.id}`).set(CSRF_HEADER, CSRF_HEADER_VALUE).expect(200);
      expect(planDetailSchema.parse(read.body).events).toEqual(up.events);
      await c.post(`/api/plans/${old.id}/forecast`, {}).expect(200);

      await migration.down(q);
      expect((await ds.getRepository(Plan).findOneByOrFail({ id: old.id })).events).toEqual(OLD_EVENTS);
      expect((await ds.getRepository(Plan).findOneByOrFail({ id: multi.id })).events).toEqual(eventToSingles(twoKinds));
      await migration.up(q);
      expect((await ds.getRepository(Plan).findOneByOrFail({ id: multi.id })).events).toEqual([
        { ...twoKinds, fish: [twoKinds.fish[0]] },
        { ...twoKinds, fish: [twoKinds.fish[1]] },
      ]);
    } finally {
      await q.release();
    }
  });
});
