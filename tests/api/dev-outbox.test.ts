import request from 'supertest';
import { describe, expect, it } from 'vitest';
import { outboxSchema } from '../../shared/schemas/outbox.js';
import { createUser } from './helpers/factories.js';
import { client, useTestApp } from './helpers/test-app.js';

const ctx = useTestApp();

describe('GET /api/dev/outbox', () => {
  it('lists the e-mails the mail fake captured, newest first, to a client on this machine', async () => {
    await createUser(ctx.deps.dataSource, { email: 'tench@example.org' });
    await client(ctx.app).post('/api/auth/forgot-password', { email: 'tench@example.org' }).expect(202);
    await ctx.deps.background.drain();
    await ctx.mail.waitFor(() => true);
    const res = await request(ctx.app).get('/api/dev/outbox').expect(200);
    const { messages } = outboxSchema.parse(res.body);
    expect(messages).toHaveLength(1);
    expect(messages[0]).toMatchObject({ to: ['tench@example.org'], subject: 'Reset your Shoalshift password' });
    expect(messages[0].from).toContain('no-reply@shoalshift.invalid');
    expect(messages[0].text).toContain('/reset-password?token=');
  });

  it('is not mounted in production, nor without MAIL_FAKE_URL', async () => {
    const production = ctx.makeApp({ NODE_ENV: 'production', MAIL_FAKE_URL: undefined });
    await request(production).get('/api/dev/outbox').expect(404);
    const withoutFake = ctx.makeApp({ MAIL_FAKE_URL: undefined });
    await request(withoutFake).get('/api/dev/outbox').expect(404);
  });
});
