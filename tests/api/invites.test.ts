import { describe, expect, it } from 'vitest';
import { acceptInviteResultSchema, clubDetailSchema, invitePreviewSchema } from '../../shared/schemas/club.js';
import { CSRF_HEADER, CSRF_HEADER_VALUE } from '../../shared/api-error.js';
import { ClubInvite } from '../../server/entities/club-invite.js';
import { GOOD_PASSWORD, addMember, createClub, createUser } from './helpers/factories.js';
import { client, useTestApp } from './helpers/test-app.js';

const ctx = useTestApp();

async function signedIn(email: string) {
  const c = client(ctx.app);
  await c.post('/api/auth/sign-in', { email, password: GOOD_PASSWORD }).expect(200);
  return c;
}

async function organizerWithClub() {
  const ds = ctx.deps.dataSource;
  const club = await createClub(ds, { name: 'Heron Pond Aquarists' });
  const organizer = await createUser(ds, { email: 'olive@example.org', displayName: 'Olive' });
  await addMember(ds, club.id, organizer.id, 'organizer');
  return { club, organizer, org: await signedIn('olive@example.org') };
}

/** Sends an invite and returns the token from the captured e-mail's link. */
async function inviteByMail(org: ReturnType<typeof client>, clubId: string, email: string): Promise<string> {
  await org.post(`/api/clubs/${clubId}/invites`, { email }).expect(201);
  await ctx.deps.background.drain();
  const mail = await ctx.mail.waitFor((m) => m.to.includes(email.toLowerCase()));
  const match = /\/invite\/([A-Za-z0-9_-]{43})/.exec(mail.text);
  expect(match, 'the invite e-mail carries the link').not.toBeNull();
  expect(mail.html).toContain(`/invite/${match![1]}`);
  return match![1];
}

