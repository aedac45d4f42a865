import { describe, expect, it } from 'vitest';
import { CSRF_HEADER, CSRF_HEADER_VALUE } from '../../shared/api-error.js';
import { DEFAULT_PREFERENCES, preferencesSchema } from '../../shared/schemas/preferences.js';
import { meSchema } from '../../shared/schemas/auth.js';
import { signedInKeeper } from './helpers/keeper-client.js';
import { client, useTestApp } from './helpers/test-app.js';

const ctx = useTestApp();
const URL = '/api/me/preferences';

describe('/api/me/preferences', () => {
  it('needs a session', async () => {
    await client(ctx.app).get(URL).expect(401);
    await client(ctx.app).agent.put(URL).set(CSRF_HEADER, CSRF_HEADER_VALUE).send(DEFAULT_PREFERENCES).expect(401);
  });

  it('answers the defaults until the person chooses, then what they chose', async () => {
    const k = await signedInKeeper(ctx, 'ray@example.org');
    expect(preferencesSchema.parse((await k.get(URL).expect(200)).body)).toEqual(DEFAULT_PREFERENCES);
    const chosen = { volumeUnit: 'USgal', temperatureUnit: 'F', nitrogenBasis: 'ion', reminders: false };
    expect((await k.put(URL, chosen).expect(200)).body).toEqual(chosen);
    expect((await k.get(URL).expect(200)).body).toEqual(chosen);
    // Another person keeps their own.
    const other = await signedInKeeper(ctx, 'skate@example.org');
    expect((await other.get(URL).expect(200)).body).toEqual(DEFAULT_PREFERENCES);
    // /api/me is unchanged in shape.
    meSchema.parse((await k.get('/api/me').expect(200)).body);
  });

  it.each([
    [{ ...DEFAULT_PREFERENCES, volumeUnit: 'UKgal' }, 'volumeUnit'],
    [{ ...DEFAULT_PREFERENCES, temperatureUnit: 'K' }, 'temperatureUnit'],
    [{ ...DEFAULT_PREFERENCES, nitrogenBasis: 'NH3' }, 'nitrogenBasis'],
    [{ ...DEFAULT_PREFERENCES, reminders: 'yes' }, 'reminders'],
    [{ volumeUnit: 'L', temperatureUnit: 'C', nitrogenBasis: 'N' }, 'reminders'],
    [{ ...DEFAULT_PREFERENCES, userId: '00000000-0000-4000-8000-000000000000' }, '_'],
  ])('refuses %j with 400 naming %s and keeps the stored choice', async (body, field) => {
    const k = await signedInKeeper(ctx, 'ray@example.org');
    const res = await k.put(URL, body).expect(400);
    expect(Object.keys(res.body.error.fields)).toContain(field);
    expect((await k.get(URL).expect(200)).body).toEqual(DEFAULT_PREFERENCES);
  });
});
