import { describe, expect, it } from 'vitest';
import { CSRF_HEADER, CSRF_HEADER_VALUE } from '../../shared/api-error.js';
import { Reading } from '../../server/entities/reading.js';
import { createTank } from './helpers/factories.js';
import { signedInKeeper } from './helpers/keeper-client.js';
import { useTestApp } from './helpers/test-app.js';

const ctx = useTestApp();

describe('CSV import with a malformed multipart body', () => {
  it('answers 400 naming the upload, never 500, and writes nothing', async () => {
    const k = await signedInKeeper(ctx, 'gar@example.org');
    const tank = await createTank(ctx.deps.dataSource, k.user.id);
    const bodies: [string, string][] = [
      // The body ends in the middle of a part.
      ['multipart/form-data; boundary=xyz', '--xyz\r\nContent-Disposition: form-data; name="file"; filename="t.csv"\r\nContent-Type: text/csv\r\n\r\ntaken_at,basis\r\n2026'],
      // A part header that is not a header.
      ['multipart/form-data; boundary=xyz', '--xyz\r\nthis is not a header\r\n\r\nx\r\n--xyz--\r\n'],
      // No boundary at all.
      ['multipart/form-data', '--xyz\r\n\r\n'],
    ];
    for (const path of ['preview', 'commit']) {
      for (const [type, body] of bodies) {
        const res = await k.agent
          .post(`/api/tanks/${tank.id}/readings/import/${path}`)
          .set(CSRF_HEADER, CSRF_HEADER_VALUE)
          .set('Content-Type', type)
          .send(body);
        expect(res.status, `${type}: ${res.text}`).toBeGreaterThanOrEqual(400);
        expect(res.status, `${type}: ${res.text}`).toBeLessThan(500);
        expect(res.body.error.fields?.file ?? res.body.error.message).toBeTruthy();
        expect(res.body.error.message).toMatch(/multipart|file/i);
      }
    }
    expect(await ctx.deps.dataSource.getRepository(Reading).count()).toBe(0);
    expect(ctx.logs.entries.filter((e) => e.event === 'request.failed')).toEqual([]);
  });
});
