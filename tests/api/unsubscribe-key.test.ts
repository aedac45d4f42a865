import request from 'supertest';
import { describe, expect, it } from 'vitest';
import { loadConfig } from '../../server/config.js';
import { UNSUBSCRIBE_PURPOSE, unsubscribeLink } from '../../server/jobs/reminders.js';
import { ReminderOptOut } from '../../server/entities/reminder-opt-out.js';
import { signPayload } from '../../server/services/secret-tokens.js';
import { createUser } from './helpers/factories.js';
import { useTestApp } from './helpers/test-app.js';

const ctx = useTestApp();
const base = { DATABASE_URL: 'postgres://u:p@127.0.0.1:5432/db' };

describe('unsubscribe links have their own key, not the session secret', () => {
  it('a link signed with UNSUBSCRIBE_SECRET works; the same link signed with SESSION_SECRET does not', async () => {
    const user = await createUser(ctx.deps.dataSource, { email: 'bream@example.org' });
    const { config } = ctx.deps;
    expect(config.unsubscribeSecret).not.toBe(config.session.secret);
    const forged = signPayload(config.session.secret, UNSUBSCRIBE_PURPOSE, user.id);
    await request(ctx.app).post(`/api/unsubscribe/${forged}`).expect(404);
    expect(await ctx.deps.dataSource.getRepository(ReminderOptOut).count()).toBe(0);

    const link = new URL(unsubscribeLink(config, user.id));
    await request(ctx.app).post(link.pathname).expect(200);
    expect(await ctx.deps.dataSource.getRepository(ReminderOptOut).countBy({ userId: user.id })).toBe(1);
  });

  it('outside production a missing key is derived from the session secret (stable, and not equal to it)', () => {
    const a = loadConfig({ ...base, SESSION_SECRET: 's'.repeat(40) });
    const b = loadConfig({ ...base, SESSION_SECRET: 's'.repeat(40) });
    expect(a.unsubscribeSecret).toBe(b.unsubscribeSecret);
    expect(a.unsubscribeSecret).not.toBe(a.session.secret);
    expect(a.unsubscribeSecret.length).toBeGreaterThanOrEqual(32);
    expect(loadConfig({ ...base, UNSUBSCRIBE_SECRET: 'u'.repeat(40) }).unsubscribeSecret).toBe('u'.repeat(40));
  });

  it('production requires its own key, at least 32 characters and different from SESSION_SECRET', () => {
    const production = { ...base, NODE_ENV: 'production', APP_URL: 'https://shoalshift.example', SESSION_SECRET: 's'.repeat(40) };
    expect(() => loadConfig(production)).toThrow(/UNSUBSCRIBE_SECRET is required in production/);
    expect(() => loadConfig({ ...production, UNSUBSCRIBE_SECRET: 'short' })).toThrow(/UNSUBSCRIBE_SECRET must be at least 32/);
    expect(() => loadConfig({ ...production, UNSUBSCRIBE_SECRET: 's'.repeat(40) })).toThrow(/UNSUBSCRIBE_SECRET must differ from SESSION_SECRET/);
    expect(loadConfig({ ...production, UNSUBSCRIBE_SECRET: 'u'.repeat(40) }).unsubscribeSecret).toBe('u'.repeat(40));
  });
});
