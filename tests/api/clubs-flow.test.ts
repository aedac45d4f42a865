import { describe, expect, it } from 'vitest';
import { clubDetailSchema, clubListSchema, clubShareListSchema, commentSchema, sharedItemDetailSchema } from '../../shared/schemas/club.js';
import { CSRF_HEADER, CSRF_HEADER_VALUE } from '../../shared/api-error.js';
import { ClubMembership } from '../../server/entities/club-membership.js';
import { ClubShare } from '../../server/entities/club-share.js';
import { GOOD_PASSWORD, addMember, createClub, createPlan, createTank, createUser } from './helpers/factories.js';
import { client, useTestApp } from './helpers/test-app.js';

const ctx = useTestApp();

type Client = ReturnType<typeof client>;
const del = (c: Client, url: string) => c.agent.delete(url).set(CSRF_HEADER, CSRF_HEADER_VALUE);
const put = (c: Client, url: string, body: object) => c.agent.put(url).set(CSRF_HEADER, CSRF_HEADER_VALUE).send(body);

async function signedIn(email: string) {
  const c = client(ctx.app);
  await c.post('/api/auth/sign-in', { email, password: GOOD_PASSWORD }).expect(200);
  return c;
}

/** Club A with an organizer, a mentor and two members; club B with its own organizer and mentor. */
async function twoClubs() {
  const ds = ctx.deps.dataSource;
  const a = await createClub(ds, { name: 'Alder Brook Aquarists' });
  const b = await createClub(ds, { name: 'Birch Lane Fish Room' });
  const people: Record<string, string> = {};
  for (const [key, club, role] of [
    ['orgA', a.id, 'organizer'],
    ['mentorA', a.id, 'mentor'],
    ['memberA', a.id, 'member'],
    ['member2A', a.id, 'member'],
    ['orgB', b.id, 'organizer'],
    ['mentorB', b.id, 'mentor'],
  ] as const) {
    const user = await createUser(ds, { email: `${key.toLowerCase()}@example.org`, displayName: key });
    await addMember(ds, club, user.id, role);
    people[key] = user.id;
  }
  const tank = await createTank(ds, people.memberA, { name: 'Kitchen 60 L', volumeL: 60 });
  const plan = await createPlan(ds, tank.id, { name: 'Six more tetras', status: 'active' });
  const hiddenPlan = await createPlan(ds, tank.id, { name: 'Secret rehoming' });
  const c = async (key: string) => signedIn(`${key.toLowerCase()}@example.org`);
  return { a, b, people, tank, plan, hiddenPlan, c };
}

describe('creating clubs and managing roles', () => {
  it('a keeper creates a club, becomes its organizer, and sees it in the list', async () => {
    await createUser(ctx.deps.dataSource, { email: 'kim@example.org', displayName: 'Kim' });
    const kim = await signedIn('kim@example.org');
    const created = clubDetailSchema.parse((await kim.post('/api/clubs', { name: '  Cedar Reef Society ' }).expect(201)).body);
    expect(created).toMatchObject({ name: 'Cedar Reef Society', myRole: 'organizer' });
    expect(clubListSchema.parse((await kim.get('/api/clubs').expect(200)).body).clubs).toEqual([
      { id: created.id, name: 'Cedar Reef Society', myRole: 'organizer', memberCount: 1 },
    ]);
    expect((await kim.post('/api/clubs', { name: 'x' }).expect(400)).body.error.fields.name).toBeTruthy();
    await client(ctx.app).post('/api/clubs', { name: 'Nobody' }).expect(401);
  });

  it('the organizer grants and removes the mentor role; a member or mentor cannot; club B cannot', async () => {
    const { a, people, c } = await twoClubs();
    const url = `/api/clubs/${a.id}/members/${people.memberA}`;
    await put(await c('memberA'), `/api/clubs/${a.id}/members/${people.member2A}`, { role: 'mentor' }).expect(403);
    await put(await c('mentorA'), url, { role: 'mentor' }).expect(403);
    await put(await c('orgB'), url, { role: 'mentor' }).expect(404);
    const roleOf = async (userId: string) => (await ctx.deps.dataSource.getRepository(ClubMembership).findOneByOrFail({ clubId: a.id, userId })).role;
    expect(await roleOf(people.memberA)).toBe('member');

    const org = await c('orgA');
    const granted = clubDetailSchema.parse((await put(org, url, { role: 'mentor' }).expect(200)).body);
    expect(granted.members.find((m) => m.userId === people.memberA)?.role).toBe('mentor');
    await put(org, url, { role: 'member' }).expect(200);
    expect(await roleOf(people.memberA)).toBe('member');
    // Mass assignment: "organizer" is not a role this route grants.
    await put(org, url, { role: 'organizer' }).expect(400);
    await put(org, `/api/clubs/${a.id}/members/${people.orgA}`, { role: 'member' }).expect(409);
  });

  it('the organizer removes a member; members leave; the last organizer cannot leave', async () => {
    const { a, people, c } = await twoClubs();
    await del(await c('mentorA'), `/api/clubs/${a.id}/members/${people.member2A}`).expect(403);
    const org = await c('orgA');
    await del(org, `/api/clubs/${a.id}/members/${people.member2A}`).expect(204);
    await (await c('member2A')).get(`/api/clubs/${a.id}`).expect(404);

    await (await c('memberA')).post(`/api/clubs/${a.id}/leave`).expect(204);
    const last = await org.post(`/api/clubs/${a.id}/leave`).expect(409);
    expect(last.body.error.message).toMatch(/needs an organizer/);
    expect(clubDetailSchema.parse((await org.get(`/api/clubs/${a.id}`).expect(200)).body).members.map((m) => m.displayName)).toEqual(['orgA', 'mentorA']);
  });
});

