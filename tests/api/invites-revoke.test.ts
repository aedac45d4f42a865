import { describe, expect, it } from 'vitest';
import { pendingInviteListSchema } from '../../shared/schemas/club.js';
import { CSRF_HEADER, CSRF_HEADER_VALUE } from '../../shared/api-error.js';
import { ClubInvite } from '../../server/entities/club-invite.js';
import { ClubMembership } from '../../server/entities/club-membership.js';
import { User } from '../../server/entities/user.js';
import { INVALID_INVITE_MESSAGE } from '../../server/services/invites.js';
import { databaseDigest } from './authz/fixture.js';
import { GOOD_PASSWORD, addMember, createClub, createUser } from './helpers/factories.js';
import { client, useTestApp } from './helpers/test-app.js';

const ctx = useTestApp();
type Client = ReturnType<typeof client>;

async function signedIn(email: string): Promise<Client> {
  const c = client(ctx.app);
  await c.post('/api/auth/sign-in', { email, password: GOOD_PASSWORD }).expect(200);
  return c;
}

const del = (c: Client, url: string) => c.agent.delete(url).set(CSRF_HEADER, CSRF_HEADER_VALUE);
const invitesUrl = (clubId: string) => `/api/clubs/${clubId}/invites`;

/** Club A with an organizer, a mentor and a member, and club B with its own organizer. */
async function twoClubs() {
  const ds = ctx.deps.dataSource;
  const clubA = await createClub(ds, { name: 'Heron Pond Aquarists' });
  const clubB = await createClub(ds, { name: 'Cedar Run Keepers' });
  const olive = await createUser(ds, { email: 'olive@example.org', displayName: 'Olive' });
  const milo = await createUser(ds, { email: 'milo@example.org', displayName: 'Milo' });
  const mara = await createUser(ds, { email: 'mara@example.org', displayName: 'Mara' });
  const bea = await createUser(ds, { email: 'bea@example.org', displayName: 'Bea' });
  await addMember(ds, clubA.id, olive.id, 'organizer');
  await addMember(ds, clubA.id, milo.id, 'mentor');
  await addMember(ds, clubA.id, mara.id, 'member');
  await addMember(ds, clubB.id, bea.id, 'organizer');
  return { clubA, clubB, org: await signedIn('olive@example.org') };
}

/** Sends an invite and returns its id and the token from the link in the new e-mail. */
async function inviteByMail(org: Client, clubId: string, email: string): Promise<{ id: string; token: string }> {
  const seen = new Set(ctx.mail.messages());
  const res = await org.post(invitesUrl(clubId), { email }).expect(201);
  await ctx.deps.background.drain();
  const mail = await ctx.mail.waitFor((m) => !seen.has(m) && m.to.includes(email));
  const match = /\/invite\/([A-Za-z0-9_-]{43})/.exec(mail.text);
  expect(match, 'the invite e-mail carries the link').not.toBeNull();
  return { id: res.body.id as string, token: match![1]! };
}

async function pending(org: Client, clubId: string) {
  const res = await org.get(invitesUrl(clubId)).expect(200);
  return { list: pendingInviteListSchema.parse(res.body).invites, text: res.text };
}

