import { describe, expect, it } from 'vitest';
import { ClubInvite } from '../../server/entities/club-invite.js';
import { INVITE_LIMITS } from '../../server/services/invite-quota.js';
import { newLinkToken, sha256Hex } from '../../server/services/secret-tokens.js';
import { addMember, createClub } from './helpers/factories.js';
import { signedInKeeper } from './helpers/keeper-client.js';
import { client, useTestApp } from './helpers/test-app.js';
import { CSRF_HEADER, CSRF_HEADER_VALUE } from '../../shared/api-error.js';

const ctx = useTestApp();
const invites = () => ctx.deps.dataSource.getRepository(ClubInvite);

/** `n` invites already sent by `invitedBy` to `clubId`, `hoursAgo` hours ago. */
async function alreadySent(clubId: string, invitedBy: string, n: number, hoursAgo = 1) {
  const rows = Array.from({ length: n }, (_, i) =>
    invites().create({
      clubId,
      email: `earlier${i}.${clubId.slice(0, 4)}@example.org`,
      tokenHash: sha256Hex(newLinkToken()),
      invitedBy,
      expiresAt: new Date(Date.now() + 86_400_000),
      usedAt: null,
      revokedAt: null,
    }),
  );
  await invites().save(rows);
  await ctx.deps.dataSource.query(`UPDATE club_invites SET created_at = now() - make_interval(hours => $1) WHERE invited_by = $2 AND club_id = $3`, [hoursAgo, invitedBy, clubId]);
}

async function organizer(email: string, clubs = 1) {
  const k = await signedInKeeper(ctx, email);
  const made = [];
  for (let i = 0; i < clubs; i++) {
    const club = await createClub(ctx.deps.dataSource);
    await addMember(ctx.deps.dataSource, club.id, k.user.id, 'organizer');
    made.push(club.id);
  }
  return { k, clubs: made };
}

describe('invite caps (per organizer and per club, per day)', () => {
  it(`a club's invite past ${INVITE_LIMITS.perClubPerDay} in a day answers 429 with Retry-After, writes nothing and sends nothing`, async () => {
    const { k, clubs: [club] } = await organizer('otter@example.org');
    await alreadySent(club!, k.user.id, INVITE_LIMITS.perClubPerDay - 1, 3);
    await k.post(`/api/clubs/${club}/invites`, { email: 'last.one@example.org' }).expect(201);
    const res = await k.post(`/api/clubs/${club}/invites`, { email: 'one.too.many@example.org' }).expect(429);
    // The oldest invite of the window is 3 h old: it leaves the window in about 21 h.
    const wait = Number(res.headers['retry-after']);
    expect(wait).toBeGreaterThan(20.9 * 3600);
    expect(wait).toBeLessThanOrEqual(21 * 3600 + 1);
    expect(res.body.error.message).toMatch(/This club has sent 20 invites/);
    expect(await invites().countBy({ email: 'one.too.many@example.org' })).toBe(0);
    await ctx.deps.background.drain();
    expect(ctx.mail.messages().map((m) => m.to).flat()).toEqual(['last.one@example.org']);
    expect(ctx.logs.entries.some((e) => e.event === 'clubs.invite_limited')).toBe(true);
  });

  it('a second organizer of the same club shares the club cap; invites older than a day do not count', async () => {
    const { k, clubs: [club] } = await organizer('vole@example.org');
    const other = await signedInKeeper(ctx, 'shrew@example.org');
    await addMember(ctx.deps.dataSource, club!, other.user.id, 'organizer');
    await alreadySent(club!, k.user.id, INVITE_LIMITS.perClubPerDay, 2);
    await other.post(`/api/clubs/${club}/invites`, { email: 'someone@example.org' }).expect(429);
    await ctx.deps.dataSource.query(`UPDATE club_invites SET created_at = now() - interval '25 hours'`);
    await other.post(`/api/clubs/${club}/invites`, { email: 'someone@example.org' }).expect(201);
  });

  it('making more clubs does not get round the organizer cap', async () => {
    const { k, clubs } = await organizer('mink@example.org', 3);
    await alreadySent(clubs[0]!, k.user.id, INVITE_LIMITS.perClubPerDay);
    await alreadySent(clubs[1]!, k.user.id, INVITE_LIMITS.perOrganizerPerDay - INVITE_LIMITS.perClubPerDay);
    const res = await k.post(`/api/clubs/${clubs[2]}/invites`, { email: 'fresh@example.org' }).expect(429);
    expect(res.body.error.message).toMatch(/You have sent 30 invites/);
    expect(Number(res.headers['retry-after'])).toBeGreaterThan(0);
  });

  it('holds under parallel sends from two server processes: exactly the remaining one goes through', async () => {
    const { k, clubs: [club] } = await organizer('stoat@example.org');
    await alreadySent(club!, k.user.id, INVITE_LIMITS.perClubPerDay - 1);
    // The same session cookie on a second app over the same database.
    const second = ctx.makeApp();
    const cookie = (await k.agent.get('/api/me')).request.cookies;
    const sends = Array.from({ length: 8 }, (_, i) => {
      const app = i % 2 === 0 ? ctx.app : second;
      const c = client(app);
      return c.agent
        .post(`/api/clubs/${club}/invites`)
        .set('Cookie', cookie)
        .set(CSRF_HEADER, CSRF_HEADER_VALUE)
        .send({ email: `parallel${i}@example.org` });
    });
    const statuses = (await Promise.all(sends)).map((r) => r.status).sort();
    expect(statuses).toEqual([201, 429, 429, 429, 429, 429, 429, 429]);
    expect(await invites().countBy({ clubId: club! })).toBe(INVITE_LIMITS.perClubPerDay);
  });
});
