import { describe, expect, it } from 'vitest';
import { PasswordResetToken } from '../../server/entities/password-reset-token.js';
import { User } from '../../server/entities/user.js';
import { GOOD_PASSWORD, createUser } from './helpers/factories.js';
import { TEST_APP_URL, client, useTestApp } from './helpers/test-app.js';

const ctx = useTestApp();
const NEW_PASSWORD = 'brackish-heron-sunrise-7';

async function requestResetLink(email: string): Promise<string> {
  await client(ctx.app).post('/api/auth/forgot-password', { email }).expect(202);
  await ctx.deps.background.drain();
  const mail = await ctx.mail.waitFor((m) => m.to.includes(email.toLowerCase()));
  const link = /https?:\/\/\S+reset-password\?token=[A-Za-z0-9_-]+/.exec(mail.text)?.[0];
  expect(link).toBeDefined();
  return link!;
}
const tokenOf = (link: string) => new URL(link).searchParams.get('token')!;

describe('forgot and reset password', () => {
  it('e-mails a single-use link; it sets the password, ends every session, and works once', async () => {
    await createUser(ctx.deps.dataSource, { email: 'marsh@example.org', displayName: 'Marsh' });
    const phone = client(ctx.app);
    const laptop = client(ctx.app);
    await phone.post('/api/auth/sign-in', { email: 'marsh@example.org', password: GOOD_PASSWORD }).expect(200);
    await laptop.post('/api/auth/sign-in', { email: 'marsh@example.org', password: GOOD_PASSWORD }).expect(200);

    const link = await requestResetLink('Marsh@Example.org');
    expect(link.startsWith(`${TEST_APP_URL}/reset-password?token=`)).toBe(true);
    const mail = ctx.mail.messages()[0];
    expect(mail.subject).toBe('Reset your Shoalshift password');
    expect(mail.html).toContain('Choose a new password');
    expect(mail.html).toContain(tokenOf(link));
    // Only the hash is stored.
    const stored = await ctx.deps.dataSource.getRepository(PasswordResetToken).find();
    expect(stored).toHaveLength(1);
    expect(stored[0].tokenHash).toMatch(/^[0-9a-f]{64}$/);
    expect(stored[0].tokenHash).not.toBe(tokenOf(link));

    await client(ctx.app).post('/api/auth/reset-password', { token: tokenOf(link), password: NEW_PASSWORD }).expect(204);

    await phone.get('/api/me').expect(401);
    await laptop.get('/api/me').expect(401);
    await client(ctx.app).post('/api/auth/sign-in', { email: 'marsh@example.org', password: GOOD_PASSWORD }).expect(401);
    await client(ctx.app).post('/api/auth/sign-in', { email: 'marsh@example.org', password: NEW_PASSWORD }).expect(200);

    const reuse = await client(ctx.app)
      .post('/api/auth/reset-password', { token: tokenOf(link), password: 'another-fine-passphrase-9' })
      .expect(400);
    expect(Object.keys(reuse.body.error.fields)).toEqual(['token']);
  });

  it('answers 202 for an unknown e-mail and sends nothing', async () => {
    const res = await client(ctx.app).post('/api/auth/forgot-password', { email: 'ghost@example.org' }).expect(202);
    expect(res.body.message).toMatch(/If an account has this e-mail/);
    await ctx.deps.background.drain();
    expect(ctx.mail.messages()).toHaveLength(0);
  });

  it('refuses an unknown token and an expired one with 400 on token', async () => {
    await createUser(ctx.deps.dataSource, { email: 'marsh@example.org' });
    const unknown = await client(ctx.app)
      .post('/api/auth/reset-password', { token: 'x'.repeat(43), password: NEW_PASSWORD })
      .expect(400);
    expect(unknown.body.error.fields.token).toMatch(/not valid or has expired/);

    const link = await requestResetLink('marsh@example.org');
    await ctx.deps.dataSource.query(`UPDATE password_reset_tokens SET expires_at = now() - interval '1 second'`);
    await client(ctx.app).post('/api/auth/reset-password', { token: tokenOf(link), password: NEW_PASSWORD }).expect(400);
    await client(ctx.app).post('/api/auth/sign-in', { email: 'marsh@example.org', password: GOOD_PASSWORD }).expect(200);
  });

  it('makes only the newest link work', async () => {
    await createUser(ctx.deps.dataSource, { email: 'marsh@example.org' });
    const first = await requestResetLink('marsh@example.org');
    ctx.mail.clear();
    const second = await requestResetLink('marsh@example.org');
    expect(tokenOf(second)).not.toBe(tokenOf(first));
    await client(ctx.app).post('/api/auth/reset-password', { token: tokenOf(first), password: NEW_PASSWORD }).expect(400);
    await client(ctx.app).post('/api/auth/reset-password', { token: tokenOf(second), password: NEW_PASSWORD }).expect(204);
  });

  it('refuses a common new password without using up the token', async () => {
    await createUser(ctx.deps.dataSource, { email: 'marsh@example.org' });
    const link = await requestResetLink('marsh@example.org');
    const res = await client(ctx.app).post('/api/auth/reset-password', { token: tokenOf(link), password: 'password1' }).expect(400);
    expect(res.body.error.fields.password).toMatch(/common passwords/);
    await client(ctx.app).post('/api/auth/reset-password', { token: tokenOf(link), password: NEW_PASSWORD }).expect(204);
  });

  it('sends at most three reset e-mails per account per hour', async () => {
    const user = await createUser(ctx.deps.dataSource, { email: 'marsh@example.org' });
    for (let i = 0; i < 5; i++) await client(ctx.app).post('/api/auth/forgot-password', { email: 'marsh@example.org' }).expect(202);
    await ctx.deps.background.drain();
    await ctx.mail.waitFor(() => ctx.mail.messages().length >= 3);
    expect(ctx.mail.messages()).toHaveLength(3);
    expect(await ctx.deps.dataSource.getRepository(PasswordResetToken).countBy({ userId: user.id })).toBe(3);
    expect((await ctx.deps.dataSource.getRepository(User).findOneByOrFail({ id: user.id })).passwordHash).toBe(user.passwordHash);
  });
});
