import { describe, expect, it } from 'vitest';
import { CSV_IMPORT_MAX_BYTES, CSV_IMPORT_MAX_ROWS, importPreviewSchema } from '../../shared/schemas/reading.js';
import { Reading } from '../../server/entities/reading.js';
import { createReading, createTank, createUser } from './helpers/factories.js';
import { signedInKeeper } from './helpers/keeper-client.js';
import { client, useTestApp } from './helpers/test-app.js';

const ctx = useTestApp();
const count = () => ctx.deps.dataSource.getRepository(Reading).count();
const HEADER = 'taken_at,basis,total_ammonia,nitrite,nitrate,ph,temperature_c,kh_dkh,note';

async function keeperWithTank() {
  const k = await signedInKeeper(ctx, 'ray@example.org');
  const tank = await createTank(ctx.deps.dataSource, k.user.id);
  return { k, tank, base: `/api/tanks/${tank.id}/readings` };
}

const GOOD = [
  HEADER,
  '2026-03-01T08:00:00Z,N,0.25,0,10,7.4,25,4,first test',
  '2026-03-02T08:00:00Z,ion,0.5,0.25,40,7.3,25.5,4,',
  '2026-03-03,N,,,,7.2,,,date only',
].join('\n');

describe('CSV import', () => {
  it('previews a good file without writing, then commits every row', async () => {
    const { k, base } = await keeperWithTank();
    const preview = importPreviewSchema.parse((await k.upload(`${base}/import/preview`, GOOD).expect(200)).body);
    expect(preview.canImport).toBe(true);
    expect(preview.errors).toEqual([]);
    expect(preview.rows.map((r) => r.line)).toEqual([2, 3, 4]);
    expect(preview.rows[1]).toMatchObject({ basis: 'ion', tan: 0.5, no2: 0.25, no3: 40, temperatureC: 25.5 });
    expect(preview.rows[2]).toMatchObject({ takenAt: '2026-03-03T12:00:00.000Z', tan: null, ph: 7.2, note: 'date only' });
    expect(await count()).toBe(0);

    expect((await k.upload(`${base}/import/commit`, GOOD).expect(201)).body).toEqual({ imported: 3 });
    const page = (await k.get(base).expect(200)).body;
    expect(page.total).toBe(3);
    // NO2− as ion 0.25 → 0.25 × 14.007/46.005 mg N/L (MODEL.md §4.6).
    expect(page.readings[1].no2MgN).toBeCloseTo(0.25 * 0.3045, 4);
  });

  it('imports nothing when one row is bad, and names the row and column', async () => {
    const { k, base } = await keeperWithTank();
    const bad = [HEADER, '2026-03-01T08:00:00Z,N,0.25,0,10,7.4,25,4,', '2026-03-02T08:00:00Z,N,0.5,lots,10,7.4,25,4,', '2026-03-03T08:00:00Z,NH3,0.5,0,10,19,25,4,'].join('\n');
    const preview = importPreviewSchema.parse((await k.upload(`${base}/import/preview`, bad).expect(200)).body);
    expect(preview.canImport).toBe(false);
    expect(preview.errors).toEqual([
      expect.objectContaining({ line: 3, column: 'nitrite' }),
      expect.objectContaining({ line: 4, column: 'basis' }),
      expect.objectContaining({ line: 4, column: 'ph' }),
    ]);
    const res = await k.upload(`${base}/import/commit`, bad).expect(422);
    expect(res.body.error.code).toBe('import_rejected');
    expect(Object.keys(res.body.error.fields)).toEqual(['rows.3.nitrite', 'rows.4.basis', 'rows.4.ph']);
    expect(await count()).toBe(0);
  });

  it('reports duplicates within the file and against logged tests, and imports nothing', async () => {
    const { k, tank, base } = await keeperWithTank();
    await createReading(ctx.deps.dataSource, tank.id, { takenAt: new Date('2026-03-02T08:00:00Z') });
    const file = [HEADER, '2026-03-01T08:00:00Z,N,0.1,,,,,,', '2026-03-01T09:00:00+01:00,N,0.2,,,,,,', '2026-03-02T08:00:00Z,N,0.3,,,,,,'].join('\n');
    const preview = importPreviewSchema.parse((await k.upload(`${base}/import/preview`, file).expect(200)).body);
    expect(preview.errors.map((e) => [e.line, e.column])).toEqual([
      [3, 'taken_at'],
      [4, 'taken_at'],
    ]);
    expect(preview.errors[0].message).toContain('line 2');
    await k.upload(`${base}/import/commit`, file).expect(422);
    expect(await count()).toBe(1);
  });

  it('refuses unknown or missing columns on line 1', async () => {
    const { k, base } = await keeperWithTank();
    const preview = importPreviewSchema.parse((await k.upload(`${base}/import/preview`, 'when,ammonia\n2026-03-01,0.1').expect(200)).body);
    expect(preview.canImport).toBe(false);
    expect(preview.errors.map((e) => e.column)).toEqual(['when', 'ammonia', 'taken_at', 'basis']);
    expect(preview.errors.every((e) => e.line === 1)).toBe(true);
  });

  it(`answers 422 for more than ${CSV_IMPORT_MAX_ROWS} rows`, async () => {
    const { k, base } = await keeperWithTank();
    const lines = [HEADER];
    const t0 = Date.parse('2020-01-01T00:00:00Z');
    for (let i = 0; i <= CSV_IMPORT_MAX_ROWS; i++) lines.push(`${new Date(t0 + i * 3_600_000).toISOString()},N,0.1,,,,,,`);
    const res = await k.upload(`${base}/import/commit`, lines.join('\n')).expect(422);
    expect(res.body.error.code).toBe('too_many_rows');
    expect(await count()).toBe(0);
  });

  it('answers 415 for a PNG named .csv, a non-CSV name, and a JSON body; 413 for an oversized file', async () => {
    const { k, base } = await keeperWithTank();
    const png = Buffer.concat([Buffer.from([0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a, 0, 0, 0, 0x0d]), Buffer.from('IHDR')]);
    await k.upload(`${base}/import/preview`, png, 'tests.csv', 'text/csv').expect(415);
    await k.upload(`${base}/import/preview`, GOOD, 'tests.png', 'image/png').expect(415);
    await k.upload(`${base}/import/preview`, GOOD, 'tests.xlsx', 'text/csv').expect(415);
    await k.post(`${base}/import/commit`, { rows: [] }).expect(415);
    const big = HEADER + '\n' + '2026-03-01T08:00:00Z,N,0.1,,,,,,' + ' '.repeat(CSV_IMPORT_MAX_BYTES);
    await k.upload(`${base}/import/commit`, big).expect(413);
    expect(await count()).toBe(0);
  });

  it('answers 400 without a file and for two files', async () => {
    const { k, base } = await keeperWithTank();
    const noFile = await k.agent.post(`${base}/import/preview`).set('x-shoalshift-csrf', '1').field('note', 'x').expect(400);
    expect(noFile.body.error.fields).toHaveProperty('file');
    const two = await k.upload(`${base}/import/preview`, GOOD).attach('file', Buffer.from(GOOD), { filename: 'b.csv', contentType: 'text/csv' }).expect(400);
    expect(two.body.error.fields).toHaveProperty('file');
  });

  it('needs the CSRF header (403), a session (401), and the own tank (404)', async () => {
    const { k, base } = await keeperWithTank();
    await k.agent.post(`${base}/import/commit`).attach('file', Buffer.from(GOOD), { filename: 'a.csv', contentType: 'text/csv' }).expect(403);
    await client(ctx.app).agent.post(`${base}/import/commit`).set('x-shoalshift-csrf', '1').attach('file', Buffer.from(GOOD), { filename: 'a.csv', contentType: 'text/csv' }).expect(401);
    const other = await createUser(ctx.deps.dataSource, { email: 'skate@example.org' });
    const foreign = await createTank(ctx.deps.dataSource, other.id);
    await k.upload(`/api/tanks/${foreign.id}/readings/import/commit`, GOOD).expect(404);
    await k.upload(`/api/tanks/${foreign.id}/readings/import/preview`, GOOD).expect(404);
    // Multipart is accepted only on the import paths.
    await k.upload(`${base}`, GOOD).expect(415);
    expect(await count()).toBe(0);
  });
});

