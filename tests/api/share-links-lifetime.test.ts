import { describe, expect, it } from 'vitest';
import { CSRF_HEADER, CSRF_HEADER_VALUE } from '../../shared/api-error.js';
import { SHARE_LINK_DEFAULT_DAYS, createdShareLinkSchema, shareLinkListSchema } from '../../shared/schemas/share.js';
import { ClubMembership } from '../../server/entities/club-membership.js';
import { ShareLink } from '../../server/entities/share-link.js';
import { EXAMPLE_SCENARIO } from './authz/fixture.js';
import { addMember, createClub, createPlan, createTank, createUser } from './helpers/factories.js';
import { signedInKeeper, type Keeper } from './helpers/keeper-client.js';
import { client, useTestApp } from './helpers/test-app.js';

const ctx = useTestApp();
const DAY = 86_400_000;
const tokenOf = (url: string) => url.split('/s/')[1]!;
const view = (token: string) => client(ctx.app).get(`/api/share/${token}`);
const revoke = (k: Keeper, id: string) => k.agent.delete(`/api/share-links/${id}`).set(CSRF_HEADER, CSRF_HEADER_VALUE);

async function makeLink(k: Keeper, itemType: 'plan' | 'lesson', itemId: string, expiresInDays?: number) {
  const res = await k.post('/api/share-links', { itemType, itemId, ...(expiresInDays === undefined ? {} : { expiresInDays }) }).expect(201);
  return createdShareLinkSchema.parse(res.body);
}

/** Club with an organizer, a mentor and a member; the mentor wrote one lesson. */
async function clubWithLesson() {
  const ds = ctx.deps.dataSource;
  const club = await createClub(ds, { name: 'Reed Bed Keepers' });
  const organizer = await signedInKeeper(ctx, 'heron@example.org');
  const mentor = await signedInKeeper(ctx, 'egret@example.org');
  const member = await signedInKeeper(ctx, 'coot@example.org');
  await addMember(ds, club.id, organizer.user.id, 'organizer');
  await addMember(ds, club.id, mentor.user.id, 'mentor');
  await addMember(ds, club.id, member.user.id, 'member');
  const lesson = (
    await mentor.post(`/api/clubs/${club.id}/lessons`, { title: 'First week', scenario: EXAMPLE_SCENARIO, steps: [{ title: 'Look', body: 'Watch ammonia.' }] }).expect(201)
  ).body as { id: string };
  return { club, organizer, mentor, member, lesson };
}

const setRole = (clubId: string, userId: string, role: 'organizer' | 'mentor' | 'member') =>
  ctx.deps.dataSource.getRepository(ClubMembership).update({ clubId, userId }, { role });

describe('share links expire by default', () => {
  it(`a link works ${SHARE_LINK_DEFAULT_DAYS} days unless its maker chooses otherwise, up to a year; never for ever`, async () => {
    const k = await signedInKeeper(ctx, 'dace@example.org');
    const plan = await createPlan(ctx.deps.dataSource, (await createTank(ctx.deps.dataSource, k.user.id)).id);
    const plain = await makeLink(k, 'plan', plan.id);
    expect(Date.parse(plain.expiresAt) - Date.now()).toBeGreaterThan(SHARE_LINK_DEFAULT_DAYS * DAY - 60_000);
    expect(Date.parse(plain.expiresAt) - Date.now()).toBeLessThanOrEqual(SHARE_LINK_DEFAULT_DAYS * DAY);
    const year = await makeLink(k, 'plan', plan.id, 365);
    expect(Date.parse(year.expiresAt) - Date.now()).toBeGreaterThan(364 * DAY);

    for (const expiresInDays of [366, 0, null, 1.5]) {
      const res = await k.post('/api/share-links', { itemType: 'plan', itemId: plan.id, expiresInDays }).expect(400);
      expect(Object.keys(res.body.error.fields)).toEqual(['expiresInDays']);
    }
    expect(await ctx.deps.dataSource.getRepository(ShareLink).count()).toBe(2);
    // Past its date it is gone like a revoked one.
    await ctx.deps.dataSource.getRepository(ShareLink).update({ id: plain.id }, { expiresAt: new Date(Date.now() - 1000) });
    await view(tokenOf(plain.url)).expect(404);
    await view(tokenOf(year.url)).expect(200);
  });
});

