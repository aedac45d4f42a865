import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import request from 'supertest';
import type { DataSource } from 'typeorm';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { CSRF_HEADER, CSRF_HEADER_VALUE } from '../../../shared/api-error.js';
import { createApp } from '../../../server/app.js';
import { loadConfig } from '../../../server/config.js';
import type { AppDeps } from '../../../server/deps.js';
import { memoryLogger } from '../../../server/logger.js';
import { startMailFake, type MailFake } from '../../../server/mail/fake-smtp.js';
import { buildDeps } from '../../../server/runtime.js';
import { ACTORS, buildFixture, type Actor, type Fixture } from './fixture.js';
import { CROSS_TENANT, MATRIX, type MatrixRow } from './matrix.js';
import { listRoutes } from './routes.js';

/**
 * Own setup (not useTestApp): that one empties the tables before every test, and here a
 * route's denied actors share one fixture — each denial is proven to write nothing, so the
 * fixture is still intact for the next. A fresh fixture is built only after an allowed write.
 */
let deps: AppDeps;
let app: ReturnType<typeof createApp>;
let mail: MailFake;
let staticDir: string;
let digestSql: string;
const logs = memoryLogger();

beforeAll(async () => {
  const url = process.env.DATABASE_URL;
  if (!url) throw new Error('API tests need DATABASE_URL');
  mail = await startMailFake({ host: '127.0.0.1' });
  staticDir = fs.mkdtempSync(path.join(os.tmpdir(), 'shoalshift-matrix-'));
  fs.writeFileSync(path.join(staticDir, 'index.html'), '<!doctype html><title>Shoalshift</title>');
  const config = loadConfig({
    NODE_ENV: 'test',
    DATABASE_URL: url,
    APP_URL: 'http://shoalshift.test',
    SESSION_SECRET: 'matrix-secret-that-is-long-enough-0123456789',
    SMTP_HOST: '127.0.0.1',
    SMTP_PORT: String(mail.smtpPort),
    MAIL_FAKE_URL: mail.url,
    DEV_OUTBOX: 'on',
    STATIC_DIR: staticDir,
  });
  deps = buildDeps(config, logs);
  await deps.dataSource.initialize();
  await deps.dataSource.runMigrations({ transaction: 'each' });
  app = createApp(deps);
  digestSql = await digestQuery(deps.dataSource);
});

afterAll(async () => {
  await deps?.background.drain();
  app?.sessionStore.close();
  await app?.idempotency.close();
  await deps?.sessionPool.end();
  await deps?.dataSource.destroy();
  deps?.mailer.close();
  await mail?.stop();
  if (staticDir) fs.rmSync(staticDir, { recursive: true, force: true });
});

/** Every application table in one digest (one round trip); sessions left out (rolling expiry). */
async function digestQuery(ds: DataSource): Promise<string> {
  const tables: { table_name: string }[] = await ds.query(
    `SELECT table_name FROM information_schema.tables WHERE table_schema = 'public' AND table_type = 'BASE TABLE'
       AND table_name NOT IN ('session', 'migrations', 'idempotency_keys') ORDER BY 1`,
  );
  const parts = tables.map(({ table_name: t }) => `'${t}:' || (SELECT count(*) || ':' || coalesce(md5(string_agg(x::text, '|' ORDER BY x::text)), '-') FROM "${t}" x)`);
  return `SELECT concat_ws(E'\\n', ${parts.join(', ')}) AS h`;
}
const digest = async () => ((await deps.dataSource.query(digestSql)) as { h: string }[])[0]!.h;

async function freshFixture(): Promise<Fixture> {
  // Work a route left running after its answer (a reset e-mail) must not meet the TRUNCATE.
  await deps.background.drain();
  const tables: { table_name: string }[] = await deps.dataSource.query(
    `SELECT table_name FROM information_schema.tables WHERE table_schema = 'public' AND table_type = 'BASE TABLE' AND table_name <> 'migrations'`,
  );
  await deps.dataSource.query(`TRUNCATE ${tables.map((t) => `"${t.table_name}"`).join(', ')} RESTART IDENTITY CASCADE`);
  mail.clear();
  return buildFixture(deps.dataSource, deps.config);
}

const UNSAFE = new Set(['POST', 'PUT', 'PATCH', 'DELETE']);

function send(method: string, url: string, fx: Fixture, actor: Actor, body?: unknown, csv?: string) {
  let t = request(app)[method.toLowerCase() as 'get'](url);
  if (actor !== 'anonymous') t = t.set('Cookie', fx.cookies[actor]);
  if (UNSAFE.has(method)) t = t.set(CSRF_HEADER, CSRF_HEADER_VALUE);
  if (csv !== undefined) return t.attach('file', Buffer.from(csv), { filename: 'tests.csv', contentType: 'text/csv' });
  return body === undefined ? t : t.send(body as object);
}

/** ASVS 3.4.x / 14.3.2: the headers every answer carries, allowed or denied. */
function expectHeaders(res: request.Response, pattern: string) {
  expect(res.headers['content-security-policy']).toContain("default-src 'self'");
  expect(res.headers['strict-transport-security']).toMatch(/max-age=\d+/);
  expect(res.headers['x-content-type-options']).toBe('nosniff');
  expect(res.headers['referrer-policy']).toBe('no-referrer');
  expect(res.headers['x-powered-by']).toBeUndefined();
  if (pattern.startsWith('/api')) expect(res.headers['cache-control']).toBe('no-store');
}

const DENIED = new Set<unknown>([401, 403, 404]);

