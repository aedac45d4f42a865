import { describe, expect, it } from 'vitest';
import { lessonDetailSchema, lessonListSchema } from '../../shared/schemas/lesson.js';
import { CSRF_HEADER, CSRF_HEADER_VALUE } from '../../shared/api-error.js';
import { Lesson } from '../../server/entities/lesson.js';
import { DEMO_LESSONS } from '../../server/demo-lessons.js';
import { DEMO_PEOPLE } from '../../server/demo-people.js';
import { seedDemo } from '../../server/seed.js';
import { KIT_FIRST_STEP_MG_N, forecast } from '../../simulation/forecast/index.js';
import { peakOf } from '../../simulation/series-stats.js';
import { GOOD_PASSWORD, addMember, createClub, createPlan, createTank, createUser } from './helpers/factories.js';
import { client, useTestApp } from './helpers/test-app.js';

const ctx = useTestApp();

async function signedIn(email: string, password = GOOD_PASSWORD) {
  const c = client(ctx.app);
  await c.post('/api/auth/sign-in', { email, password }).expect(200);
  return c;
}

const steps = [{ title: 'Start', body: 'A settled tank.' }];
const scenario = DEMO_LESSONS[3].scenario;

async function clubs() {
  const ds = ctx.deps.dataSource;
  const a = await createClub(ds, { name: 'Alder Brook Aquarists' });
  const b = await createClub(ds, { name: 'Birch Lane Fish Room' });
  for (const [email, club, role] of [
    ['mentor-a@example.org', a.id, 'mentor'],
    ['member-a@example.org', a.id, 'member'],
    ['mentor-b@example.org', b.id, 'mentor'],
  ] as const) {
    const u = await createUser(ds, { email, displayName: email.split('@')[0] });
    await addMember(ds, club, u.id, role);
  }
  return { a, b };
}

