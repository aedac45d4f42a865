import querystring from 'node:querystring';
import fc from 'fast-check';
import request from 'supertest';
import type { DataSource } from 'typeorm';
import type { z } from 'zod';
import { afterAll, describe, expect, it } from 'vitest';
import { CSRF_HEADER, CSRF_HEADER_VALUE } from '../../../shared/api-error.js';
import { forgotPasswordSchema, resetPasswordSchema, signInSchema, signUpSchema } from '../../../shared/schemas/auth.js';
import { acceptInviteSchema, createClubSchema, createCommentSchema, createInviteSchema, createShareSchema, memberRoleSchema } from '../../../shared/schemas/club.js';
import { createLessonSchema, updateLessonTextSchema } from '../../../shared/schemas/lesson.js';
import {
  additionAdviceBodySchema,
  calibrationBodySchema,
  capacityTestBodySchema,
  ensembleBodySchema,
  planCreateSchema,
  planPatchSchema,
  removalAdviceBodySchema,
  rescueAdviceBodySchema,
} from '../../../shared/schemas/plan.js';
import { createShareLinkSchema } from '../../../shared/schemas/share.js';
import { preferencesSchema } from '../../../shared/schemas/preferences.js';
import { readingCreateSchema, readingsQuerySchema } from '../../../shared/schemas/reading.js';
import { livestockCreateSchema, tankCreateSchema, tankPatchSchema } from '../../../shared/schemas/tank.js';
import { useTestApp } from '../helpers/test-app.js';
import { EXAMPLE_SCENARIO, buildFixture, type Fixture, type SignedInActor } from '../authz/fixture.js';
import { FUZZ_SEED, caseCounter } from './seed.js';

const ctx = useTestApp();
afterAll(() => console.log(`[fuzz] HTTP bodies and queries: ${caseCounter.n} cases, seed ${FUZZ_SEED}`));

/** One query: a digest of every application table (one round trip, so thousands of cases stay fast). */
async function digestQuery(ds: DataSource): Promise<string> {
  const tables: { table_name: string }[] = await ds.query(
    `SELECT table_name FROM information_schema.tables WHERE table_schema = 'public' AND table_type = 'BASE TABLE'
       AND table_name NOT IN ('session', 'migrations', 'idempotency_keys', 'sign_in_failures', 'password_reset_tokens') ORDER BY 1`,
  );
  const parts = tables.map(({ table_name: t }) => `(SELECT coalesce(md5(string_agg(x::text, '|' ORDER BY x::text)), '-') FROM "${t}" x)`);
  return `SELECT md5(concat_ws(',', ${parts.join(', ')})) AS h`;
}

interface Target {
  name: string;
  method: 'post' | 'put' | 'patch' | 'get';
  path(fx: Fixture): string;
  schema: z.ZodType;
  /** A body the schema accepts, mutated by the fuzzer. */
  valid: Record<string, unknown> | ((fx: Fixture) => Record<string, unknown>);
  /**
   * Bodies the schema accepts are not sent: the route would hash a password (bcrypt cost 12,
   * ~0.2 s) or run an advice search (0.1–1 s). Refusals, the point here, come before either.
   */
  skipAccepted?: boolean;
  /** Who sends it (default: the member, owner of the fixture's tank and plan). */
  actor?: SignedInActor;
  runs?: number;
  /** The route may answer 400 for reasons past the schema (say, an unknown reset token). */
  semantic400?: string[];
  anonymous?: boolean;
}