describe('share links re-check their maker’s right to share on every view', () => {
  it('a mentor’s lesson link stops when the mentor is no longer a mentor or leaves the club', async () => {
    const { club, mentor, lesson } = await clubWithLesson();
    const link = await makeLink(mentor, 'lesson', lesson.id);
    await view(tokenOf(link.url)).expect(200);
    await setRole(club.id, mentor.user.id, 'member');
    const gone = await view(tokenOf(link.url)).expect(404);
    expect(gone.body.error.message).toMatch(/revoked, has expired/);
    await setRole(club.id, mentor.user.id, 'mentor');
    await view(tokenOf(link.url)).expect(200);
    await mentor.post(`/api/clubs/${club.id}/leave`).expect(204);
    await view(tokenOf(link.url)).expect(404);
  });

  it('an organizer’s link to another mentor’s lesson stops when the organizer steps down', async () => {
    const { club, organizer, lesson } = await clubWithLesson();
    const link = await makeLink(organizer, 'lesson', lesson.id);
    await view(tokenOf(link.url)).expect(200);
    await setRole(club.id, organizer.user.id, 'member');
    await view(tokenOf(link.url)).expect(404);
  });

  it('a plan link stops when its maker no longer owns the plan’s tank', async () => {
    const k = await signedInKeeper(ctx, 'rudd@example.org');
    const newOwner = await createUser(ctx.deps.dataSource, { email: 'roach@example.org' });
    const tank = await createTank(ctx.deps.dataSource, k.user.id);
    const link = await makeLink(k, 'plan', (await createPlan(ctx.deps.dataSource, tank.id)).id);
    await view(tokenOf(link.url)).expect(200);
    await ctx.deps.dataSource.query(`UPDATE tanks SET owner_id = $1 WHERE id = $2`, [newOwner.id, tank.id]);
    await view(tokenOf(link.url)).expect(404);
  });
});

describe('who can revoke a share link', () => {
  it('the club’s organizer sees and revokes a mentor’s lesson link; a member and another club’s organizer cannot', async () => {
    const { organizer, mentor, member, lesson } = await clubWithLesson();
    const link = await makeLink(mentor, 'lesson', lesson.id);
    const otherOrganizer = await signedInKeeper(ctx, 'grebe@example.org');
    await addMember(ctx.deps.dataSource, (await createClub(ctx.deps.dataSource)).id, otherOrganizer.user.id, 'organizer');

    const listed = shareLinkListSchema.parse((await organizer.get(`/api/share-links?itemType=lesson&itemId=${lesson.id}`).expect(200)).body);
    expect(listed.links.map((l) => [l.id, l.mine])).toEqual([[link.id, false]]);
    expect(listed.links[0]!.madeBy).toBe(mentor.user.displayName);
    const mine = shareLinkListSchema.parse((await mentor.get(`/api/share-links?itemType=lesson&itemId=${lesson.id}`).expect(200)).body);
    expect(mine.links.map((l) => [l.id, l.mine])).toEqual([[link.id, true]]);

    await revoke(member, link.id).expect(404);
    await revoke(otherOrganizer, link.id).expect(404);
    await view(tokenOf(link.url)).expect(200);
    await revoke(organizer, link.id).expect(204);
    await view(tokenOf(link.url)).expect(404);
  });

  it('a keeper’s plan link is theirs alone: an organizer of their club cannot revoke it', async () => {
    const { organizer, member } = await clubWithLesson();
    const plan = await createPlan(ctx.deps.dataSource, (await createTank(ctx.deps.dataSource, member.user.id)).id);
    const link = await makeLink(member, 'plan', plan.id);
    await revoke(organizer, link.id).expect(404);
    await view(tokenOf(link.url)).expect(200);
    await revoke(member, link.id).expect(204);
  });
});
