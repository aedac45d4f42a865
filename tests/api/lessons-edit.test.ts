import { describe, expect, it } from 'vitest';
import { CSRF_HEADER, CSRF_HEADER_VALUE } from '../../shared/api-error.js';
import { lessonDetailSchema } from '../../shared/schemas/lesson.js';
import { Lesson } from '../../server/entities/lesson.js';
import { DEMO_LESSONS } from '../../server/demo-lessons.js';
import { GOOD_PASSWORD, addMember, createClub, createUser } from './helpers/factories.js';
import { client, useTestApp } from './helpers/test-app.js';

const ctx = useTestApp();

async function signedIn(email: string) {
  const c = client(ctx.app);
  await c.post('/api/auth/sign-in', { email, password: GOOD_PASSWORD }).expect(200);
  return {
    get: c.get,
    post: c.post,
    patch: (url: string, body: unknown) => c.agent.patch(url).set(CSRF_HEADER, CSRF_HEADER_VALUE).send(body as object),
  };
}

const scenario = DEMO_LESSONS[3].scenario;
const steps = [
  { title: 'Start', body: 'A settled tank.' },
  { title: 'The rinse', body: 'The sponge goes under the tap.' },
];

/** Club A with an author (mentor), a second mentor, a member and the organizer; club B's mentor outside. */
async function clubWithLesson() {
  const ds = ctx.deps.dataSource;
  const a = await createClub(ds, { name: 'Alder Brook Aquarists' });
  const b = await createClub(ds, { name: 'Birch Lane Fish Room' });
  for (const [email, club, role] of [
    ['author@example.org', a.id, 'mentor'],
    ['other-mentor@example.org', a.id, 'mentor'],
    ['member@example.org', a.id, 'member'],
    ['organizer@example.org', a.id, 'organizer'],
    ['outsider@example.org', b.id, 'mentor'],
  ] as const) {
    const u = await createUser(ds, { email, displayName: email.split('@')[0] });
    await addMember(ds, club, u.id, role);
  }
  const author = await signedIn('author@example.org');
  const made = lessonDetailSchema.parse((await author.post(`/api/clubs/${a.id}/lessons`, { title: 'Rinsed sponge', summary: 'A filter rinse.', scenario, steps }).expect(201)).body);
  return { author, lessonId: made.id, url: `/api/lessons/${made.id}` };
}

/** The stored row's words and scenario, to prove what changed and what did not. */
async function row(id: string) {
  const l = await ctx.deps.dataSource.getRepository(Lesson).findOneByOrFail({ id });
  return { title: l.title, summary: l.summary, steps: l.steps, scenario: l.scenario, stagedScenario: l.stagedScenario, kind: l.kind };
}

describe('PATCH /api/lessons/:lessonId (the words of a lesson)', () => {
  it('the author rewords the title and steps; GET shows them; summary and scenario stay as they were', async () => {
    const { author, lessonId, url } = await clubWithLesson();
    const before = await row(lessonId);
    const newSteps = [
      { title: 'Before the rinse', body: 'A settled tank with a ripe sponge.' },
      { title: 'Tap water', body: 'Chlorine kills most of the nitrifiers in the sponge.' },
      { title: 'Your guess', body: 'Where does nitrite peak?' },
    ];
    const res = await author.patch(url, { title: '  Rinsed in tap water  ', steps: newSteps }).expect(200);
    const answered = lessonDetailSchema.parse(res.body);
    expect(answered).toMatchObject({ id: lessonId, title: 'Rinsed in tap water', summary: 'A filter rinse.', steps: newSteps, canManage: true, authorName: 'author' });

    const read = lessonDetailSchema.parse((await author.get(url).expect(200)).body);
    expect(read).toEqual(answered);
    const after = await row(lessonId);
    expect(after.scenario).toEqual(before.scenario);
    expect(after.stagedScenario).toEqual(before.stagedScenario);
    expect(after.kind).toBe(before.kind);

    // The summary alone, and emptied (it is optional).
    await author.patch(url, { summary: '' }).expect(200);
    expect((await row(lessonId)).summary).toBe('');
    expect((await row(lessonId)).title).toBe('Rinsed in tap water');
  });

  it('an organizer of the club may edit; the answer keeps the author’s name', async () => {
    const { lessonId, url } = await clubWithLesson();
    const organizer = await signedIn('organizer@example.org');
    const res = lessonDetailSchema.parse((await organizer.patch(url, { title: 'Checked by the organizer' }).expect(200)).body);
    expect(res).toMatchObject({ title: 'Checked by the organizer', authorName: 'author', canManage: true });
    expect((await row(lessonId)).steps).toEqual(steps);
  });

  it('another mentor of the club gets 403, a member 403, an outsider 404, nobody signed in 401; the row stays', async () => {
    const { lessonId, url } = await clubWithLesson();
    const before = await row(lessonId);
    const body = { title: 'Not yours', steps: [{ title: 'X', body: 'Y' }] };
    const other = await signedIn('other-mentor@example.org');
    expect((await other.patch(url, body).expect(403)).body.error.code).toBe('forbidden');
    await (await signedIn('member@example.org')).patch(url, body).expect(403);
    expect((await (await signedIn('outsider@example.org')).patch(url, body).expect(404)).body.error.code).toBe('not_found');
    await client(ctx.app).agent.patch(url).set(CSRF_HEADER, CSRF_HEADER_VALUE).send(body).expect(401);
    // A lesson id that does not exist at all looks the same as another club's.
    await other.patch('/api/lessons/00000000-0000-4000-8000-000000000000', body).expect(404);
    expect(await row(lessonId)).toEqual(before);
  });

  it('refuses empty steps, 13 steps, a 2-character title, an empty step title, an unknown field and an empty body, naming the field; nothing changes', async () => {
    const { author, lessonId, url } = await clubWithLesson();
    const before = await row(lessonId);
    const thirteen = Array.from({ length: 13 }, (_, i) => ({ title: `Step ${i + 1}`, body: 'Text.' }));
    const cases: [unknown, string, RegExp][] = [
      [{ steps: [] }, 'steps', /at least one step/i],
      [{ steps: thirteen }, 'steps', /at most 12 steps/i],
      [{ title: 'ab' }, 'title', /at least 3 characters/i],
      [{ title: '   ab   ', steps }, 'title', /at least 3 characters/i],
      [{ steps: [{ title: ' ', body: 'Text.' }] }, 'steps.0.title', /title/i],
      [{ steps: [steps[0], { title: 'Two', body: '' }] }, 'steps.1.body', /write the step/i],
      [{ title: 'Fine title', scenario }, '_', /scenario/],
      [{}, '_', /title, the summary or the steps/],
    ];
    for (const [body, field, message] of cases) {
      const res = await author.patch(url, body).expect(400);
      expect(res.body.error.code, JSON.stringify(body).slice(0, 80)).toBe('validation');
      const fields = res.body.error.fields as Record<string, string>;
      if (field === '_') expect(Object.entries(fields).map(([k, v]) => `${k} ${v}`).join(' '), JSON.stringify(body).slice(0, 80)).toMatch(message);
      else expect(fields[field], JSON.stringify(fields)).toMatch(message);
    }
    expect(await row(lessonId)).toEqual(before);
  });
});