describe('sharing tanks and plans with a club', () => {
  it('a member shares a plan; mentor and organizer see it and comment; the member reads the comments', async () => {
    const { a, plan, hiddenPlan, c } = await twoClubs();
    const member = await c('memberA');
    const shared = await member.post(`/api/clubs/${a.id}/shares`, { itemType: 'plan', itemId: plan.id }).expect(201);
    expect(shared.body).toMatchObject({ itemType: 'plan', title: 'Six more tetras', ownerName: 'memberA', mine: true });
    await member.post(`/api/clubs/${a.id}/shares`, { itemType: 'plan', itemId: plan.id }).expect(409);

    for (const who of ['mentorA', 'orgA']) {
      const viewer = await c(who);
      const list = clubShareListSchema.parse((await viewer.get(`/api/clubs/${a.id}/shares`).expect(200)).body);
      expect(list.shares.map((s) => s.title)).toEqual(['Six more tetras']);
      const detail = sharedItemDetailSchema.parse((await viewer.get(`/api/clubs/${a.id}/shares/${shared.body.id}`).expect(200)).body);
      expect(detail.plan?.name).toBe('Six more tetras');
      // The tank's other, unshared plan is not in the answer.
      expect(detail.tank.plans.map((p) => p.name)).toEqual(['Six more tetras']);
      expect(JSON.stringify(detail)).not.toContain(hiddenPlan.id);
      expect(JSON.stringify(detail)).not.toContain('@example.org');
      expect(detail.scenario?.events).toHaveLength(1);
    }
    const mentor = await c('mentorA');
    const comment = commentSchema.parse(
      (await mentor.post(`/api/clubs/${a.id}/shares/${shared.body.id}/comments`, { body: 'Test nitrite on days 2 and 3.' }).expect(201)).body,
    );
    expect(comment).toMatchObject({ authorName: 'mentorA', authorRole: 'mentor' });
    // The member cannot comment, but reads the mentor's comment on their plan.
    await member.post(`/api/clubs/${a.id}/shares/${shared.body.id}/comments`, { body: 'Me too' }).expect(403);
    const comments = (await member.get(`/api/clubs/${a.id}/shares/${shared.body.id}/comments`).expect(200)).body.comments;
    expect(comments.map((x: { body: string }) => x.body)).toEqual(['Test nitrite on days 2 and 3.']);
  });

  it('nobody sees an unshared item, another member cannot see a share, club B sees nothing of club A', async () => {
    const { a, b, tank, plan, hiddenPlan, people, c } = await twoClubs();
    const member = await c('memberA');
    // Sharing someone else's item, or into a club one is not in: 404.
    await (await c('member2A')).post(`/api/clubs/${a.id}/shares`, { itemType: 'tank', itemId: tank.id }).expect(404);
    await member.post(`/api/clubs/${b.id}/shares`, { itemType: 'tank', itemId: tank.id }).expect(404);
    const share = (await member.post(`/api/clubs/${a.id}/shares`, { itemType: 'tank', itemId: tank.id }).expect(201)).body;

    // A plain member sees only their own shares.
    const other = await c('member2A');
    expect((await other.get(`/api/clubs/${a.id}/shares`).expect(200)).body.shares).toEqual([]);
    await other.get(`/api/clubs/${a.id}/shares/${share.id}`).expect(404);
    await other.get(`/api/clubs/${a.id}/shares/${share.id}/comments`).expect(404);

    // A shared tank shows no plans (they were not shared).
    const detail = sharedItemDetailSchema.parse((await (await c('mentorA')).get(`/api/clubs/${a.id}/shares/${share.id}`).expect(200)).body);
    expect(detail.tank.plans).toEqual([]);
    expect(JSON.stringify(detail)).not.toContain(plan.id);
    expect(JSON.stringify(detail)).not.toContain(hiddenPlan.id);

    for (const who of ['mentorB', 'orgB']) {
      const outsider = await c(who);
      await outsider.get(`/api/clubs/${a.id}/shares`).expect(404);
      await outsider.get(`/api/clubs/${a.id}/shares/${share.id}`).expect(404);
      // The share id under their own club: still nothing.
      await outsider.get(`/api/clubs/${b.id}/shares/${share.id}`).expect(404);
      await outsider.post(`/api/clubs/${b.id}/shares/${share.id}/comments`, { body: 'hi' }).expect(404);
      expect((await outsider.get(`/api/clubs/${b.id}/shares`).expect(200)).body.shares).toEqual([]);
    }
    await client(ctx.app).get(`/api/clubs/${a.id}/shares`).expect(401);

    // Removing the member ends the share.
    await del(await c('orgA'), `/api/clubs/${a.id}/members/${people.memberA}`).expect(204);
    expect(await ctx.deps.dataSource.getRepository(ClubShare).count()).toBe(0);
  });

  it('the owner or an organizer stops sharing; a mentor cannot', async () => {
    const { a, plan, c } = await twoClubs();
    const share = (await (await c('memberA')).post(`/api/clubs/${a.id}/shares`, { itemType: 'plan', itemId: plan.id }).expect(201)).body;
    await del(await c('mentorA'), `/api/clubs/${a.id}/shares/${share.id}`).expect(403);
    await del(await c('orgA'), `/api/clubs/${a.id}/shares/${share.id}`).expect(204);
    await (await c('mentorA')).get(`/api/clubs/${a.id}/shares/${share.id}`).expect(404);
  });
});