describe('CSV export', () => {
  it('exports every test; importing the export previews the same rows', async () => {
    const ds = ctx.deps.dataSource;
    const { k, base } = await keeperWithTank();
    await k.post(base, { takenAt: '2026-03-01T08:00:00Z', basis: 'ion', tan: 0.5, no2: 0.25, no3: 40, ph: 7.4, temperatureC: 25, khDkh: 4, note: 'after a 30 % water change' }).expect(201);
    await k.post(base, { takenAt: '2026-03-02T08:00:00Z', basis: 'N', tan: 0.1, no3: 9.5, note: '=HYPERLINK("http://evil.example")' }).expect(201);
    await k.post(base, { takenAt: '2026-03-03T08:00:00Z', basis: 'N', ph: 7.1, note: '-2+3' }).expect(201);

    const res = await k.get(`${base}/export.csv`).expect(200);
    expect(res.headers['content-type']).toMatch(/^text\/csv/);
    expect(res.headers['content-disposition']).toMatch(/^attachment; filename="shoalshift-water-tests-\d{4}-\d{2}-\d{2}\.csv"$/);
    const text = res.text;
    const lines = text.trim().split('\r\n');
    expect(lines[0]).toBe(HEADER);
    expect(lines).toHaveLength(4);
    expect(lines[1]).toContain(`'-2+3`);
    expect(text).toContain(`'=HYPERLINK`);
    expect(text).not.toMatch(/,=HYPERLINK/);

    // Into a second tank of the same keeper: no duplicates there.
    const other = await createTank(ds, k.user.id, { name: 'Second' });
    const preview = importPreviewSchema.parse((await k.upload(`/api/tanks/${other.id}/readings/import/preview`, text).expect(200)).body);
    expect(preview.errors).toEqual([]);
    const byTime = Object.fromEntries(preview.rows.map((r) => [r.takenAt, r]));
    expect(byTime['2026-03-01T08:00:00.000Z']).toMatchObject({ basis: 'ion', ph: 7.4, temperatureC: 25, khDkh: 4, note: 'after a 30 % water change' });
    expect(byTime['2026-03-01T08:00:00.000Z'].tan).toBeCloseTo(0.5, 10);
    expect(byTime['2026-03-01T08:00:00.000Z'].no2).toBeCloseTo(0.25, 10);
    expect(byTime['2026-03-01T08:00:00.000Z'].no3).toBeCloseTo(40, 10);
    expect(byTime['2026-03-02T08:00:00.000Z']).toMatchObject({ basis: 'N', tan: 0.1, no2: null, no3: 9.5, note: '=HYPERLINK("http://evil.example")' });
    expect(byTime['2026-03-03T08:00:00.000Z']).toMatchObject({ ph: 7.1, tan: null, note: '-2+3' });

    // Back into the same tank: every row is a duplicate.
    const same = importPreviewSchema.parse((await k.upload(`${base}/import/preview`, text).expect(200)).body);
    expect(same.errors.map((e) => e.line)).toEqual([2, 3, 4]);
  });

  it("answers 404 for another keeper's tank", async () => {
    const { k } = await keeperWithTank();
    const other = await createUser(ctx.deps.dataSource, { email: 'skate@example.org' });
    const foreign = await createTank(ctx.deps.dataSource, other.id);
    await k.get(`/api/tanks/${foreign.id}/readings/export.csv`).expect(404);
  });
});
