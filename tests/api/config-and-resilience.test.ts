import { describe, expect, it } from 'vitest';
import { ConfigError, loadConfig } from '../../server/config.js';
import { GOOD_PASSWORD, createUser } from './helpers/factories.js';
import { client, useTestApp } from './helpers/test-app.js';

const base = { DATABASE_URL: 'postgres://u:p@127.0.0.1:5432/db' };
const problemsOf = (env: Record<string, string>) => {
  try {
    loadConfig(env);
  } catch (err) {
    if (err instanceof ConfigError) return err.problems;
    throw err;
  }
  return [];
};

describe('configuration', () => {
  it('names each bad variable', () => {
    expect(problemsOf({})).toEqual([expect.stringMatching(/^DATABASE_URL is required/)]);
    expect(problemsOf({ ...base, PORT: 'eighty' })).toEqual([expect.stringMatching(/^PORT /)]);
    expect(problemsOf({ ...base, SESSION_SECRET: 'short' })).toEqual([expect.stringMatching(/^SESSION_SECRET must be at least 32/)]);
    expect(problemsOf({ ...base, SESSION_IDLE_SECONDS: '600', SESSION_ABSOLUTE_SECONDS: '60' })).toEqual([
      expect.stringMatching(/^SESSION_ABSOLUTE_SECONDS must not be shorter/),
    ]);
  });

  it('asks more of production: a secret and an app URL, and no mail fake', () => {
    const problems = problemsOf({ ...base, NODE_ENV: 'production', MAIL_FAKE_URL: 'http://127.0.0.1:2526' });
    expect(problems).toEqual([
      'SESSION_SECRET is required in production',
      'APP_URL is required in production',
      'MAIL_FAKE_URL must not be set in production',
      'UNSUBSCRIBE_SECRET is required in production',
    ]);
  });

  it('fills development defaults, with a random session secret', () => {
    const a = loadConfig(base);
    const b = loadConfig(base);
    expect(a).toMatchObject({ env: 'development', port: 3000, appUrl: 'http://127.0.0.1:3000', trustProxy: 'loopback' });
    expect(a.session.secretIsEphemeral).toBe(true);
    expect(a.session.secret).not.toBe(b.session.secret);
  });
});

describe('database connections dropped under the server', () => {
  const ctx = useTestApp();

  it('keeps serving after PostgreSQL ends every idle pooled connection', async () => {
    await createUser(ctx.deps.dataSource, { email: 'loach@example.org' });
    const c = client(ctx.app);
    await c.post('/api/auth/sign-in', { email: 'loach@example.org', password: GOOD_PASSWORD }).expect(200);
    await c.get('/api/tanks').expect(200);

    const ended: { n: number }[] = await ctx.deps.dataSource.query(
      `SELECT count(pg_terminate_backend(pid))::int AS n FROM pg_stat_activity
        WHERE application_name IN ('shoalshift', 'shoalshift-sessions') AND pid <> pg_backend_pid() AND state = 'idle'`,
    );
    expect(ended[0].n).toBeGreaterThan(0);
    await new Promise((r) => setTimeout(r, 200));

    // Without 'error' listeners node-postgres would have thrown and ended this process.
    await c.get('/api/me').expect(200);
    await c.get('/api/tanks').expect(200);
    expect(ctx.logs.entries.some((e) => e.event === 'db.session_pool_error' || e.event === 'db.pool_error')).toBe(true);
  });
});
