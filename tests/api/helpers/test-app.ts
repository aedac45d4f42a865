import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import request from 'supertest';
import { afterAll, beforeAll, beforeEach } from 'vitest';
import type { Router } from 'express';
import { CSRF_HEADER, CSRF_HEADER_VALUE } from '../../../shared/api-error.js';
import { createApp } from '../../../server/app.js';
import { loadConfig } from '../../../server/config.js';
import type { AppDeps } from '../../../server/deps.js';
import { memoryLogger } from '../../../server/logger.js';
import { startMailFake, type MailFake } from '../../../server/mail/fake-smtp.js';
import { buildDeps } from '../../../server/runtime.js';

export const TEST_APP_URL = 'http://shoalshift.test';

/** Every table the tests write, emptied between tests. */
const TABLES = [
  'session',
  'sign_in_failures',
  'auth_attempts',
  'password_reset_tokens',
  'pending_sign_ups',
  'plans',
  'readings',
  'livestock',
  'tanks',
  'club_memberships',
  'clubs',
  'users',
];

export type TestApp = ReturnType<typeof createApp>;

export interface TestContext {
  deps: AppDeps;
  app: TestApp;
  mail: MailFake;
  logs: ReturnType<typeof memoryLogger>;
  staticDir: string;
  /** Another app over the same database and mail fake, with extra environment settings. */
  makeApp(env?: Record<string, string | undefined>, extraApiRoutes?: Router): TestApp;
}

function databaseUrl(): string {
  const url = process.env.DATABASE_URL;
  if (!url) throw new Error('API tests need DATABASE_URL (e.g. eval "$(scripts/db.sh start pg-apitest 54349 | tail -1)")');
  return url;
}

/**
 * Registers the hooks of one API test file: migrations once, the mail fake on ephemeral ports,
 * a fresh app, and empty tables before each test. Returns a context filled in by beforeAll.
 */
export function useTestApp(options: { env?: Record<string, string>; extraApiRoutes?: Router } = {}): TestContext {
  const ctx = {} as TestContext;
  const extraDeps: AppDeps[] = [];
  const extraApps: TestApp[] = [];

  beforeAll(async () => {
    ctx.mail = await startMailFake({ host: '127.0.0.1' });
    ctx.logs = memoryLogger();
    ctx.staticDir = fs.mkdtempSync(path.join(os.tmpdir(), 'shoalshift-web-'));
    fs.writeFileSync(path.join(ctx.staticDir, 'index.html'), '<!doctype html><title>Shoalshift</title><div id="root"></div>');
    fs.mkdirSync(path.join(ctx.staticDir, '_expo', 'static', 'js'), { recursive: true });
    fs.writeFileSync(path.join(ctx.staticDir, '_expo', 'static', 'js', 'entry-abc123.js'), 'console.log("app");'.repeat(200));

    const baseEnv = (env: Record<string, string | undefined> = {}) => ({
      NODE_ENV: 'test',
      DATABASE_URL: databaseUrl(),
      APP_URL: TEST_APP_URL,
      SESSION_SECRET: 'test-secret-that-is-long-enough-0123456789',
      UNSUBSCRIBE_SECRET: 'test-unsubscribe-key-long-enough-0123456789',
      SMTP_HOST: '127.0.0.1',
      SMTP_PORT: String(ctx.mail.smtpPort),
      MAIL_FAKE_URL: ctx.mail.url,
      STATIC_DIR: ctx.staticDir,
      // Many tests sign up accounts from one loopback address; tests/api/auth-rate-limit.test.ts
      // turns the limits on. Production refuses them off, so an app made as production keeps them.
      AUTH_ATTEMPT_LIMITS: (env.NODE_ENV ?? options.env?.NODE_ENV) === 'production' ? undefined : 'off',
      ...options.env,
      ...env,
    });

    ctx.deps = buildDeps(loadConfig(baseEnv()), ctx.logs);
    ctx.deps.extraApiRoutes = options.extraApiRoutes;
    await ctx.deps.dataSource.initialize();
    await ctx.deps.dataSource.runMigrations({ transaction: 'each' });
    ctx.app = createApp(ctx.deps);

    ctx.makeApp = (env = {}, extraApiRoutes) => {
      const deps = buildDeps(loadConfig(baseEnv(env)), ctx.logs);
      // Share the initialised data source; the session pool is the new app's own.
      deps.dataSource = ctx.deps.dataSource;
      deps.extraApiRoutes = extraApiRoutes;
      extraDeps.push(deps);
      const app = createApp(deps);
      extraApps.push(app);
      return app;
    };
  });

  beforeEach(async () => {
    await ctx.deps.dataSource.query(`TRUNCATE ${TABLES.map((t) => `"${t}"`).join(', ')} RESTART IDENTITY CASCADE`);
    ctx.mail.clear();
    ctx.logs.entries.length = 0;
  });

  afterAll(async () => {
    await ctx.deps?.background.drain();
    for (const deps of extraDeps) {
      await deps.sessionPool.end();
      deps.mailer.close();
    }
    for (const app of [ctx.app, ...extraApps]) await app?.idempotency.close();
    ctx.app?.sessionStore.close();
    await ctx.deps?.sessionPool.end();
    await ctx.deps?.dataSource.destroy();
    ctx.deps?.mailer.close();
    await ctx.mail?.stop();
    if (ctx.staticDir) fs.rmSync(ctx.staticDir, { recursive: true, force: true });
  });

  return ctx;
}

/**
 * A browser-like client: keeps cookies, and sends the app's CSRF header on unsafe methods as
 * the real app does.
 */
export function client(app: TestApp) {
  const agent = request.agent(app);
  const withCsrf = (t: request.Test) => t.set(CSRF_HEADER, CSRF_HEADER_VALUE);
  return {
    agent,
    get: (url: string) => agent.get(url),
    post: (url: string, body?: object) => {
      const t = withCsrf(agent.post(url));
      return body === undefined ? t : t.send(body);
    },
  };
}

/** The `name=value` part of the session cookie a response set, or undefined. */
export function sessionCookie(res: { headers: Record<string, unknown> }): string | undefined {
  const raw = res.headers['set-cookie'];
  const list = Array.isArray(raw) ? (raw as string[]) : typeof raw === 'string' ? [raw] : [];
  const line = list.find((c) => c.startsWith('shoalshift.sid='));
  return line?.split(';')[0];
}

/** The full Set-Cookie line of the session cookie. */
export function sessionCookieLine(res: { headers: Record<string, unknown> }): string | undefined {
  const raw = res.headers['set-cookie'];
  const list = Array.isArray(raw) ? (raw as string[]) : typeof raw === 'string' ? [raw] : [];
  return list.find((c) => c.startsWith('shoalshift.sid='));
}

export const sleep = (ms: number) => new Promise((r) => setTimeout(r, ms));
