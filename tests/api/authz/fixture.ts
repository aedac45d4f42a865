import { createHash, createHmac, randomBytes } from 'node:crypto';
import type { DataSource } from 'typeorm';
import fs from 'node:fs';
import path from 'node:path';
import { ClubInvite } from '../../../server/entities/club-invite.js';
import { ClubShare } from '../../../server/entities/club-share.js';
import { Lesson } from '../../../server/entities/lesson.js';
import { PasswordResetToken } from '../../../server/entities/password-reset-token.js';
import { PlanComment } from '../../../server/entities/plan-comment.js';
import { ShareLink } from '../../../server/entities/share-link.js';
import { UNSUBSCRIBE_PURPOSE } from '../../../server/jobs/reminders.js';
import { newLinkToken, sha256Hex, signPayload } from '../../../server/services/secret-tokens.js';
import { SESSION_COOKIE_NAME } from '../../../server/session.js';
import type { Config } from '../../../server/config.js';
import { addMember, createClub, createLivestock, createPlan, createReading, createTank, createUser } from '../helpers/factories.js';

export const ACTORS = ['anonymous', 'keeper', 'member', 'mentor', 'organizerA', 'organizerB', 'admin'] as const;
export type Actor = (typeof ACTORS)[number];
export type SignedInActor = Exclude<Actor, 'anonymous'>;

/**
 * The world every matrix test starts from (fresh per test): club A (organizer, mentor, member),
 * club B (its organizer), a keeper in no club, and a site admin. The member and the keeper
 * each own a tank with livestock, a reading and a plan; organizer B owns one too.
 */
export interface Fixture {
  users: Record<SignedInActor, { id: string; email: string }>;
  clubA: string;
  clubB: string;
  /** Tank ids by owner. */
  tanks: { member: string; keeper: string; organizerB: string };
  readings: { member: string; keeper: string; organizerB: string };
  livestock: { member: string; keeper: string; organizerB: string };
  plans: { member: string; keeper: string; organizerB: string };
  /** A valid, unused password-reset token of the member. */
  resetToken: string;
  /** Cookie header for each signed-in actor. */
  cookies: Record<SignedInActor, string>;
  /** Ids the actor has no business seeing (other people's tanks, readings, plans; other clubs). */
  foreignIds(actor: Actor): string[];
  /** Club A's sharing and teaching objects (see buildFixture). */
  extra: {
    /** The member's plan shared with club A, with one mentor comment. */
    planShare: string;
    comment: string;
    /** A lesson in club A written by the mentor. */
    lesson: string;
    /** The member's read-only link to their plan, and its token. */
    shareLink: string;
    /** The mentor's read-only link to club A's lesson. */
    lessonLink: string;
    shareLinkToken: string;
    /** A live invite to club A for an address with no account. */
    inviteToken: string;
    /** That invite's id (organizer A lists and revokes it). */
    invite: string;
    /** The member's unsubscribe token (HMAC of the user id). */
    unsubscribeToken: string;
  };
  /** A valid scenario in the engine's format (the first example). */
  scenario: unknown;
}

/** Tests run from the repository root (vitest's root). */
export const EXAMPLE_SCENARIO = JSON.parse(fs.readFileSync(path.resolve(process.cwd(), 'simulation/examples/new-tank-startup.json'), 'utf8'));

/** express-session's signed cookie: `s:` + id + `.` + base64 HMAC-SHA256 without padding. */
function signedCookie(sid: string, secret: string): string {
  const mac = createHmac('sha256', secret).update(sid).digest('base64').replace(/=+$/, '');
  return `${SESSION_COOKIE_NAME}=${encodeURIComponent(`s:${sid}.${mac}`)}`;
}

/**
 * A signed-in session written straight into the store (as `startUserSession` would leave it),
 * so 400 matrix tests need no bcrypt comparisons (~0.2 s each at cost 12).
 */
async function forgeSession(ds: DataSource, secret: string, userId: string): Promise<string> {
  const sid = randomBytes(24).toString('base64url');
  const expires = new Date(Date.now() + 60 * 60 * 1000);
  const sess = {
    cookie: { originalMaxAge: 3_600_000, expires: expires.toISOString(), httpOnly: true, path: '/', sameSite: 'lax' },
    userId,
    createdAt: Date.now(),
  };
  await ds.query(`INSERT INTO "session" (sid, sess, expire) VALUES ($1, $2, $3)`, [sid, JSON.stringify(sess), expires]);
  return signedCookie(sid, secret);
}

