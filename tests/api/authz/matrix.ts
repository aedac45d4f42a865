import type { Actor, Fixture } from './fixture.js';

/** What the request should get: a status, or `ok` for any 2xx. */
export type Outcome = 'ok' | 401 | 403 | 404 | 400 | 409 | 422;

/** A CSV upload of one test (the export's own column names). */
const CSV_ONE_TEST = 'taken_at,basis,total_ammonia,nitrite\r\n2026-01-07T10:00:00Z,N,0.3,0.1\r\n';

export interface MatrixRow {
  /** The request to send: path with ids filled in, and an optional JSON body. */
  request(fx: Fixture, actor: Actor): { path: string; body?: unknown; csv?: string };
  expect: Record<Actor, Outcome>;
  /** Ids an allowed actor may legitimately see although not its own (e.g. a club's members). */
  mayShow?(fx: Fixture, actor: Actor): string[];
  /** Needs the fixture's extra objects built by this function (other routes' own tables). */
  why?: string;
}

// Shorthands for the common shapes of policy.
const all = (o: Outcome): Record<Actor, Outcome> => ({
  anonymous: o,
  keeper: o,
  member: o,
  mentor: o,
  organizerA: o,
  organizerB: o,
  admin: o,
});
/** Any signed-in person; anonymous → 401. */
const signedIn = (o: Outcome = 'ok') => ({ ...all(o), anonymous: 401 as Outcome });
/** Only the owner of the target (the member's tank etc.); others see 404 so ids cannot be probed. */
const ownerOnly = (o: Outcome = 'ok', owner: Actor = 'member') => ({ ...all(404), anonymous: 401 as Outcome, [owner]: o });
/** Members of club A in the given roles; others in no role → 404 (club existence not revealed), wrong role → 403. */
const clubA = (allowed: Actor[], wrongRole: Outcome = 403) => {
  const out = { ...all(404), anonymous: 401 as Outcome };
  for (const a of ['member', 'mentor', 'organizerA'] as Actor[]) out[a] = allowed.includes(a) ? 'ok' : wrongRole;
  return out;
};

/**
 * THE authorization matrix: every route the app answers × every actor. `matrix.test.ts`
 * enumerates the live routes and fails on any route missing here (or listed here but gone).
 * Keys are `METHOD path` exactly as Express sees them.
 */
