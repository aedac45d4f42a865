import { describe, expect, it } from 'vitest';
import { clubDetailSchema } from '../../shared/schemas/club.js';
import { AppError } from '../../server/errors.js';
import { requireClubRole } from '../../server/services/clubs.js';
import { GOOD_PASSWORD, addMember, createClub, createUser } from './helpers/factories.js';
import { client, useTestApp } from './helpers/test-app.js';

const ctx = useTestApp();

async function clubWithRoles() {
  const ds = ctx.deps.dataSource;
  const club = await createClub(ds, { name: 'Riverbend Aquarists' });
  const otherClub = await createClub(ds, { name: 'Lakeside Fish Room' });
  const organizer = await createUser(ds, { email: 'org@example.org', displayName: 'Olive' });
  const mentor = await createUser(ds, { email: 'mentor@example.org', displayName: 'Milo' });
  const member = await createUser(ds, { email: 'member@example.org', displayName: 'Mira' });
  const outsider = await createUser(ds, { email: 'out@example.org', displayName: 'Otto' });
  await addMember(ds, club.id, organizer.id, 'organizer');
  await addMember(ds, club.id, mentor.id, 'mentor');
  await addMember(ds, club.id, member.id, 'member');
  await addMember(ds, otherClub.id, outsider.id, 'organizer');
  return { club, otherClub, organizer, mentor, member, outsider };
}

async function signedIn(email: string) {
  const c = client(ctx.app);
  await c.post('/api/auth/sign-in', { email, password: GOOD_PASSWORD }).expect(200);
  return c;
}

describe('GET /api/clubs/:clubId', () => {
  it('shows the club to each of its members, organizers first, without e-mail addresses', async () => {
    const { club } = await clubWithRoles();
    for (const [email, role] of [
      ['org@example.org', 'organizer'],
      ['mentor@example.org', 'mentor'],
      ['member@example.org', 'member'],
    ] as const) {
      const res = await (await signedIn(email)).get(`/api/clubs/${club.id}`).expect(200);
      const detail = clubDetailSchema.parse(res.body);
      expect(detail.myRole).toBe(role);
      expect(detail.members.map((m) => [m.displayName, m.role])).toEqual([
        ['Olive', 'organizer'],
        ['Milo', 'mentor'],
        ['Mira', 'member'],
      ]);
      expect(res.text).not.toContain('@example.org');
    }
  });

  it("answers 404 to the organizer of another club, to a malformed id, and 401 without a session", async () => {
    const { club } = await clubWithRoles();
    const outsider = await signedIn('out@example.org');
    expect((await outsider.get(`/api/clubs/${club.id}`).expect(404)).body.error.code).toBe('not_found');
    await outsider.get('/api/clubs/not-a-uuid').expect(404);
    await client(ctx.app).get(`/api/clubs/${club.id}`).expect(401);
  });
});

describe('requireClubRole', () => {
  it('returns the membership for an allowed role, 403 for a member without it, 404 for a non-member', async () => {
    const ds = ctx.deps.dataSource;
    const { club, organizer, member, outsider } = await clubWithRoles();
    expect((await requireClubRole(ds, organizer.id, club.id, ['organizer'])).role).toBe('organizer');
    await expect(requireClubRole(ds, member.id, club.id, ['organizer', 'mentor'])).rejects.toMatchObject({ status: 403, code: 'forbidden' });
    const denied = await requireClubRole(ds, outsider.id, club.id, ['organizer']).catch((e: unknown) => e);
    expect(denied).toBeInstanceOf(AppError);
    expect(denied).toMatchObject({ status: 404 });
  });
});