/** `GET /api/tanks/:tankId` and `GET /api/tanks/:value` alike: parameter names do not matter. */
const shape = (route: string) => route.replace(/:[A-Za-z_]\w*/g, ':');

/**
 * Why a denial was not the route's own (null when it was): the app logs every denial as
 * `access.denied` with `matched`, the route whose guard refused (server/errors.ts), or null
 * when a global layer answered — the request guards, the session, or the API's catch-all 404
 * that a mistyped path or a missing route falls through to.
 */
function notTheRoutesDenial(entries: typeof logs.entries, method: string, pattern: string): string | null {
  const denied = entries.filter((e) => e.event === 'access.denied');
  if (denied.length !== 1) return `expected one access.denied log entry, got ${denied.length}: ${JSON.stringify(denied.map((e) => e.fields))}`;
  const matched = denied[0]!.fields.matched;
  if (typeof matched !== 'string') return `answered by a layer that is not a route (${JSON.stringify(denied[0]!.fields)})`;
  if (shape(matched) !== shape(`${method} ${pattern}`)) return `answered by ${matched}, not by ${method} ${pattern}`;
  return null;
}

describe('authorization matrix (ASVS 8.2.1–8.2.3, 8.4.1)', () => {
  it('has exactly one row for every route the app answers', () => {
    const live = listRoutes(app).map((r) => `${r.method} ${r.path}`);
    const missing = live.filter((k) => !(k in MATRIX));
    const stale = Object.keys(MATRIX).filter((k) => !live.includes(k));
    expect(missing, `routes without a row in tests/api/authz/matrix.ts — add one:\n${missing.join('\n')}`).toEqual([]);
    expect(stale, `rows for routes that no longer exist:\n${stale.join('\n')}`).toEqual([]);
  });

  it('every cross-tenant row is for a route with a row of its own', () => {
    for (const key of Object.keys(CROSS_TENANT)) expect(Object.keys(MATRIX), key).toContain(key.split(' — ')[0]);
  });

  const rows: [string, MatrixRow][] = [...Object.entries(MATRIX), ...Object.entries(CROSS_TENANT)];
  for (const [key, row] of rows) {
    const [method, pattern] = key.split(' — ')[0]!.split(' ') as [string, string];
    describe(key, () => {
      let fx: Fixture | undefined;
      // Denied actors first: they share one fixture.
      const order = [...ACTORS].sort((a, b) => Number(DENIED.has(row.expect[b])) - Number(DENIED.has(row.expect[a])));
      for (const actor of order) {
        const outcome = row.expect[actor];
        it(`${actor} → ${outcome}`, async () => {
          const world = (fx ??= await freshFixture());
          const { path: url, body, csv } = row.request(world, actor);
          const denied = DENIED.has(outcome);
          const before = denied ? await digest() : '';
          logs.entries.length = 0;
          const res = await send(method, url, world, actor, body, csv);
          // Anything but a proven denial may have written: the next actor gets a new world.
          if (!denied || res.status !== outcome) fx = undefined;
          expectHeaders(res, pattern);
          if (outcome === 'ok') {
            expect(res.status, res.text.slice(0, 300)).toBeGreaterThanOrEqual(200);
            expect(res.status, res.text.slice(0, 300)).toBeLessThan(300);
            // Lists and details never carry another tenant's ids, nor anyone else's e-mail.
            const allowed = new Set(row.mayShow?.(world, actor) ?? []);
            const others = Object.entries(world.users).filter(([who]) => who !== actor).map(([, u]) => u.email);
            const leaked = [...world.foreignIds(actor), ...others].filter((id) => !allowed.has(id) && (res.text ?? '').includes(id));
            expect(leaked, `foreign ids in the answer to ${actor}`).toEqual([]);
          } else {
            expect(res.status, res.text.slice(0, 300)).toBe(outcome);
            if (denied) {
              expect(await digest(), 'a denied request wrote').toBe(before);
              // The refusal must come from this route's own guard, not from a layer in front.
              expect(notTheRoutesDenial(logs.entries, method, pattern)).toBeNull();
            }
          }
        });
      }
    });
  }
});

describe('the matrix tells a route’s own denial from another layer’s', () => {
  it('flags a denial by the request guards and by the API’s catch-all, and passes the route’s own', async () => {
    const fx = await freshFixture();
    logs.entries.length = 0;
    // No CSRF header: the global request guards answer 403 before any route runs.
    await request(app).delete(`/api/tanks/${fx.tanks.member}`).set('Cookie', fx.cookies.keeper).expect(403);
    expect(notTheRoutesDenial(logs.entries, 'DELETE', '/api/tanks/:tankId')).toMatch(/not a route/);

    logs.entries.length = 0;
    // A path no route answers (a typo in a row): the catch-all's 404 is no ownership refusal.
    await request(app).get(`/api/tank/${fx.tanks.member}`).set('Cookie', fx.cookies.keeper).expect(404);
    expect(notTheRoutesDenial(logs.entries, 'GET', '/api/tanks/:tankId')).toMatch(/expected one access.denied/);

    logs.entries.length = 0;
    // Another route's refusal is not this one's.
    await request(app).get(`/api/plans/${fx.plans.member}`).set('Cookie', fx.cookies.keeper).expect(404);
    expect(notTheRoutesDenial(logs.entries, 'GET', '/api/tanks/:tankId')).toMatch(/answered by GET \/api\/plans\/:planId/);

    logs.entries.length = 0;
    await request(app).get(`/api/tanks/${fx.tanks.member}`).set('Cookie', fx.cookies.keeper).expect(404);
    expect(notTheRoutesDenial(logs.entries, 'GET', '/api/tanks/:tankId')).toBeNull();
  });
});