export const MATRIX: Record<string, MatrixRow> = {
  // ── public: anyone, signed in or not ──────────────────────────────────────────────────
  'POST /api/auth/sign-up': {
    request: (_fx, actor) => ({ path: '/api/auth/sign-up', body: { email: `new.${actor}@example.org`, password: 'brackish-river-stone-9', displayName: 'New' } }),
    expect: all('ok'),
  },
  // An unknown link is refused the same way for everyone (a valid one is tested in auth.test.ts).
  'POST /api/auth/confirm-sign-up': { request: () => ({ path: '/api/auth/confirm-sign-up', body: { token: 'x'.repeat(43) } }), expect: all(400) },
  'POST /api/auth/sign-in': {
    request: (fx) => ({ path: '/api/auth/sign-in', body: { email: fx.users.keeper.email, password: 'tidal-moss-lantern-42' } }),
    expect: all('ok'),
    // Signing in as the keeper shows the keeper's own data, whoever was signed in before.
    mayShow: (fx) => [...fx.foreignIds('anonymous').filter((id) => !fx.foreignIds('keeper').includes(id)), fx.users.keeper.email],
  },
  'POST /api/auth/sign-out': { request: () => ({ path: '/api/auth/sign-out' }), expect: all('ok') },
  'POST /api/auth/forgot-password': {
    request: (fx) => ({ path: '/api/auth/forgot-password', body: { email: fx.users.member.email } }),
    expect: all('ok'),
  },
  'POST /api/auth/reset-password': {
    request: (fx) => ({ path: '/api/auth/reset-password', body: { token: fx.resetToken, password: 'brackish-river-stone-9' } }),
    expect: all('ok'),
  },
  'GET /api/health': { request: () => ({ path: '/api/health' }), expect: all('ok') },
  // Development outbox (DEV_OUTBOX=on): answers only a direct client on this machine (supertest is one).
  'GET /api/dev/outbox': { request: () => ({ path: '/api/dev/outbox' }), expect: all('ok') },
  'GET /{*splat}': { request: () => ({ path: '/tanks/anything' }), expect: all('ok') },

  // ── the signed-in person ─────────────────────────────────────────────────────────────
  'GET /api/me': { request: () => ({ path: '/api/me' }), expect: signedIn() },

  // ── tanks: the owner only ────────────────────────────────────────────────────────────
  'GET /api/tanks': { request: () => ({ path: '/api/tanks' }), expect: signedIn() },
  'GET /api/tanks/:tankId': { request: (fx) => ({ path: `/api/tanks/${fx.tanks.member}` }), expect: ownerOnly() },

  'GET /api/me/preferences': { request: () => ({ path: '/api/me/preferences' }), expect: signedIn() },
  'PUT /api/me/preferences': {
    request: () => ({ path: '/api/me/preferences', body: { volumeUnit: 'USgal', temperatureUnit: 'F', nitrogenBasis: 'ion', reminders: false } }),
    expect: signedIn(),
  },
  // Token links: the token is the key, so everyone holding it gets the same answer.
  'GET /api/unsubscribe/:token': { request: (fx) => ({ path: `/api/unsubscribe/${fx.extra.unsubscribeToken}` }), expect: all('ok') },
  'POST /api/unsubscribe/:token': { request: (fx) => ({ path: `/api/unsubscribe/${fx.extra.unsubscribeToken}` }), expect: all('ok') },
  'GET /api/share/:token': { request: (fx) => ({ path: `/api/share/${fx.extra.shareLinkToken}` }), expect: all('ok') },
  'GET /api/invites/:token': { request: (fx) => ({ path: `/api/invites/${fx.extra.inviteToken}` }), expect: all('ok'), mayShow: (fx) => [fx.clubA] },
  // The invite is for an address none of the actors has: signed in → 403 (a forwarded link
  // lets nobody else in); anonymous without name and password → 400 (account details needed).
  'POST /api/invites/:token/accept': {
    request: (fx) => ({ path: `/api/invites/${fx.extra.inviteToken}/accept`, body: {} }),
    expect: { ...all(403), anonymous: 400 },
  },

  // ── tanks, livestock, readings: the owner only ──────────────────────────────────────
  'POST /api/tanks': { request: () => ({ path: '/api/tanks', body: { name: 'Matrix tank', volumeL: 54 } }), expect: signedIn() },
  'PATCH /api/tanks/:tankId': { request: (fx) => ({ path: `/api/tanks/${fx.tanks.member}`, body: { name: 'Renamed' } }), expect: ownerOnly() },
  'DELETE /api/tanks/:tankId': { request: (fx) => ({ path: `/api/tanks/${fx.tanks.member}` }), expect: ownerOnly() },
  'POST /api/tanks/:tankId/livestock': {
    request: (fx) => ({ path: `/api/tanks/${fx.tanks.member}/livestock`, body: { speciesId: 'neon-tetra', count: 2 } }),
    expect: ownerOnly(),
  },
  'PATCH /api/tanks/:tankId/livestock/:livestockId': {
    request: (fx) => ({ path: `/api/tanks/${fx.tanks.member}/livestock/${fx.livestock.member}`, body: { count: 3 } }),
    expect: ownerOnly(),
  },
  'DELETE /api/tanks/:tankId/livestock/:livestockId': {
    request: (fx) => ({ path: `/api/tanks/${fx.tanks.member}/livestock/${fx.livestock.member}` }),
    expect: ownerOnly(),
  },
  'GET /api/tanks/:tankId/readings': { request: (fx) => ({ path: `/api/tanks/${fx.tanks.member}/readings` }), expect: ownerOnly() },
  'POST /api/tanks/:tankId/readings': {
    request: (fx) => ({ path: `/api/tanks/${fx.tanks.member}/readings`, body: { takenAt: '2026-01-05T10:00:00Z', tan: 0.2 } }),
    expect: ownerOnly(),
  },
  'GET /api/tanks/:tankId/readings/export.csv': { request: (fx) => ({ path: `/api/tanks/${fx.tanks.member}/readings/export.csv` }), expect: ownerOnly() },
  'POST /api/tanks/:tankId/readings/import/preview': {
    request: (fx) => ({ path: `/api/tanks/${fx.tanks.member}/readings/import/preview`, csv: CSV_ONE_TEST }),
    expect: ownerOnly(),
  },
  'POST /api/tanks/:tankId/readings/import/commit': {
    request: (fx) => ({ path: `/api/tanks/${fx.tanks.member}/readings/import/commit`, csv: CSV_ONE_TEST }),
    expect: ownerOnly(),
  },
  'DELETE /api/tanks/:tankId/readings/:readingId': {
    request: (fx) => ({ path: `/api/tanks/${fx.tanks.member}/readings/${fx.readings.member}` }),
    expect: ownerOnly(),
  },

  // ── plans, forecasts, advice: the owner of the tank/plan only ───────────────────────
  'GET /api/plans': { request: () => ({ path: '/api/plans' }), expect: signedIn() },
  'GET /api/tanks/:tankId/plans': { request: (fx) => ({ path: `/api/tanks/${fx.tanks.member}/plans` }), expect: ownerOnly() },
  'POST /api/tanks/:tankId/plans': {
    request: (fx) => ({ path: `/api/tanks/${fx.tanks.member}/plans`, body: { name: 'Matrix plan', startDate: '2026-02-01' } }),
    expect: ownerOnly(),
  },
  'GET /api/plans/:planId': { request: (fx) => ({ path: `/api/plans/${fx.plans.member}` }), expect: ownerOnly() },
  'PATCH /api/plans/:planId': { request: (fx) => ({ path: `/api/plans/${fx.plans.member}`, body: { name: 'Renamed plan' } }), expect: ownerOnly() },
  // The fixture's plan is a draft with one event: it starts, but there is nothing to finish yet (409).
  'POST /api/plans/:planId/start': { request: (fx) => ({ path: `/api/plans/${fx.plans.member}/start`, body: {} }), expect: ownerOnly() },
  'POST /api/plans/:planId/finish': { request: (fx) => ({ path: `/api/plans/${fx.plans.member}/finish`, body: {} }), expect: ownerOnly(409) },
  'GET /api/plans/:planId/readings': { request: (fx) => ({ path: `/api/plans/${fx.plans.member}/readings` }), expect: ownerOnly() },
  'DELETE /api/plans/:planId': { request: (fx) => ({ path: `/api/plans/${fx.plans.member}` }), expect: ownerOnly() },
  'POST /api/plans/:planId/forecast': { request: (fx) => ({ path: `/api/plans/${fx.plans.member}/forecast` }), expect: ownerOnly() },
  'POST /api/tanks/:tankId/advice/addition': {
    request: (fx) => ({ path: `/api/tanks/${fx.tanks.member}/advice/addition`, body: { fish: { species: 'neon-tetra', count: 4 }, searchDays: 30 } }),
    expect: ownerOnly(),
  },
  'POST /api/tanks/:tankId/advice/removal': {
    request: (fx) => ({ path: `/api/tanks/${fx.tanks.member}/advice/removal`, body: { removals: [{ species: 'neon-tetra', count: 2 }], restockDay: 10 } }),
    expect: ownerOnly(),
  },
  'POST /api/tanks/:tankId/advice/rescue': {
    request: (fx) => ({ path: `/api/tanks/${fx.tanks.member}/advice/rescue`, body: { horizonDays: 14 } }),
    expect: ownerOnly(),
  },
  'POST /api/tanks/:tankId/ensemble': {
    request: (fx) => ({ path: `/api/tanks/${fx.tanks.member}/ensemble`, body: { members: 64 } }),
    expect: ownerOnly(),
  },
  'POST /api/tanks/:tankId/calibration': {
    request: (fx) => ({ path: `/api/tanks/${fx.tanks.member}/calibration`, body: { sinceDays: 30 } }),
    expect: ownerOnly(),
  },
  // No fit has run on the fixture's tank: the owner's apply finds no such fit (404) — others never reach it.
  'POST /api/tanks/:tankId/fit': {
    request: (fx) => ({ path: `/api/tanks/${fx.tanks.member}/fit`, body: { fitId: '00000000-0000-4000-8000-000000000000' } }),
    expect: ownerOnly(404),
  },
  'DELETE /api/tanks/:tankId/fit': { request: (fx) => ({ path: `/api/tanks/${fx.tanks.member}/fit` }), expect: ownerOnly() },
  'POST /api/tanks/:tankId/capacity-test': { request: (fx) => ({ path: `/api/tanks/${fx.tanks.member}/capacity-test`, body: {} }), expect: ownerOnly() },

  // ── clubs: outside the club → 404, wrong role → 403 ─────────────────────────────────
  'GET /api/clubs': { request: () => ({ path: '/api/clubs' }), expect: signedIn() },
  'POST /api/clubs': { request: () => ({ path: '/api/clubs', body: { name: 'Matrix club' } }), expect: signedIn() },
  'GET /api/clubs/:clubId': {
    request: (fx) => ({ path: `/api/clubs/${fx.clubA}` }),
    expect: clubA(['member', 'mentor', 'organizerA']),
    mayShow: (fx) => [fx.clubA],
  },
  'POST /api/clubs/:clubId/invites': {
    request: (fx) => ({ path: `/api/clubs/${fx.clubA}/invites`, body: { email: 'new.person@example.org' } }),
    expect: clubA(['organizerA']),
  },
  // Pending invites: organizers of club A only (the list carries its invite's id and address).
  'GET /api/clubs/:clubId/invites': {
    request: (fx) => ({ path: `/api/clubs/${fx.clubA}/invites` }),
    expect: clubA(['organizerA']),
  },
  'DELETE /api/clubs/:clubId/invites/:inviteId': {
    request: (fx) => ({ path: `/api/clubs/${fx.clubA}/invites/${fx.extra.invite}` }),
    expect: clubA(['organizerA']),
  },
  'PUT /api/clubs/:clubId/members/:userId': {
    request: (fx) => ({ path: `/api/clubs/${fx.clubA}/members/${fx.users.member.id}`, body: { role: 'mentor' } }),
    expect: clubA(['organizerA']),
  },
  'DELETE /api/clubs/:clubId/members/:userId': {
    request: (fx) => ({ path: `/api/clubs/${fx.clubA}/members/${fx.users.member.id}` }),
    expect: clubA(['organizerA']),
  },
  'POST /api/clubs/:clubId/leave': {
    request: (fx) => ({ path: `/api/clubs/${fx.clubA}/leave` }),
    // The club's only organizer cannot leave it without a successor (a 409, past the check).
    expect: { ...clubA(['member', 'mentor', 'organizerA']), organizerA: 409 },
  },
  'GET /api/clubs/:clubId/shares': {
    request: (fx) => ({ path: `/api/clubs/${fx.clubA}/shares` }),
    expect: clubA(['member', 'mentor', 'organizerA']),
    mayShow: (fx) => [fx.clubA, fx.tanks.member, fx.plans.member],
  },
  'POST /api/clubs/:clubId/shares': {
    // Share the caller's own tank: only the member has one in club A.
    request: (fx) => ({ path: `/api/clubs/${fx.clubA}/shares`, body: { itemType: 'tank', itemId: fx.tanks.member } }),
    expect: { ...clubA(['member', 'mentor', 'organizerA']), mentor: 404, organizerA: 404 },
  },
  'GET /api/clubs/:clubId/shares/:shareId': {
    request: (fx) => ({ path: `/api/clubs/${fx.clubA}/shares/${fx.extra.planShare}` }),
    expect: clubA(['member', 'mentor', 'organizerA']),
    mayShow: (fx) => [fx.clubA, fx.tanks.member, fx.plans.member, fx.livestock.member, fx.readings.member],
  },
  'DELETE /api/clubs/:clubId/shares/:shareId': {
    request: (fx) => ({ path: `/api/clubs/${fx.clubA}/shares/${fx.extra.planShare}` }),
    expect: clubA(['member', 'organizerA']),
  },
  'GET /api/clubs/:clubId/shares/:shareId/comments': {
    request: (fx) => ({ path: `/api/clubs/${fx.clubA}/shares/${fx.extra.planShare}/comments` }),
    expect: clubA(['member', 'mentor', 'organizerA']),
  },
  'POST /api/clubs/:clubId/shares/:shareId/comments': {
    request: (fx) => ({ path: `/api/clubs/${fx.clubA}/shares/${fx.extra.planShare}/comments`, body: { body: 'Looks steady.' } }),
    expect: clubA(['mentor', 'organizerA']),
  },

  // ── lessons: club A's people read; mentors and organizers write; author or organizer edit and delete
  'POST /api/clubs/:clubId/lessons': {
    request: (fx) => ({
      path: `/api/clubs/${fx.clubA}/lessons`,
      body: { title: 'Matrix lesson', scenario: fx.scenario, steps: [{ title: 'One', body: 'Read the forecast.' }] },
    }),
    expect: clubA(['mentor', 'organizerA']),
  },
  'GET /api/lessons': { request: () => ({ path: '/api/lessons' }), expect: signedIn(), mayShow: (fx) => [fx.clubA] },
  'GET /api/lessons/:lessonId': {
    request: (fx) => ({ path: `/api/lessons/${fx.extra.lesson}` }),
    expect: clubA(['member', 'mentor', 'organizerA']),
    mayShow: (fx) => [fx.clubA],
  },
  'PATCH /api/lessons/:lessonId': {
    request: (fx) => ({ path: `/api/lessons/${fx.extra.lesson}`, body: { title: 'Matrix lesson, reworded', steps: [{ title: 'One', body: 'Read the forecast again.' }] } }),
    expect: clubA(['mentor', 'organizerA']),
  },
  'DELETE /api/lessons/:lessonId': {
    request: (fx) => ({ path: `/api/lessons/${fx.extra.lesson}` }),
    expect: clubA(['mentor', 'organizerA']),
  },

  // ── read-only share links: the creator only ─────────────────────────────────────────
  'POST /api/share-links': {
    request: (fx) => ({ path: '/api/share-links', body: { itemType: 'plan', itemId: fx.plans.member } }),
    expect: ownerOnly(),
  },
  'GET /api/share-links': {
    request: (fx) => ({ path: `/api/share-links?itemType=plan&itemId=${fx.plans.member}` }),
    expect: ownerOnly(),
  },
  'DELETE /api/share-links/:linkId': { request: (fx) => ({ path: `/api/share-links/${fx.extra.shareLink}` }), expect: ownerOnly() },
};

