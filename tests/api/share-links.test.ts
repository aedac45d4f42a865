import { describe, expect, it } from 'vitest';
import { createdShareLinkSchema, sharedViewSchema } from '../../shared/schemas/share.js';
import { CSRF_HEADER, CSRF_HEADER_VALUE } from '../../shared/api-error.js';
import { ShareLink } from '../../server/entities/share-link.js';
import { DEMO_LESSONS } from '../../server/demo-lessons.js';
import { GOOD_PASSWORD, addMember, createClub, createLivestock, createPlan, createTank, createUser } from './helpers/factories.js';
import { client, useTestApp } from './helpers/test-app.js';

const ctx = useTestApp();

async function signedIn(email: string) {
  const c = client(ctx.app);
  await c.post('/api/auth/sign-in', { email, password: GOOD_PASSWORD }).expect(200);
  return c;
}

const tokenOf = (url: string) => url.split('/s/')[1];

async function setup() {
  const ds = ctx.deps.dataSource;
  const owner = await createUser(ds, { email: 'owner@example.org', displayName: 'Owen' });
  await createUser(ds, { email: 'other@example.org', displayName: 'Ola' });
  const tank = await createTank(ds, owner.id, { name: 'Study 120 L' });
  await createLivestock(ds, tank.id, { speciesId: 'neon-tetra', count: 8 });
  const plan = await createPlan(ds, tank.id, { name: 'Eight more neons' });
  const otherPlan = await createPlan(ds, tank.id, { name: 'Another plan' });
  return { owner, tank, plan, otherPlan };
}

describe('read-only share links', () => {
  it('a plan link works without an account and shows only the plan: no e-mail, no ids', async () => {
    const { tank, plan, otherPlan, owner } = await setup();
    const c = await signedIn('owner@example.org');
    const created = createdShareLinkSchema.parse((await c.post('/api/share-links', { itemType: 'plan', itemId: plan.id, expiresInDays: 7 }).expect(201)).body);
    const token = tokenOf(created.url);
    // 32 random bytes in base64url: 256 bits, above the 128-bit floor (OWASP session/token guidance).
    expect(token).toMatch(/^[A-Za-z0-9_-]{43}$/);
    const stored = await ctx.deps.dataSource.getRepository(ShareLink).findOneByOrFail({ id: created.id });
    expect(stored.tokenHash).not.toContain(token);

    const res = await client(ctx.app).get(`/api/share/${token}`).expect(200);
    const view = sharedViewSchema.parse(res.body);
    expect(view.itemType).toBe('plan');
    if (view.itemType !== 'plan') throw new Error('unreachable');
    expect(view.plan.name).toBe('Eight more neons');
    expect(view.scenario?.fish).toEqual([{ species: 'neon-tetra', count: 8, lengthCm: 3 }]);
    for (const secret of [owner.email, owner.id, tank.id, plan.id, otherPlan.id, created.id, 'Another plan']) expect(res.text).not.toContain(secret);
  });

  it('stops working when revoked or expired; only its creator can revoke a plan link', async () => {
    const { plan } = await setup();
    const c = await signedIn('owner@example.org');
    const created = (await c.post('/api/share-links', { itemType: 'plan', itemId: plan.id }).expect(201)).body;
    const token = tokenOf(created.url);
    await client(ctx.app).get(`/api/share/${token}`).expect(200);

    const other = await signedIn('other@example.org');
    await other.agent.delete(`/api/share-links/${created.id}`).set(CSRF_HEADER, CSRF_HEADER_VALUE).expect(404);
    await client(ctx.app).get(`/api/share/${token}`).expect(200);
    await c.agent.delete(`/api/share-links/${created.id}`).set(CSRF_HEADER, CSRF_HEADER_VALUE).expect(204);
    await client(ctx.app).get(`/api/share/${token}`).expect(404);
    const listed = (await c.get(`/api/share-links?itemType=plan&itemId=${plan.id}`).expect(200)).body.links;
    expect(listed[0].revokedAt).not.toBeNull();

    const second = (await c.post('/api/share-links', { itemType: 'plan', itemId: plan.id, expiresInDays: 1 }).expect(201)).body;
    await ctx.deps.dataSource.getRepository(ShareLink).update({ id: second.id }, { expiresAt: new Date(Date.now() - 1000) });
    await client(ctx.app).get(`/api/share/${tokenOf(second.url)}`).expect(404);
    await client(ctx.app).get(`/api/share/${'x'.repeat(43)}`).expect(404);
  });

  it('only the owner of a plan, or a manager of a lesson, can make a link', async () => {
    const { plan } = await setup();
    const other = await signedIn('other@example.org');
    await other.post('/api/share-links', { itemType: 'plan', itemId: plan.id }).expect(404);
    await client(ctx.app).post('/api/share-links', { itemType: 'plan', itemId: plan.id }).expect(401);
    expect(await ctx.deps.dataSource.getRepository(ShareLink).count()).toBe(0);

    const ds = ctx.deps.dataSource;
    const club = await createClub(ds);
    const mentor = await createUser(ds, { email: 'mentor@example.org', displayName: 'Mo' });
    const member = await createUser(ds, { email: 'member@example.org' });
    await addMember(ds, club.id, mentor.id, 'mentor');
    await addMember(ds, club.id, member.id, 'member');
    const lesson = DEMO_LESSONS[0];
    const m = await signedIn('mentor@example.org');
    const made = (await m.post(`/api/clubs/${club.id}/lessons`, { title: lesson.title, kind: lesson.kind, scenario: lesson.scenario, stagedScenario: lesson.stagedScenario, steps: lesson.steps }).expect(201)).body;
    await (await signedIn('member@example.org')).post('/api/share-links', { itemType: 'lesson', itemId: made.id }).expect(404);
    const link = (await m.post('/api/share-links', { itemType: 'lesson', itemId: made.id }).expect(201)).body;
    const res = await client(ctx.app).get(`/api/share/${tokenOf(link.url)}`).expect(200);
    const view = sharedViewSchema.parse(res.body);
    expect(view.itemType === 'lesson' && view.lesson.stagedScenario !== null).toBe(true);
    for (const secret of [made.id, club.id, mentor.id, 'mentor@example.org']) expect(res.text).not.toContain(secret);
  });
});