describe('pending invites: list and revoke (organizers)', () => {
  it('lists only invites waiting for an answer: accepted, expired and revoked ones are absent; no token or hash', async () => {
    const { clubA, clubB, org } = await twoClubs();
    const waiting = await inviteByMail(org, clubA.id, 'wren@example.org');
    const accepted = await inviteByMail(org, clubA.id, 'ash@example.org');
    const expired = await inviteByMail(org, clubA.id, 'late@example.org');
    const revoked = await inviteByMail(org, clubA.id, 'gone@example.org');
    // Club B's invite never shows in club A's list.
    await inviteByMail(await signedIn('bea@example.org'), clubB.id, 'elsewhere@example.org');

    await client(ctx.app).post(`/api/invites/${accepted.token}/accept`, { displayName: 'Ash', password: GOOD_PASSWORD }).expect(201);
    await ctx.deps.dataSource.getRepository(ClubInvite).update({ id: expired.id }, { expiresAt: new Date(Date.now() - 1000) });
    await del(org, `${invitesUrl(clubA.id)}/${revoked.id}`).expect(204);

    const { list, text } = await pending(org, clubA.id);
    expect(list.map((i) => i.email)).toEqual(['wren@example.org']);
    const [only] = list;
    expect(Object.keys(only!).sort()).toEqual(['createdAt', 'email', 'expiresAt', 'id', 'invitedBy']);
    expect(only).toMatchObject({ id: waiting.id, email: 'wren@example.org', invitedBy: 'Olive' });
    // The link is valid for 7 days from when it was made (INVITE_VALID_DAYS).
    const validMs = Date.parse(only!.expiresAt) - Date.parse(only!.createdAt);
    expect(Math.abs(validMs - 7 * 86_400_000)).toBeLessThan(5_000);

    const rows = await ctx.deps.dataSource.getRepository(ClubInvite).findBy({ clubId: clubA.id });
    for (const row of rows) expect(text).not.toContain(row.tokenHash);
    for (const token of [waiting, accepted, expired, revoked].map((i) => i.token)) expect(text).not.toContain(token);
  });

  it('a revoked invite’s e-mailed link is refused on preview and accept with the invalid-link message, and nothing is written', async () => {
    const { clubA, org } = await twoClubs();
    const ds = ctx.deps.dataSource;
    const visitorInvite = await inviteByMail(org, clubA.id, 'nico@example.org');
    await createUser(ds, { email: 'pat@example.org', displayName: 'Pat' });
    const patInvite = await inviteByMail(org, clubA.id, 'pat@example.org');
    // Both links work before the revoke.
    await client(ctx.app).get(`/api/invites/${visitorInvite.token}`).expect(200);
    await client(ctx.app).get(`/api/invites/${patInvite.token}`).expect(200);

    ctx.logs.entries.length = 0;
    await del(org, `${invitesUrl(clubA.id)}/${visitorInvite.id}`).expect(204);
    await del(org, `${invitesUrl(clubA.id)}/${patInvite.id}`).expect(204);
    const logged = ctx.logs.entries.filter((e) => e.event === 'clubs.invite_revoked');
    expect(logged.map((e) => e.fields.inviteId)).toEqual([visitorInvite.id, patInvite.id]);
    const logText = JSON.stringify(logged);
    for (const secret of [visitorInvite.token, patInvite.token, 'nico@example.org', 'pat@example.org']) expect(logText).not.toContain(secret);

    const usersBefore = await ds.getRepository(User).count();
    const membersBefore = await ds.getRepository(ClubMembership).countBy({ clubId: clubA.id });
    const before = await databaseDigest(ds);

    const visitor = client(ctx.app);
    const preview = await visitor.get(`/api/invites/${visitorInvite.token}`).expect(404);
    expect(preview.body.error.message).toBe(INVALID_INVITE_MESSAGE);
    const accept = await visitor.post(`/api/invites/${visitorInvite.token}/accept`, { displayName: 'Nico', password: GOOD_PASSWORD }).expect(404);
    expect(accept.body.error.message).toBe(INVALID_INVITE_MESSAGE);

    // Signed in with the invited address: refused the same way.
    const pat = await signedIn('pat@example.org');
    expect((await pat.get(`/api/invites/${patInvite.token}`).expect(404)).body.error.message).toBe(INVALID_INVITE_MESSAGE);
    expect((await pat.post(`/api/invites/${patInvite.token}/accept`, {}).expect(404)).body.error.message).toBe(INVALID_INVITE_MESSAGE);
    await pat.get(`/api/clubs/${clubA.id}`).expect(404);

    expect(await ds.getRepository(User).count()).toBe(usersBefore);
    expect(await ds.getRepository(User).existsBy({ email: 'nico@example.org' })).toBe(false);
    expect(await ds.getRepository(ClubMembership).countBy({ clubId: clubA.id })).toBe(membersBefore);
    expect(await databaseDigest(ds), 'refused links wrote nothing').toBe(before);
    expect((await pending(org, clubA.id)).list).toEqual([]);
  });

  it('revoking twice answers 404 (only a pending invite can be revoked), as does revoking an accepted one', async () => {
    const { clubA, org } = await twoClubs();
    const invite = await inviteByMail(org, clubA.id, 'twice@example.org');
    await del(org, `${invitesUrl(clubA.id)}/${invite.id}`).expect(204);
    const again = await del(org, `${invitesUrl(clubA.id)}/${invite.id}`).expect(404);
    expect(again.body.error.message).toMatch(/No such invite/);

    const used = await inviteByMail(org, clubA.id, 'used@example.org');
    await client(ctx.app).post(`/api/invites/${used.token}/accept`, { displayName: 'Used', password: GOOD_PASSWORD }).expect(201);
    await del(org, `${invitesUrl(clubA.id)}/${used.id}`).expect(404);
    const row = await ctx.deps.dataSource.getRepository(ClubInvite).findOneByOrFail({ id: used.id });
    expect(row.revokedAt).toBeNull();

    await del(org, `${invitesUrl(clubA.id)}/not-a-uuid`).expect(404);
    await del(org, `${invitesUrl(clubA.id)}/00000000-0000-4000-8000-000000000000`).expect(404);
  });

  it('the same address can be invited again after a revoke, and the new link works', async () => {
    const { clubA, org } = await twoClubs();
    const first = await inviteByMail(org, clubA.id, 'again@example.org');
    await del(org, `${invitesUrl(clubA.id)}/${first.id}`).expect(204);
    const second = await inviteByMail(org, clubA.id, 'again@example.org');
    expect(second.id).not.toBe(first.id);
    expect((await pending(org, clubA.id)).list.map((i) => i.id)).toEqual([second.id]);

    await client(ctx.app).get(`/api/invites/${first.token}`).expect(404);
    const visitor = client(ctx.app);
    await visitor.post(`/api/invites/${second.token}/accept`, { displayName: 'Again', password: GOOD_PASSWORD }).expect(201);
    expect((await visitor.get(`/api/clubs/${clubA.id}`).expect(200)).body.myRole).toBe('member');
    expect((await pending(org, clubA.id)).list).toEqual([]);
  });

  it('a mentor and a member get 403 on list and revoke, an outsider 404, nobody signed in 401; the database is unchanged', async () => {
    const { clubA, org } = await twoClubs();
    const ds = ctx.deps.dataSource;
    const invite = await inviteByMail(org, clubA.id, 'kept@example.org');
    await createUser(ds, { email: 'otto@example.org' });
    const revokeUrl = `${invitesUrl(clubA.id)}/${invite.id}`;
    const before = await databaseDigest(ds);

    for (const [email, status] of [
      ['milo@example.org', 403],
      ['mara@example.org', 403],
      ['otto@example.org', 404],
    ] as const) {
      const c = await signedIn(email);
      const listed = await c.get(invitesUrl(clubA.id)).expect(status);
      expect(listed.text).not.toContain('kept@example.org');
      await del(c, revokeUrl).expect(status);
    }
    await client(ctx.app).get(invitesUrl(clubA.id)).expect(401);
    await del(client(ctx.app), revokeUrl).expect(401);

    expect(await databaseDigest(ds), 'a denied request wrote').toBe(before);
    expect(ctx.logs.entries.some((e) => e.event === 'clubs.invite_revoked')).toBe(false);
    // The invite still works.
    await client(ctx.app).get(`/api/invites/${invite.token}`).expect(200);
  });

  it('the organizer of another club gets 404, through club A and through their own club’s path; the invite stays live', async () => {
    const { clubA, clubB, org } = await twoClubs();
    const ds = ctx.deps.dataSource;
    const invite = await inviteByMail(org, clubA.id, 'stays@example.org');
    const bea = await signedIn('bea@example.org');
    const before = await databaseDigest(ds);

    await bea.get(invitesUrl(clubA.id)).expect(404);
    await del(bea, `${invitesUrl(clubA.id)}/${invite.id}`).expect(404);
    // Club A's invite id under club B's path: not an invite of club B.
    await del(bea, `${invitesUrl(clubB.id)}/${invite.id}`).expect(404);
    expect((await pending(bea, clubB.id)).list).toEqual([]);

    expect(await databaseDigest(ds)).toBe(before);
    expect((await pending(org, clubA.id)).list.map((i) => i.id)).toEqual([invite.id]);
    await client(ctx.app).get(`/api/invites/${invite.token}`).expect(200);
  });

  it('a revoke racing an accept: exactly one of them wins, and the database agrees with the winner', async () => {
    const { clubA, org } = await twoClubs();
    const ds = ctx.deps.dataSource;
    for (let round = 0; round < 5; round++) {
      const email = `race${round}@example.org`;
      const user = await createUser(ds, { email });
      const invite = await inviteByMail(org, clubA.id, email);
      const keeper = await signedIn(email);
      const [revoke, accept] = await Promise.all([del(org, `${invitesUrl(clubA.id)}/${invite.id}`), keeper.post(`/api/invites/${invite.token}/accept`, {})]);
      const statuses = [revoke.status, accept.status];
      expect(statuses, `round ${round}`).toSatisfy((s: number[]) => (s[0] === 204 && s[1] === 404) || (s[0] === 404 && s[1] === 200));
      const row = await ds.getRepository(ClubInvite).findOneByOrFail({ id: invite.id });
      const joined = await ds.getRepository(ClubMembership).existsBy({ clubId: clubA.id, userId: user.id });
      expect({ revoked: row.revokedAt !== null, used: row.usedAt !== null, joined }).toEqual(
        revoke.status === 204 ? { revoked: true, used: false, joined: false } : { revoked: false, used: true, joined: true },
      );
    }
  });
});
