import { describe, expect, it } from 'vitest';
import Papa from 'papaparse';
import { Plan } from '../../../server/entities/plan.js';
import { Tank } from '../../../server/entities/tank.js';
import { buildFixture } from '../authz/fixture.js';
import { useTestApp } from '../helpers/test-app.js';
import request from 'supertest';
import { CSRF_HEADER, CSRF_HEADER_VALUE } from '../../../shared/api-error.js';

const ctx = useTestApp();

const as = (cookie: string) => ({
  get: (url: string) => request(ctx.app).get(url).set('Cookie', cookie),
  post: (url: string, body: object) => request(ctx.app).post(url).set('Cookie', cookie).set(CSRF_HEADER, CSRF_HEADER_VALUE).send(body),
  patch: (url: string, body: object) => request(ctx.app).patch(url).set('Cookie', cookie).set(CSRF_HEADER, CSRF_HEADER_VALUE).send(body),
});

describe('S12: the readings export is safe to open in a spreadsheet (OWASP CSV injection, ASVS 1.2.10)', () => {
  it('prefixes every cell that would start a formula with a quote, and serves it as a download', async () => {
    const fx = await buildFixture(ctx.deps.dataSource, ctx.deps.config);
    const keeper = as(fx.cookies.member);
    const base = `/api/tanks/${fx.tanks.member}/readings`;
    const notes = ['=HYPERLINK("http://example.invalid","x")', '+1+2', '-3+4', '@SUM(A1:A2)', '=cmd|"/c calc"!A0'];
    for (const [i, note] of notes.entries()) {
      await keeper.post(base, { takenAt: `2026-01-1${i}T08:00:00Z`, tan: 0.1, note }).expect(201);
    }
    const res = await keeper.get(`${base}/export.csv`).expect(200);
    expect(res.headers['content-type']).toMatch(/^text\/csv/);
    expect(res.headers['content-disposition']).toMatch(/^attachment; filename="[\w.-]+\.csv"$/);
    expect(res.headers['x-content-type-options']).toBe('nosniff');
    const rows = Papa.parse<string[]>(res.text.trim(), { skipEmptyLines: true }).data;
    const cells = rows.slice(1).flat();
    // No cell a spreadsheet would run: none starts with = + - @ (or tab / CR).
    expect(cells.filter((c) => /^[=+\-@\t\r]/.test(c))).toEqual([]);
    for (const note of notes) expect(cells).toContain(`'${note}`);
  });
});

describe('S9: no mass assignment (ASVS 15.3.3)', () => {
  it('ignores or refuses owner, id and tank fields: nothing lands on another keeper', async () => {
    const fx = await buildFixture(ctx.deps.dataSource, ctx.deps.config);
    const keeper = as(fx.cookies.member);
    const foreignTank = fx.tanks.keeper;
    const chosenId = '00000000-0000-4000-8000-000000000001';

    // Strict schemas refuse unknown fields outright.
    const tank = await keeper.post('/api/tanks', { name: 'Mine', volumeL: 40, ownerId: fx.users.keeper.id }).expect(400);
    expect(tank.body.error.fields).toHaveProperty('_');
    await keeper.patch(`/api/tanks/${fx.tanks.member}`, { ownerId: fx.users.keeper.id }).expect(400);
    await keeper.post('/api/auth/sign-up', { email: 'x@example.org', password: 'brackish-river-stone-9', displayName: 'X', role: 'admin' }).expect(400);

    // A plan's tank comes from the URL, never from the body.
    const plan = await keeper.post(`/api/tanks/${fx.tanks.member}/plans`, { name: 'P', startDate: '2026-03-01', tankId: foreignTank, id: chosenId }).expect((r) => {
      expect([201, 400]).toContain(r.status);
    });
    if (plan.status === 201) {
      expect(plan.body.id).not.toBe(chosenId);
      const stored = await ctx.deps.dataSource.getRepository(Plan).findOneByOrFail({ id: plan.body.id });
      expect(stored.tankId).toBe(fx.tanks.member);
    }
    await keeper.patch(`/api/plans/${fx.plans.member}`, { name: 'Q', tankId: foreignTank }).expect((r) => expect([200, 400]).toContain(r.status));
    expect((await ctx.deps.dataSource.getRepository(Plan).findOneByOrFail({ id: fx.plans.member })).tankId).toBe(fx.tanks.member);
    expect(await ctx.deps.dataSource.getRepository(Plan).countBy({ tankId: foreignTank })).toBe(1);
    expect((await ctx.deps.dataSource.getRepository(Tank).findOneByOrFail({ id: foreignTank })).ownerId).toBe(fx.users.keeper.id);
  });
});
