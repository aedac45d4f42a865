import { Router } from 'express';
import request from 'supertest';
import { DataSource, type DataSourceOptions } from 'typeorm';
import { describe, expect, it } from 'vitest';
import { createApp } from '../../server/app.js';
import { loadConfig } from '../../server/config.js';
import { createDataSource } from '../../server/data-source.js';
import { memoryLogger } from '../../server/logger.js';
import { buildDeps } from '../../server/runtime.js';
import { useTestApp } from './helpers/test-app.js';

const ctx = useTestApp();
const A_TOKEN = 'A'.repeat(43);

/** A sleeping statement, reachable over the API (mounted only in these tests). */
const sleeper = (ds: () => DataSource) => Router().get('/sleep', async (_req, res) => {
  await ds().query('SELECT pg_sleep(2)');
  res.json({ slept: true });
});

describe('the database as a limited resource', () => {
  it('every pooled connection busy: 503 with Retry-After, not 500', async () => {
    const small = new DataSource({ ...ctx.deps.dataSource.options, extra: { max: 1, connectionTimeoutMillis: 300 } } as DataSourceOptions);
    await small.initialize();
    const held = small.createQueryRunner();
    try {
      await held.connect(); // the pool's only connection, kept busy
      const app = createApp({ ...ctx.deps, dataSource: small });
      const res = await request(app).get(`/api/share/${A_TOKEN}`).expect(503);
      expect(res.headers['retry-after']).toMatch(/^\d+$/);
      expect(res.body.error.code).toBe('unavailable');
      app.sessionStore.close();
      await app.idempotency.close();
    } finally {
      await held.release();
      await small.destroy();
    }
  });

  it('the app’s connections carry statement_timeout (default 15 s); migrations and the seed run without one', async () => {
    expect(ctx.deps.config.dbStatementTimeoutMs).toBe(15_000);
    const [app] = await ctx.deps.dataSource.query('SHOW statement_timeout');
    expect(app.statement_timeout).toBe('15s');
    const [sessions] = (await ctx.deps.sessionPool.query('SHOW statement_timeout')).rows;
    expect(sessions.statement_timeout).toBe('15s');
    const plain = createDataSource(process.env.DATABASE_URL!);
    await plain.initialize();
    try {
      const [migrations] = await plain.query('SHOW statement_timeout');
      expect(migrations.statement_timeout).toBe('0');
    } finally {
      await plain.destroy();
    }
  });

  it('a statement past DB_STATEMENT_TIMEOUT_MS is cancelled by PostgreSQL and answers 503 with Retry-After', async () => {
    const logs = memoryLogger();
    const config = loadConfig({ NODE_ENV: 'test', DATABASE_URL: process.env.DATABASE_URL, DB_STATEMENT_TIMEOUT_MS: '200', JOBS: 'off' });
    const deps = buildDeps(config, logs);
    await deps.dataSource.initialize();
    deps.extraApiRoutes = sleeper(() => deps.dataSource);
    const app = createApp(deps);
    try {
      const started = Date.now();
      const res = await request(app).get('/api/sleep').expect(503);
      expect(Date.now() - started).toBeLessThan(1_900);
      expect(res.headers['retry-after']).toMatch(/^\d+$/);
      const failed = logs.entries.find((e) => e.event === 'request.failed');
      expect(String(failed?.fields.error)).toMatch(/statement timeout/);
    } finally {
      app.sessionStore.close();
      await app.idempotency.close();
      await deps.sessionPool.end();
      await deps.dataSource.destroy();
      deps.mailer.close();
    }
  });

  it('DB_STATEMENT_TIMEOUT_MS must be a whole number of milliseconds', () => {
    expect(() => loadConfig({ DATABASE_URL: 'postgres://u:p@127.0.0.1:5432/db', DB_STATEMENT_TIMEOUT_MS: 'soon' })).toThrow(/DB_STATEMENT_TIMEOUT_MS/);
  });
});