/** `config`: the app's, for its session secret (cookies) and unsubscribe key. */
export async function buildFixture(ds: DataSource, config: Pick<Config, 'session' | 'unsubscribeSecret'>): Promise<Fixture> {
  const secret = config.session.secret;
  const mk = (email: string, role: 'user' | 'admin' = 'user') => createUser(ds, { email, role });
  const [keeper, member, mentor, organizerA, organizerB, admin] = await Promise.all([
    mk('keeper@example.org'),
    mk('member@example.org'),
    mk('mentor@example.org'),
    mk('organizer.a@example.org'),
    mk('organizer.b@example.org'),
    mk('admin@example.org', 'admin'),
  ]);
  const [clubA, clubB] = await Promise.all([createClub(ds, { name: 'Club A' }), createClub(ds, { name: 'Club B' })]);
  await Promise.all([
    addMember(ds, clubA.id, organizerA.id, 'organizer'),
    addMember(ds, clubA.id, mentor.id, 'mentor'),
    addMember(ds, clubA.id, member.id, 'member'),
    addMember(ds, clubB.id, organizerB.id, 'organizer'),
  ]);
  const own = async (userId: string) => {
    // No routine water changes: with them, removal advice and the capacity test currently
    // answer 400 for any tank (their events outrun the engine's shorter horizon; reported).
    const tank = await createTank(ds, userId, {
      setup: { filter: { kind: 'canister', mediaVolumeL: 1.5 }, substrate: { grain: 'sand', depthCm: 4 }, plants: 'light', routineWaterChange: { percent: 0, everyDays: 7 } } as never,
    });
    const [reading, fish, plan] = await Promise.all([createReading(ds, tank.id), createLivestock(ds, tank.id), createPlan(ds, tank.id)]);
    return { tank: tank.id, reading: reading.id, fish: fish.id, plan: plan.id };
  };
  const [m, k, b] = await Promise.all([own(member.id), own(keeper.id), own(organizerB.id)]);
  // A second test two days back, so the member's tank has enough to calibrate on.
  await createReading(ds, m.tank, { takenAt: new Date(Date.now() - 2 * 86_400_000), tanMgN: 0.05, no2MgN: 0 });

  const resetToken = randomBytes(32).toString('base64url');
  await ds.getRepository(PasswordResetToken).save(
    ds.getRepository(PasswordResetToken).create({
      userId: member.id,
      tokenHash: createHash('sha256').update(resetToken).digest('hex'),
      expiresAt: new Date(Date.now() + 30 * 60 * 1000),
    }),
  );

  // Club A's sharing and teaching objects.
  const planShare = await ds.getRepository(ClubShare).save(
    ds.getRepository(ClubShare).create({ clubId: clubA.id, ownerId: member.id, itemType: 'plan', itemId: m.plan }),
  );
  const comment = await ds.getRepository(PlanComment).save(
    ds.getRepository(PlanComment).create({ shareId: planShare.id, authorId: mentor.id, body: 'Test nitrite on day 5.' }),
  );
  const lesson = await ds.getRepository(Lesson).save(
    ds.getRepository(Lesson).create({
      clubId: clubA.id,
      authorId: mentor.id,
      title: 'Why ammonia climbs',
      summary: '',
      kind: 'single',
      scenario: EXAMPLE_SCENARIO,
      stagedScenario: null,
      steps: [{ title: 'Start', body: 'Watch the first week.' }],
    }),
  );
  const shareLinkToken = newLinkToken();
  const inAMonth = new Date(Date.now() + 30 * 86_400_000);
  const shareLink = await ds.getRepository(ShareLink).save(
    ds.getRepository(ShareLink).create({ tokenHash: sha256Hex(shareLinkToken), itemType: 'plan', itemId: m.plan, createdBy: member.id, expiresAt: inAMonth, revokedAt: null }),
  );
  // The mentor's link to the lesson: club A's organizer may revoke it too.
  const lessonLink = await ds.getRepository(ShareLink).save(
    ds.getRepository(ShareLink).create({ tokenHash: sha256Hex(newLinkToken()), itemType: 'lesson', itemId: lesson.id, createdBy: mentor.id, expiresAt: inAMonth, revokedAt: null }),
  );
  const inviteToken = newLinkToken();
  const invite = await ds.getRepository(ClubInvite).save(
    ds.getRepository(ClubInvite).create({
      clubId: clubA.id,
      email: 'invitee@example.org',
      tokenHash: sha256Hex(inviteToken),
      invitedBy: organizerA.id,
      expiresAt: new Date(Date.now() + 86_400_000),
      usedAt: null,
    }),
  );

  const users = { keeper, member, mentor, organizerA, organizerB, admin };
  const cookieList = await Promise.all(Object.values(users).map((u) => forgeSession(ds, secret, u.id)));
  const cookies = Object.fromEntries(Object.keys(users).map((k2, i) => [k2, cookieList[i]])) as Record<SignedInActor, string>;

  const owned: Record<Actor, string[]> = {
    anonymous: [],
    keeper: Object.values(k),
    member: Object.values(m),
    mentor: [],
    organizerA: [],
    organizerB: Object.values(b),
    admin: [],
  };
  const clubsOf: Record<Actor, string[]> = {
    anonymous: [],
    keeper: [],
    member: [clubA.id],
    mentor: [clubA.id],
    organizerA: [clubA.id],
    organizerB: [clubB.id],
    admin: [],
  };
  // Club A's objects are seen by club A's people only; the lesson and share by its members.
  for (const a of ['member', 'mentor', 'organizerA'] as Actor[]) owned[a].push(lesson.id, planShare.id, comment.id);
  owned.member.push(shareLink.id);
  owned.mentor.push(lessonLink.id);
  owned.organizerA.push(lessonLink.id);
  owned.organizerA.push(invite.id);
  const allObjects = [...Object.values(m), ...Object.values(k), ...Object.values(b), lesson.id, planShare.id, comment.id, shareLink.id, lessonLink.id, invite.id];
  return {
    users: Object.fromEntries(Object.entries(users).map(([k2, u]) => [k2, { id: u.id, email: u.email }])) as Fixture['users'],
    clubA: clubA.id,
    clubB: clubB.id,
    tanks: { member: m.tank, keeper: k.tank, organizerB: b.tank },
    readings: { member: m.reading, keeper: k.reading, organizerB: b.reading },
    livestock: { member: m.fish, keeper: k.fish, organizerB: b.fish },
    plans: { member: m.plan, keeper: k.plan, organizerB: b.plan },
    resetToken,
    cookies,
    foreignIds: (actor) => [
      ...allObjects.filter((id) => !owned[actor].includes(id)),
      ...[clubA.id, clubB.id].filter((id) => !clubsOf[actor].includes(id)),
    ],
    extra: {
      planShare: planShare.id,
      comment: comment.id,
      lesson: lesson.id,
      shareLink: shareLink.id,
      lessonLink: lessonLink.id,
      shareLinkToken,
      inviteToken,
      invite: invite.id,
      unsubscribeToken: signPayload(config.unsubscribeSecret, UNSUBSCRIBE_PURPOSE, member.id),
    },
    scenario: EXAMPLE_SCENARIO,
  };
}

/** Tables whose contents a denied request must leave exactly as they were. */
const VOLATILE = new Set(['session', 'migrations', 'typeorm_metadata', 'idempotency_keys']);

/**
 * One digest of every application table (rows sorted by their text form). `session` is left
 * out: rolling sessions rewrite their expiry on every request, allowed or not.
 */
export async function databaseDigest(ds: DataSource): Promise<string> {
  const tables: { table_name: string }[] = await ds.query(
    `SELECT table_name FROM information_schema.tables WHERE table_schema = 'public' AND table_type = 'BASE TABLE' ORDER BY table_name`,
  );
  const parts: string[] = [];
  for (const { table_name: t } of tables) {
    if (VOLATILE.has(t) || t.startsWith('pgboss')) continue;
    const [row] = await ds.query(`SELECT count(*)::int AS n, coalesce(md5(string_agg(x::text, '|' ORDER BY x::text)), '') AS h FROM "${t}" x`);
    parts.push(`${t}:${row.n}:${row.h}`);
  }
  return parts.join('\n');
}