const TARGETS: Target[] = [
  { name: 'sign-up', method: 'post', path: () => '/api/auth/sign-up', schema: signUpSchema, valid: { email: 'a@example.org', password: 'brackish-river-stone-9', displayName: 'A' }, skipAccepted: true, anonymous: true },
  { name: 'sign-in', method: 'post', path: () => '/api/auth/sign-in', schema: signInSchema, valid: { email: 'a@example.org', password: 'x' }, skipAccepted: true, anonymous: true },
  { name: 'forgot-password', method: 'post', path: () => '/api/auth/forgot-password', schema: forgotPasswordSchema, valid: { email: 'a@example.org' }, anonymous: true },
  { name: 'reset-password', method: 'post', path: () => '/api/auth/reset-password', schema: resetPasswordSchema, valid: { token: 'x'.repeat(40), password: 'brackish-river-stone-9' }, skipAccepted: true, anonymous: true },
  { name: 'tank create', method: 'post', path: () => '/api/tanks', schema: tankCreateSchema, valid: { name: 'Fuzz tank', volumeL: 60, temperatureC: 24, ph: 7, notes: 'n' } },
  { name: 'tank patch', method: 'patch', path: (fx) => `/api/tanks/${fx.tanks.member}`, schema: tankPatchSchema, valid: { name: 'Renamed', volumeL: 80, tapWater: { tanMgN: 0, no2MgN: 0, no3MgN: 1 } } },
  { name: 'reading create', method: 'post', path: (fx) => `/api/tanks/${fx.tanks.member}/readings`, schema: readingCreateSchema, valid: { takenAt: '2026-01-02T10:00:00Z', basis: 'N', tan: 0.5, no2: 0.1, ph: 7.1, note: 'ok' } },
  { name: 'livestock create', method: 'post', path: (fx) => `/api/tanks/${fx.tanks.member}/livestock`, schema: livestockCreateSchema, valid: { speciesId: 'neon-tetra', count: 4 }, semantic400: ['speciesId'] },
  { name: 'preferences', method: 'put', path: () => '/api/me/preferences', schema: preferencesSchema, valid: { volumeUnit: 'L', temperatureUnit: 'C', nitrogenBasis: 'N', reminders: false } },
  { name: 'plan create', method: 'post', path: (fx) => `/api/tanks/${fx.tanks.member}/plans`, schema: planCreateSchema, valid: { name: 'P', startDate: '2026-02-01', events: [{ type: 'water-change', day: 3, percent: 30 }] } },
  { name: 'plan patch', method: 'patch', path: (fx) => `/api/plans/${fx.plans.member}`, schema: planPatchSchema, valid: { name: 'P2', events: [{ type: 'water-change', day: 2, percent: 20 }] } },
  { name: 'club create', method: 'post', path: () => '/api/clubs', schema: createClubSchema, valid: { name: 'Fuzz club' } },
  { name: 'member role', method: 'put', path: (fx) => `/api/clubs/${fx.clubA}/members/${fx.users.member.id}`, schema: memberRoleSchema, valid: { role: 'mentor' }, actor: 'organizerA', runs: 150 },
  { name: 'invite create', method: 'post', path: (fx) => `/api/clubs/${fx.clubA}/invites`, schema: createInviteSchema, valid: { email: 'friend@example.org' }, actor: 'organizerA', runs: 150 },
  { name: 'club share', method: 'post', path: (fx) => `/api/clubs/${fx.clubA}/shares`, schema: createShareSchema, valid: (fx) => ({ itemType: 'tank', itemId: fx.tanks.member }), runs: 150 },
  { name: 'comment', method: 'post', path: (fx) => `/api/clubs/${fx.clubA}/shares/${fx.extra.planShare}/comments`, schema: createCommentSchema, valid: { body: 'Looks fine.' }, actor: 'mentor', runs: 150 },
  { name: 'lesson create', method: 'post', path: (fx) => `/api/clubs/${fx.clubA}/lessons`, schema: createLessonSchema, valid: { title: 'Fuzz lesson', scenario: EXAMPLE_SCENARIO, steps: [{ title: 'A', body: 'B' }] }, actor: 'mentor', runs: 150 },
  { name: 'lesson words', method: 'patch', path: (fx) => `/api/lessons/${fx.extra.lesson}`, schema: updateLessonTextSchema, valid: { title: 'Fuzz lesson', summary: 'S', steps: [{ title: 'A', body: 'B' }] }, actor: 'mentor', runs: 150 },
  { name: 'share link', method: 'post', path: () => '/api/share-links', schema: createShareLinkSchema, valid: (fx) => ({ itemType: 'plan', itemId: fx.plans.member, expiresInDays: 7 }), runs: 150 },
  { name: 'invite accept', method: 'post', path: (fx) => `/api/invites/${fx.extra.inviteToken}/accept`, schema: acceptInviteSchema, valid: { displayName: 'New', password: 'brackish-river-stone-9' }, skipAccepted: true, anonymous: true, runs: 150 },
  { name: 'advice addition', method: 'post', path: (fx) => `/api/tanks/${fx.tanks.member}/advice/addition`, schema: additionAdviceBodySchema, valid: { fish: { species: 'neon-tetra', count: 4 } }, skipAccepted: true, runs: 150 },
  { name: 'advice removal', method: 'post', path: (fx) => `/api/tanks/${fx.tanks.member}/advice/removal`, schema: removalAdviceBodySchema, valid: { removals: [{ species: 'neon-tetra', count: 2 }], restockDay: 10 }, skipAccepted: true, runs: 150 },
  { name: 'advice rescue', method: 'post', path: (fx) => `/api/tanks/${fx.tanks.member}/advice/rescue`, schema: rescueAdviceBodySchema, valid: { horizonDays: 14, maxPercent: 50 }, skipAccepted: true, runs: 150 },
  { name: 'ensemble', method: 'post', path: (fx) => `/api/tanks/${fx.tanks.member}/ensemble`, schema: ensembleBodySchema, valid: { members: 64, seed: 1 }, skipAccepted: true, runs: 150 },
  { name: 'calibration', method: 'post', path: (fx) => `/api/tanks/${fx.tanks.member}/calibration`, schema: calibrationBodySchema, valid: { sinceDays: 30 }, skipAccepted: true, runs: 150 },
  { name: 'capacity test', method: 'post', path: (fx) => `/api/tanks/${fx.tanks.member}/capacity-test`, schema: capacityTestBodySchema, valid: { solution: { percentNH3: 10 } }, skipAccepted: true, runs: 150 },
];

