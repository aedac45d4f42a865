import request from 'supertest';
import { describe, expect, it } from 'vitest';
import { CSRF_HEADER, CSRF_HEADER_VALUE } from '../../shared/api-error.js';
import { User } from '../../server/entities/user.js';
import { GOOD_PASSWORD } from './helpers/factories.js';
import { client, useTestApp } from './helpers/test-app.js';

const ctx = useTestApp();
const body = { email: 'pike@example.org', password: GOOD_PASSWORD, displayName: 'Pike' };
const userCount = () => ctx.deps.dataSource.getRepository(User).count();

describe('CSRF and content-type guards on unsafe /api requests (ASVS 3.5.1–3.5.3)', () => {
  it('refuses a POST without the CSRF header with 403, and writes nothing', async () => {
    const res = await request(ctx.app).post('/api/auth/sign-up').send(body).expect(403);
    expect(res.body.error.code).toBe('csrf');
    expect(await userCount()).toBe(0);
  });

  it('refuses a wrong CSRF header value with 403', async () => {
    await request(ctx.app).post('/api/auth/sign-up').set(CSRF_HEADER, 'yes').send(body).expect(403);
    expect(await userCount()).toBe(0);
  });

  it('refuses a request the browser marks cross-site, even with the header', async () => {
    const res = await client(ctx.app).post('/api/auth/sign-up', body).set('Sec-Fetch-Site', 'cross-site').expect(403);
    expect(res.body.error.code).toBe('csrf');
    expect(await userCount()).toBe(0);
  });

  it('accepts a same-origin request with the header', async () => {
    await client(ctx.app).post('/api/auth/sign-up', body).set('Sec-Fetch-Site', 'same-origin').expect(202);
  });

  it('refuses a text/plain body with 415 (a cross-site "simple request" shape), and writes nothing', async () => {
    const res = await request(ctx.app)
      .post('/api/auth/sign-up')
      .set(CSRF_HEADER, CSRF_HEADER_VALUE)
      .set('Content-Type', 'text/plain')
      .send(JSON.stringify(body))
      .expect(415);
    expect(res.body.error.code).toBe('unsupported_media_type');
    expect(await userCount()).toBe(0);
  });

  it('refuses a form-encoded body with 415', async () => {
    await request(ctx.app)
      .post('/api/auth/sign-up')
      .set(CSRF_HEADER, CSRF_HEADER_VALUE)
      .type('form')
      .send(body)
      .expect(415);
    expect(await userCount()).toBe(0);
  });

  it('refuses a multipart upload without the CSRF header with 403', async () => {
    await request(ctx.app).post('/api/auth/sign-up').field('email', body.email).field('password', body.password).expect(403);
    expect(await userCount()).toBe(0);
  });

  it('answers malformed JSON with 400 and an oversized body with 413', async () => {
    const bad = await request(ctx.app)
      .post('/api/auth/sign-up')
      .set(CSRF_HEADER, CSRF_HEADER_VALUE)
      .set('Content-Type', 'application/json')
      .send('{"email": ')
      .expect(400);
    expect(bad.body.error.code).toBe('bad_request');
    const big = await client(ctx.app).post('/api/auth/sign-up', { ...body, displayName: 'x'.repeat(200_000) }).expect(413);
    expect(big.body.error.code).toBe('payload_too_large');
    expect(await userCount()).toBe(0);
  });

  it('lets safe methods through without the header', async () => {
    await request(ctx.app).get('/api/me').expect(401);
  });
});
