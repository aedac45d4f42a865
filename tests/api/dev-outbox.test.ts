import request from 'supertest';
import { describe, expect, it } from 'vitest';
import { loadConfig } from '../../server/config.js';
import { outboxSchema } from '../../shared/schemas/outbox.js';
import { createUser } from './helpers/factories.js';
import { client, useTestApp } from './helpers/test-app.js';

const ctx = useTestApp({ env: { DEV_OUTBOX: 'on' } });

async function oneResetMail() {
  await createUser(ctx.deps.dataSource, { email: 'tench@example.org' });
  await client(ctx.app).post('/api/auth/forgot-password', { email: 'tench@example.org' }).expect(202);
  await ctx.deps.background.drain();
  await ctx.mail.waitFor(() => true);
}

describe('GET /api/dev/outbox', () => {
  it('lists the e-mails the mail fake captured, newest first, to a client on this machine', async () => {
    await oneResetMail();
    const res = await request(ctx.app).get('/api/dev/outbox').expect(200);
    const { messages } = outboxSchema.parse(res.body);
    expect(messages).toHaveLength(1);
    expect(messages[0]).toMatchObject({ to: ['tench@example.org'], subject: 'Reset your Shoalshift password' });
    expect(messages[0].from).toContain('no-reply@shoalshift.invalid');
    expect(messages[0].text).toContain('/reset-password?token=');
  });

  it('refuses a request that came through a proxy on this machine (its peer is loopback, its visitor is not)', async () => {
    await oneResetMail();
    for (const [header, value] of [
      ['X-Forwarded-For', '203.0.113.9'],
      ['Forwarded', 'for=203.0.113.9'],
      ['X-Real-IP', '203.0.113.9'],
      ['Via', '1.1 proxy'],
    ]) {
      const res = await request(ctx.app).get('/api/dev/outbox').set(header, value).expect(404);
      expect(res.text).not.toContain('reset-password');
    }
  });

  it('is not mounted without DEV_OUTBOX=on, nor in production, nor without MAIL_FAKE_URL', async () => {
    await request(ctx.makeApp({ DEV_OUTBOX: undefined })).get('/api/dev/outbox').expect(404);
    await request(ctx.makeApp({ DEV_OUTBOX: 'off' })).get('/api/dev/outbox').expect(404);
    await request(ctx.makeApp({ MAIL_FAKE_URL: undefined })).get('/api/dev/outbox').expect(404);
    const production = ctx.makeApp({ NODE_ENV: 'production', MAIL_FAKE_URL: undefined, DEV_OUTBOX: undefined });
    await request(production).get('/api/dev/outbox').expect(404);
  });

  it('DEV_OUTBOX=on is refused in production at boot', () => {
    const production = {
      NODE_ENV: 'production',
      DATABASE_URL: 'postgres://u:p@127.0.0.1:5432/db',
      APP_URL: 'https://shoalshift.example',
      SESSION_SECRET: 's'.repeat(40),
      UNSUBSCRIBE_SECRET: 'u'.repeat(40),
    };
    expect(() => loadConfig({ ...production, DEV_OUTBOX: 'on' })).toThrow(/DEV_OUTBOX must be off in production/);
    expect(loadConfig(production).devOutbox).toBe(false);
  });
});
