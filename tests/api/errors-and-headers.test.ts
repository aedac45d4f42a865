import express from 'express';
import request from 'supertest';
import { describe, expect, it } from 'vitest';
import { apiErrorSchema } from '../../shared/api-error.js';
import { useTestApp } from './helpers/test-app.js';

const throwing = express.Router();
throwing.get('/boom', () => {
  throw new Error('duplicate key value violates unique constraint "users_email_key" in SELECT * FROM users');
});
throwing.get('/boom-async', async () => {
  await Promise.resolve();
  throw new TypeError("Cannot read properties of undefined (reading 'passwordHash')");
});

const ctx = useTestApp({ extraApiRoutes: throwing });

function expectSecurityHeaders(res: request.Response) {
  const csp = res.headers['content-security-policy'];
  expect(csp).toContain("default-src 'self'");
  expect(csp).toContain("base-uri 'none'"); // ASVS 3.4.3
  expect(csp).toContain("frame-ancestors 'none'"); // ASVS 3.4.6
  expect(csp).toContain("style-src 'self' 'unsafe-inline'");
  expect(res.headers['strict-transport-security']).toMatch(/max-age=\d+/);
  expect(res.headers['x-content-type-options']).toBe('nosniff');
  expect(res.headers['referrer-policy']).toBe('no-referrer');
  expect(res.headers['x-frame-options']).toBe('DENY');
  expect(res.headers['x-powered-by']).toBeUndefined();
}

describe('errors', () => {
  it('answers an unknown /api route with a JSON 404', async () => {
    for (const path of ['/api/nothing-here', '/api', '/api/tanks/x/y/z']) {
      const res = await request(ctx.app).get(path).expect(404).expect('Content-Type', /json/);
      expect(apiErrorSchema.parse(res.body).error.code).toBe('not_found');
      expect(res.headers['cache-control']).toBe('no-store');
      expectSecurityHeaders(res);
    }
  });

  it('turns a throwing route into a generic 500 without stack or SQL, and logs it', async () => {
    for (const path of ['/api/boom', '/api/boom-async']) {
      const res = await request(ctx.app).get(path).expect(500);
      expect(res.body).toEqual({ error: { code: 'internal', message: 'Something went wrong on our side. Try again later.' } });
      expect(res.text).not.toMatch(/SELECT|users_email_key|passwordHash|at .*\.ts|Error:/);
      expect(res.headers['cache-control']).toBe('no-store');
      expectSecurityHeaders(res);
    }
    const logged = ctx.logs.entries.filter((e) => e.event === 'request.failed');
    expect(logged).toHaveLength(2);
    expect(logged[0].fields.error).toContain('users_email_key');
  });
});

describe('headers and the web app', () => {
  it('sends the security headers and no-store on API answers', async () => {
    const res = await request(ctx.app).get('/api/me').expect(401);
    expect(res.headers['cache-control']).toBe('no-store');
    expectSecurityHeaders(res);
  });

  it('serves index.html for any other GET so the app can route it, with the same headers', async () => {
    for (const path of ['/', '/tanks/123', '/reset-password?token=abc']) {
      const res = await request(ctx.app).get(path).expect(200).expect('Content-Type', /html/);
      expect(res.text).toContain('<div id="root">');
      expect(res.headers['cache-control']).toBe('no-cache');
      expectSecurityHeaders(res);
    }
  });

  it('serves hashed bundles compressed and cached for a year', async () => {
    const res = await request(ctx.app)
      .get('/_expo/static/js/entry-abc123.js')
      .set('Accept-Encoding', 'gzip')
      .expect(200);
    expect(res.headers['content-encoding']).toBe('gzip');
    expect(res.headers['cache-control']).toContain('immutable');
  });
});

describe('GET /api/health', () => {
  it('answers 200 while the database answers, without a session', async () => {
    const res = await request(ctx.app).get('/api/health').expect(200);
    expect(res.body).toEqual({ status: 'ok' });
    expect(res.headers['set-cookie']).toBeUndefined();
  });
});