describe('lessons', () => {
  it('a mentor builds a lesson from scratch; a member reads it; club B does not see it', async () => {
    const { a, b } = await clubs();
    const mentor = await signedIn('mentor-a@example.org');
    const res = await mentor.post(`/api/clubs/${a.id}/lessons`, { title: 'Rinsed sponge', kind: 'single', scenario, steps }).expect(201);
    const created = lessonDetailSchema.parse(res.body);
    expect(created).toMatchObject({ title: 'Rinsed sponge', clubName: 'Alder Brook Aquarists', canManage: true, stagedScenario: null });

    const member = await signedIn('member-a@example.org');
    const read = lessonDetailSchema.parse((await member.get(`/api/lessons/${created.id}`).expect(200)).body);
    expect(read.canManage).toBe(false);
    expect(read.scenario.events).toHaveLength(scenario.events!.length);
    expect(lessonListSchema.parse((await member.get('/api/lessons').expect(200)).body).lessons.map((l) => l.title)).toEqual(['Rinsed sponge']);

    // Members cannot build or delete lessons; another club's mentor cannot see or build.
    await member.post(`/api/clubs/${a.id}/lessons`, { title: 'Mine', scenario, steps }).expect(403);
    await member.agent.delete(`/api/lessons/${created.id}`).set(CSRF_HEADER, CSRF_HEADER_VALUE).expect(403);
    const other = await signedIn('mentor-b@example.org');
    await other.get(`/api/lessons/${created.id}`).expect(404);
    await other.post(`/api/clubs/${a.id}/lessons`, { title: 'Sneaky', scenario, steps }).expect(404);
    expect((await other.get('/api/lessons').expect(200)).body.lessons).toEqual([]);
    await other.post(`/api/clubs/${b.id}/lessons`, { title: 'Ours', scenario, steps }).expect(201);
    await client(ctx.app).get(`/api/lessons/${created.id}`).expect(401);

    await mentor.agent.delete(`/api/lessons/${created.id}`).set(CSRF_HEADER, CSRF_HEADER_VALUE).expect(204);
    expect(await ctx.deps.dataSource.getRepository(Lesson).countBy({ clubId: a.id })).toBe(0);
  });

  it('refuses a comparison without its staged scenario, and a scenario the engine refuses, naming the field', async () => {
    const { a } = await clubs();
    const mentor = await signedIn('mentor-a@example.org');
    const compare = await mentor.post(`/api/clubs/${a.id}/lessons`, { title: 'Fast or slow', kind: 'compare', scenario, steps }).expect(400);
    expect(compare.body.error.fields.stagedScenario).toMatch(/staged scenario/);
    const bad = { ...scenario, tank: { ...scenario.tank, ph: 15 } };
    const refused = await mentor.post(`/api/clubs/${a.id}/lessons`, { title: 'Bad water', scenario: bad, steps }).expect(400);
    expect(refused.body.error.fields['scenario.tank.ph']).toMatch(/pH must be between 4 and 10/);
    await mentor.post(`/api/clubs/${a.id}/lessons`, { title: 'No steps', scenario, steps: [] }).expect(400);
    expect(await ctx.deps.dataSource.getRepository(Lesson).count()).toBe(0);
  });

  it('a mentor starts a lesson from a plan shared with the club, but not from an unshared one', async () => {
    const { a } = await clubs();
    const ds = ctx.deps.dataSource;
    const memberId = (await ds.query(`SELECT id FROM users WHERE email = 'member-a@example.org'`))[0].id as string;
    const tank = await createTank(ds, memberId, { name: 'Study tank' });
    const plan = await createPlan(ds, tank.id, { name: 'Twelve rasboras', events: [{ type: 'add-fish', day: 2, fish: [{ species: 'harlequin-rasbora', count: 12 }] }] });
    const unshared = await createPlan(ds, tank.id, { name: 'Private' });
    const member = await signedIn('member-a@example.org');
    const share = (await member.post(`/api/clubs/${a.id}/shares`, { itemType: 'plan', itemId: plan.id }).expect(201)).body;
    const mentor = await signedIn('mentor-a@example.org');
    const made = lessonDetailSchema.parse((await mentor.post(`/api/clubs/${a.id}/lessons`, { title: 'From Mira’s plan', fromShareId: share.id, steps }).expect(201)).body);
    expect(made.scenario.tank.volumeL).toBe(120);
    expect(made.scenario.events).toEqual([{ type: 'add-fish', day: 2, fish: [{ species: 'harlequin-rasbora', count: 12 }] }]);
    expect(made.scenario.fish).toEqual([]);
    // An id that is not a share of this club (e.g. the plan id itself) is 404.
    await mentor.post(`/api/clubs/${a.id}/lessons`, { title: 'Private plan', fromShareId: unshared.id, steps }).expect(404);
  });

  it('the demo seed gives the club four starter lessons whose forecasts show a rise a test kit can read after the change', async () => {
    await seedDemo(ctx.deps.dataSource);
    const priya = DEMO_PEOPLE.find((p) => p.key === 'member')!;
    const c = await signedIn(priya.email, priya.password);
    const list = lessonListSchema.parse((await c.get('/api/lessons').expect(200)).body).lessons;
    expect(list).toHaveLength(4);
    expect(list.filter((l) => l.kind === 'compare')).toHaveLength(2);
    for (const summary of list) {
      const lesson = lessonDetailSchema.parse((await c.get(`/api/lessons/${summary.id}`).expect(200)).body);
      const f = forecast(lesson.scenario);
      const peak = peakOf(f.series.days, f.series.no2MgN);
      const tanPeak = peakOf(f.series.days, f.series.tanMgN);
      // Each starter lesson is about a rise after a change (invented scenarios; the value is
      // whatever the engine forecasts): nitrite above the 0.1 mg N/L practice limit of
      // limits.ts, or ammonia rising past a kit's first colour step from a clean start.
      const kitShows = tanPeak.value >= KIT_FIRST_STEP_MG_N.tan && f.series.tanMgN[0] < KIT_FIRST_STEP_MG_N.tan;
      expect(peak.value > 0.1 || kitShows, lesson.title).toBe(true);
      if (lesson.stagedScenario) {
        const staged = peakOf(forecast(lesson.stagedScenario).series.days, forecast(lesson.stagedScenario).series.no2MgN);
        expect(staged.value).toBeLessThan(peak.value);
      }
    }
  });
});
