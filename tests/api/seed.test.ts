import { describe, expect, it } from 'vitest';
import { meSchema } from '../../shared/schemas/auth.js';
import { eventSchema } from '../../simulation/scenario.js';
import { tankDetailSchema, tankListSchema } from '../../shared/schemas/tank.js';
import { findSpecies } from '../../simulation/catalogue.js';
import { User } from '../../server/entities/user.js';
import { seedDemo } from '../../server/seed.js';
import { isCommonPassword } from '../../server/security/common-passwords.js';
import { createUser } from './helpers/factories.js';
import { client, useTestApp } from './helpers/test-app.js';

const ctx = useTestApp();

describe('demo seed', () => {
  it('creates the club, five people who can sign in, and the member’s tanks with tests and an active plan', async () => {
    const signIns = await seedDemo(ctx.deps.dataSource, new Date('2026-05-20T12:00:00Z'));
    expect(signIns).not.toBeNull();
    expect(signIns!.map((s) => s.role)).toEqual([
      'organizer, Quillwater Fishkeepers',
      'mentor, Quillwater Fishkeepers',
      'member, Quillwater Fishkeepers',
      'site admin',
      'keeper',
    ]);

    const sessions = new Map<string, ReturnType<typeof client>>();
    for (const s of signIns!) {
      expect(isCommonPassword(s.password, s.email)).toBe(false);
      const c = client(ctx.app);
      const me = meSchema.parse((await c.post('/api/auth/sign-in', { email: s.email, password: s.password }).expect(200)).body);
      expect(me.role).toBe(s.role === 'site admin' ? 'admin' : 'user');
      sessions.set(s.role, c);
    }

    const member = sessions.get('member, Quillwater Fishkeepers')!;
    const { tanks } = tankListSchema.parse((await member.get('/api/tanks').expect(200)).body);
    expect(tanks.map((t) => t.name)).toEqual(['Living-room community', 'Quarantine', 'Shrimp cube']);
    const community = tanks[0];
    expect(community).toMatchObject({ fishCount: 19, speciesCount: 3, activePlan: { name: 'Harlequin rasboras in three batches' } });
    expect(community.latestReading).not.toBeNull();
    // Shrimp and snails are not fish (the home card once said "27 fish" for this tank).
    expect(tanks[2]).toMatchObject({ name: 'Shrimp cube', fishCount: 0, invertebrateCount: 27, speciesCount: 2 });

    const detail = tankDetailSchema.parse((await member.get(`/api/tanks/${community.id}`).expect(200)).body);
    expect(detail.readings.length).toBeGreaterThanOrEqual(7); // two a week for four weeks
    for (const r of detail.readings) {
      expect(r.basis).toBe('ion');
      // Stored as N: nitrate-N is 14.007/62.004 of the ion's mass (IUPAC atomic weights), so
      // a kit reading of 10–25 mg NO3/L is 2.3–5.7 mg N/L.
      expect(r.no3MgN).toBeGreaterThan(2.2);
      expect(r.no3MgN).toBeLessThan(5.7);
    }
    const plan = detail.plans.find((p) => p.status === 'active')!;
    expect(plan).toMatchObject({ startDate: '2026-05-18', startedAt: '2026-05-18T08:00:00.000Z', finishedAt: null });
    for (const e of plan.events) expect(eventSchema.safeParse(e).success).toBe(true);
    for (const l of detail.livestock) expect(findSpecies(l.speciesId!)).toBeDefined();

    // The keeper outside the club has no tanks and no clubs.
    const keeper = sessions.get('keeper')!;
    expect((await keeper.get('/api/tanks').expect(200)).body).toEqual({ tanks: [] });
    expect(meSchema.parse((await keeper.get('/api/me').expect(200)).body).clubs).toEqual([]);
  });

  it('does nothing when any user exists', async () => {
    await createUser(ctx.deps.dataSource);
    expect(await seedDemo(ctx.deps.dataSource)).toBeNull();
    expect(await ctx.deps.dataSource.getRepository(User).count()).toBe(1);
  });
});

describe('validDemoSignIns', () => {
  it('lists the demo sign-ins whose passwords still work', async () => {
    const { validDemoSignIns } = await import('../../server/seed.js');
    const seeded = await seedDemo(ctx.deps.dataSource);
    await ctx.deps.dataSource.getRepository(User).update({ email: seeded![0].email }, { passwordHash: '$2b$12$invalidinvalidinvalidinvalidinvalidinvalidinvalidinval' });
    const valid = await validDemoSignIns(ctx.deps.dataSource);
    expect(valid.map((s) => s.email)).toEqual(seeded!.slice(1).map((s) => s.email));
  });
});