describe('club invites by e-mail', () => {
  it('organizer invites → the e-mail arrives → the link creates an account → the person is a member', async () => {
    const { club, org } = await organizerWithClub();
    const token = await inviteByMail(org, club.id, 'New.Keeper@Example.org');
    const mail = ctx.mail.messages()[0];
    // Fixed wording: the names typed into the app stay out of the subject line (invite-quota.ts).
    expect(mail.subject).toBe('An invitation to a club on Shoalshift');
    expect(mail.text).toContain('"Olive" invites you to join the club "Heron Pond Aquarists"');
    expect(mail.to).toEqual(['new.keeper@example.org']);

    // Only the token's hash is stored.
    const row = await ctx.deps.dataSource.getRepository(ClubInvite).findOneByOrFail({ clubId: club.id });
    expect(row.tokenHash).not.toContain(token);
    expect(row.tokenHash).toMatch(/^[0-9a-f]{64}$/);

    const visitor = client(ctx.app);
    const preview = invitePreviewSchema.parse((await visitor.get(`/api/invites/${token}`).expect(200)).body);
    expect(preview).toMatchObject({ clubName: 'Heron Pond Aquarists', invitedBy: 'Olive', email: 'new.keeper@example.org', accountExists: false });

    // Signed out, without a name and password: the fields are named.
    const missing = await visitor.post(`/api/invites/${token}/accept`, {}).expect(400);
    expect(Object.keys(missing.body.error.fields).sort()).toEqual(['displayName', 'password']);

    const accepted = await visitor.post(`/api/invites/${token}/accept`, { displayName: 'Nico', password: GOOD_PASSWORD }).expect(201);
    expect(acceptInviteResultSchema.parse(accepted.body)).toEqual({ clubId: club.id, role: 'member' });
    // The new account is signed in and sees the club with the member role.
    const detail = clubDetailSchema.parse((await visitor.get(`/api/clubs/${club.id}`).expect(200)).body);
    expect(detail.myRole).toBe('member');
    expect(detail.members.map((m) => [m.displayName, m.role])).toEqual([
      ['Olive', 'organizer'],
      ['Nico', 'member'],
    ]);
  });

  it('a signed-in keeper accepts with the link alone; the same link then fails (single use)', async () => {
    const { club, org } = await organizerWithClub();
    await createUser(ctx.deps.dataSource, { email: 'pat@example.org', displayName: 'Pat' });
    const token = await inviteByMail(org, club.id, 'pat@example.org');
    expect((await client(ctx.app).get(`/api/invites/${token}`).expect(200)).body.accountExists).toBe(true);
    // Signed out with an existing account for the address: sign in first.
    await client(ctx.app).post(`/api/invites/${token}/accept`, { displayName: 'X', password: GOOD_PASSWORD }).expect(401);

    const pat = await signedIn('pat@example.org');
    await pat.post(`/api/invites/${token}/accept`, {}).expect(200);
    expect((await pat.get(`/api/clubs/${club.id}`).expect(200)).body.myRole).toBe('member');

    const reuse = await (await signedIn('pat@example.org')).post(`/api/invites/${token}/accept`, {}).expect(404);
    expect(reuse.body.error.message).toMatch(/not valid, was used already, or has expired/);
    await client(ctx.app).get(`/api/invites/${token}`).expect(404);
  });

  it('refuses a forwarded link: someone signed in with another address cannot join, and the invite stays usable', async () => {
    const { club, org } = await organizerWithClub();
    await createUser(ctx.deps.dataSource, { email: 'quinn@example.org', displayName: 'Quinn' });
    await createUser(ctx.deps.dataSource, { email: 'rory@example.org', displayName: 'Rory' });
    const token = await inviteByMail(org, club.id, 'quinn@example.org');
    const rory = await signedIn('rory@example.org');
    const refused = await rory.post(`/api/invites/${token}/accept`, {}).expect(403);
    expect(refused.body.error.message).toMatch(/another e-mail address/);
    await rory.get(`/api/clubs/${club.id}`).expect(404);
    await (await signedIn('quinn@example.org')).post(`/api/invites/${token}/accept`, {}).expect(200);
  });

  it('refuses an expired token and a made-up one', async () => {
    const { club, org } = await organizerWithClub();
    const token = await inviteByMail(org, club.id, 'late@example.org');
    await ctx.deps.dataSource.getRepository(ClubInvite).update({ clubId: club.id }, { expiresAt: new Date(Date.now() - 1000) });
    await client(ctx.app).get(`/api/invites/${token}`).expect(404);
    await client(ctx.app).post(`/api/invites/${token}/accept`, { displayName: 'Late', password: GOOD_PASSWORD }).expect(404);
    await client(ctx.app).get(`/api/invites/${'A'.repeat(43)}`).expect(404);
    await client(ctx.app).get('/api/invites/short').expect(404);
  });

  it('only organizers invite: a member gets 403, an outsider 404, nobody signed in 401; nothing is sent', async () => {
    const { club } = await organizerWithClub();
    const ds = ctx.deps.dataSource;
    const m = await createUser(ds, { email: 'mira@example.org' });
    await addMember(ds, club.id, m.id, 'member');
    await createUser(ds, { email: 'otto@example.org' });
    await (await signedIn('mira@example.org')).post(`/api/clubs/${club.id}/invites`, { email: 'x@example.org' }).expect(403);
    await (await signedIn('otto@example.org')).post(`/api/clubs/${club.id}/invites`, { email: 'x@example.org' }).expect(404);
    await client(ctx.app).post(`/api/clubs/${club.id}/invites`, { email: 'x@example.org' }).expect(401);
    await ctx.deps.background.drain();
    expect(ctx.mail.messages()).toHaveLength(0);
    expect(await ds.getRepository(ClubInvite).count()).toBe(0);
  });

  it('validates the address and refuses an existing member; the CSRF header is required', async () => {
    const { club, org } = await organizerWithClub();
    const bad = await org.post(`/api/clubs/${club.id}/invites`, { email: 'not-an-address' }).expect(400);
    expect(bad.body.error.fields.email).toMatch(/valid e-mail/);
    await org.post(`/api/clubs/${club.id}/invites`, { email: 'olive@example.org' }).expect(409);
    await org.agent.post(`/api/clubs/${club.id}/invites`).send({ email: 'y@example.org' }).expect(403);
    await org.agent.post(`/api/clubs/${club.id}/invites`).set(CSRF_HEADER, CSRF_HEADER_VALUE).send({ email: 'y@example.org', role: 'organizer' }).expect(400);
  });
});