/** Nobody gets it: 404 to every signed-in actor (ids cannot be probed), 401 signed out. */
const nobody = () => ({ ...all(404), anonymous: 401 as Outcome });

/**
 * More rows for routes already in MATRIX: a parent the actor may reach with a child that is
 * another tenant's (own tank + someone else's reading; club B's path + club A's share), and a
 * club's lesson link. Keys are `METHOD path — situation`; the part before ` — ` must be a
 * MATRIX key. The actor named in the situation owns the parent, and still gets 404.
 */
export const CROSS_TENANT: Record<string, MatrixRow> = {
  'DELETE /api/tanks/:tankId/readings/:readingId — the keeper’s tank, the member’s reading': {
    request: (fx) => ({ path: `/api/tanks/${fx.tanks.keeper}/readings/${fx.readings.member}` }),
    expect: nobody(),
  },
  'PATCH /api/tanks/:tankId/livestock/:livestockId — the keeper’s tank, the member’s fish': {
    request: (fx) => ({ path: `/api/tanks/${fx.tanks.keeper}/livestock/${fx.livestock.member}`, body: { count: 3 } }),
    expect: nobody(),
  },
  'DELETE /api/tanks/:tankId/livestock/:livestockId — the keeper’s tank, the member’s fish': {
    request: (fx) => ({ path: `/api/tanks/${fx.tanks.keeper}/livestock/${fx.livestock.member}` }),
    expect: nobody(),
  },
  'GET /api/clubs/:clubId/shares/:shareId — club B, club A’s share': {
    request: (fx) => ({ path: `/api/clubs/${fx.clubB}/shares/${fx.extra.planShare}` }),
    expect: nobody(),
  },
  'DELETE /api/clubs/:clubId/shares/:shareId — club B, club A’s share': {
    request: (fx) => ({ path: `/api/clubs/${fx.clubB}/shares/${fx.extra.planShare}` }),
    expect: nobody(),
  },
  'GET /api/clubs/:clubId/shares/:shareId/comments — club B, club A’s share': {
    request: (fx) => ({ path: `/api/clubs/${fx.clubB}/shares/${fx.extra.planShare}/comments` }),
    expect: nobody(),
  },
  'POST /api/clubs/:clubId/shares/:shareId/comments — club B, club A’s share': {
    request: (fx) => ({ path: `/api/clubs/${fx.clubB}/shares/${fx.extra.planShare}/comments`, body: { body: 'From the other club.' } }),
    expect: nobody(),
  },
  'POST /api/clubs/:clubId/lessons — club B, from club A’s share': {
    request: (fx) => ({ path: `/api/clubs/${fx.clubB}/lessons`, body: { title: 'Borrowed', fromShareId: fx.extra.planShare, steps: [{ title: 'One', body: 'Read it.' }] } }),
    expect: nobody(),
  },
  'DELETE /api/clubs/:clubId/invites/:inviteId — club B, club A’s invite': {
    request: (fx) => ({ path: `/api/clubs/${fx.clubB}/invites/${fx.extra.invite}` }),
    expect: nobody(),
  },
  'PUT /api/clubs/:clubId/members/:userId — club B, club A’s member': {
    request: (fx) => ({ path: `/api/clubs/${fx.clubB}/members/${fx.users.member.id}`, body: { role: 'mentor' } }),
    expect: nobody(),
  },
  'DELETE /api/clubs/:clubId/members/:userId — club B, club A’s member': {
    request: (fx) => ({ path: `/api/clubs/${fx.clubB}/members/${fx.users.member.id}` }),
    expect: nobody(),
  },
  // A lesson's link is the club's: its maker (the mentor) and club A's organizer manage it.
  'GET /api/share-links — club A’s lesson link': {
    request: (fx) => ({ path: `/api/share-links?itemType=lesson&itemId=${fx.extra.lesson}` }),
    expect: { ...nobody(), mentor: 'ok', organizerA: 'ok' },
    mayShow: (fx) => [fx.extra.lesson],
  },
  'DELETE /api/share-links/:linkId — club A’s lesson link': {
    request: (fx) => ({ path: `/api/share-links/${fx.extra.lessonLink}` }),
    expect: { ...nobody(), mentor: 'ok', organizerA: 'ok' },
  },
};

export const shorthands = { all, signedIn, ownerOnly, clubA, nobody };