/** Field names a mass-assignment attempt would try (OWASP ASVS 15.3.3). */
const SENSITIVE_KEYS = ['id', 'ownerId', 'owner_id', 'userId', 'role', 'passwordHash', 'tankId', 'createdAt', '__proto__', 'constructor'];

/** Bodies near a valid one (one field changed, dropped or added) or anything JSON at all. */
function bodyArbitrary(valid: Record<string, unknown>) {
  const keys = Object.keys(valid);
  const anyValue = fc.oneof(
    fc.jsonValue({ maxDepth: 2 }),
    fc.string({ maxLength: 40 }),
    fc.double(),
    fc.integer(),
    fc.constantFrom(null, true, '', ' ', '0', -1, 0, 1e308, -1e308, '2026-13-45T99:99:99Z', 'DROP TABLE users;--', '<script>x</script>'),
    fc.string({ minLength: 2000, maxLength: 20000 }),
  );
  return fc.oneof(
    { weight: 2, arbitrary: fc.jsonValue({ maxDepth: 3 }) },
    { weight: 4, arbitrary: fc.tuple(fc.constantFrom(...keys), anyValue).map(([k, v]) => ({ ...valid, [k]: v })) },
    { weight: 1, arbitrary: fc.constantFrom(...keys).map((k) => Object.fromEntries(Object.entries(valid).filter(([key]) => key !== k))) },
    // JSON.parse makes `__proto__` an own key (as a client's JSON would), and spreading keeps it.
    { weight: 2, arbitrary: fc.tuple(fc.constantFrom(...SENSITIVE_KEYS), anyValue).map(([k, v]) => ({ ...JSON.parse(`{${JSON.stringify(k)}:${JSON.stringify(v ?? null)}}`), ...valid })) },
    { weight: 1, arbitrary: fc.constant(valid) },
  );
}

const RUNS_PER_TARGET = Number(process.env.FUZZ_RUNS ?? 300);

describe('fuzzed JSON bodies (fast-check)', () => {
  for (const target of TARGETS) {
    it(`${target.method.toUpperCase()} ${target.name}: never 5xx; 400 exactly when the schema refuses; a 4xx writes nothing`, async () => {
      const ds = ctx.deps.dataSource;
      const fx = await buildFixture(ds, ctx.deps.config);
      const digestSql = await digestQuery(ds);
      const digest = async () => ((await ds.query(digestSql)) as { h: string }[])[0]!.h;
      const url = target.path(fx);
      const valid = typeof target.valid === 'function' ? target.valid(fx) : target.valid;
      const cookie = fx.cookies[target.actor ?? 'member'];

      await fc.assert(
        fc.asyncProperty(bodyArbitrary(valid), async (generated) => {
          // Judge the body as it travels: JSON turns ±Infinity and NaN into null.
          const wire = JSON.stringify(generated);
          const body: unknown = wire === undefined ? generated : JSON.parse(wire);
          const accepted = target.schema.safeParse(body).success;
          if (accepted && target.skipAccepted) return; // counted below as not sent
          caseCounter.n++;
          const before = await digest();
          let t = request(ctx.app)[target.method](url).set(CSRF_HEADER, CSRF_HEADER_VALUE).set('Content-Type', 'application/json');
          if (!target.anonymous) t = t.set('Cookie', cookie);
          const started = performance.now();
          const res = await t.send(JSON.stringify(body));
          const elapsed = performance.now() - started;
          const info = `${res.status} ${res.text.slice(0, 200)} ← ${JSON.stringify(body).slice(0, 200)}`;
          expect(res.status, info).toBeLessThan(500);
          expect(elapsed, info).toBeLessThan(2000);
          if (body === null || typeof body !== 'object') {
            // express.json() is strict: a bare string, number or boolean is not a request body.
            expect(res.status, info).toBe(400);
            expect(res.body.error.code, info).toBe('bad_request');
          } else if (!accepted) {
            expect(res.status, info).toBe(400);
            expect(res.body.error.code, info).toBe('validation');
            expect(Object.keys(res.body.error.fields ?? {}).length, info).toBeGreaterThan(0);
          } else if (res.status === 400) {
            expect(target.semantic400, info).toBeDefined();
            expect(Object.keys(res.body.error.fields ?? {}).every((f) => target.semantic400!.includes(f)), info).toBe(true);
          }
          if (res.status >= 400) expect(await digest(), `a ${res.status} wrote: ${info}`).toBe(before);
        }),
        { seed: FUZZ_SEED, numRuns: target.runs ?? RUNS_PER_TARGET },
      );
    });
  }

  it('GET readings query: never 5xx; 400 exactly when the query schema refuses', async () => {
    const ds = ctx.deps.dataSource;
    const fx = await buildFixture(ds, ctx.deps.config);
    const value = fc.oneof(fc.string({ maxLength: 12 }), fc.integer({ min: -5, max: 300 }).map(String), fc.constantFrom('1e3', '0x10', 'NaN', '', '2.5', ' 7'));
    const queryArb = fc.dictionary(fc.oneof(fc.constantFrom('page', 'pageSize'), fc.string({ minLength: 1, maxLength: 8 })), fc.oneof(value, fc.array(value, { minLength: 2, maxLength: 3 })), { maxKeys: 3 });
    await fc.assert(
      fc.asyncProperty(queryArb, async (query) => {
        caseCounter.n++;
        const qs = querystring.stringify(query);
        const accepted = readingsQuerySchema.safeParse(querystring.parse(qs)).success;
        const res = await request(ctx.app).get(`/api/tanks/${fx.tanks.member}/readings?${qs}`).set('Cookie', fx.cookies.member);
        const info = `${res.status} ${res.text.slice(0, 200)} ← ?${qs}`;
        expect(res.status, info).toBeLessThan(500);
        expect(res.status, info).toBe(accepted ? 200 : 400);
      }),
      { seed: FUZZ_SEED, numRuns: 500 },
    );
  });

  it('answers a body of 99 KB of text in one field with 400 fast, and 200 KB with 413', async () => {
    const fx = await buildFixture(ctx.deps.dataSource, ctx.deps.config);
    for (const target of TARGETS) {
      const valid = typeof target.valid === 'function' ? target.valid(fx) : target.valid;
      const field = Object.keys(valid)[0]!;
      for (const [size, status] of [[99_000, 400], [200_000, 413]] as const) {
        caseCounter.n++;
        let t = request(ctx.app)[target.method](target.path(fx)).set(CSRF_HEADER, CSRF_HEADER_VALUE);
        if (!target.anonymous) t = t.set('Cookie', fx.cookies[target.actor ?? 'member']);
        const started = performance.now();
        const res = await t.send({ ...valid, [field]: 'é'.repeat(size / 2) });
        expect(res.status, `${target.name} ${size}`).toBe(status);
        expect(performance.now() - started).toBeLessThan(1000);
      }
    }
  });
});
