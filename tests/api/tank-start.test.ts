import { afterAll, beforeEach, describe, expect, it } from 'vitest';
import { calibrationAdviceResponseSchema, planForecastResponseSchema } from '../../shared/schemas/plan.js';
import { tankDetailSchema } from '../../shared/schemas/tank.js';
import { tankFitSchema } from '../../shared/schemas/tank-history.js';
import { meanBandWidth } from '../../simulation/advice/calibration.js';
import { forgetRememberedResults } from '../../server/services/forecast-cache.js';
import { closeEnginePool } from '../../server/workers/engine-pool.js';
import { createLivestock, createReading, createTank } from './helpers/factories.js';
import { signedInKeeper, type Keeper } from './helpers/keeper-client.js';
import { useTestApp } from './helpers/test-app.js';

/**
 * Issue 14 item 1–2: a forecast starts from the tank's evidence (shared/tank-start.ts): its
 * latest test, then an applied fit, then the keeper's account of its past. The lead is
 * changing the kinetics, so these check relations (starts at the logged value, band narrower
 * with the fit), never pinned engine numbers.
 */
const ctx = useTestApp();
const DAY_MS = 86_400_000;
const today = () => new Date().toISOString().slice(0, 10);

beforeEach(async () => {
  await ctx.deps.dataSource.query('TRUNCATE forecast_cache');
  forgetRememberedResults();
});
afterAll(async () => {
  await closeEnginePool();
});

async function keeper(email = 'kim@example.org') {
  const k = await signedInKeeper(ctx, email);
  return { ...k, c: k };
}

/** A settled 120 L tank with 12 neons (invented). */
async function settledTank(ownerId: string) {
  const tank = await createTank(ctx.deps.dataSource, ownerId);
  await createLivestock(ctx.deps.dataSource, tank.id, { speciesId: 'neon-tetra', count: 12, lengthCm: 3 });
  return tank;
}

async function newPlanForecast(c: Keeper, tankId: string, startDate = today()) {
  const plan = (await c.post(`/api/tanks/${tankId}/plans`, { name: 'Four more', startDate, events: [{ type: 'add-fish', day: 2, fish: { species: 'neon-tetra', count: 4 } }] }).expect(201)).body;
  return planForecastResponseSchema.parse((await c.post(`/api/plans/${plan.id}/forecast`).expect(200)).body);
}

describe('a plan forecast starts from the latest water test', () => {
  it('after logging total ammonia 2 and nitrite 1 mg N/L, the next plan starts from them and says so', async () => {
    const { user, c } = await keeper();
    const tank = await settledTank(user.id);
    await c.post(`/api/tanks/${tank.id}/readings`, { takenAt: new Date(Date.now() - 3_600_000).toISOString(), tan: 2, no2: 1, basis: 'N' }).expect(201);
    const f = await newPlanForecast(c, tank.id);
    expect(f.startState.test?.used).toBe(true);
    expect(f.forecast.tanMgN[0]).toBeCloseTo(2, 6);
    expect(f.forecast.no2MgN[0]).toBeCloseTo(1, 6);
    expect(f.explanation[0]).toMatch(/^From your test of \d+ \w+: total ammonia 2, nitrite 1 mg\/L as N/);
    // A settled tank does not read 2 mg N/L of ammonia: the forecast says the evidence disagrees.
    expect(f.startState.warnings.map((w) => w.kind)).toContain('test-contradicts-settled');
    expect(f.explanation[1]).toMatch(/which a settled tank does not read/);
  });

  it('does not start from a test older than three days before the plan starts, and says the test is too old', async () => {
    const { user, c } = await keeper();
    const tank = await settledTank(user.id);
    await createReading(ctx.deps.dataSource, tank.id, { takenAt: new Date(Date.now() - 10 * DAY_MS), tanMgN: 2, no2MgN: 1 });
    const f = await newPlanForecast(c, tank.id);
    expect(f.startState.test?.used).toBe(false);
    expect(f.forecast.tanMgN[0]).toBeLessThan(0.5);
    expect(f.startState.warnings).toEqual([expect.objectContaining({ kind: 'test-old', daysBefore: 10 })]);
    expect(f.explanation.join(' ')).toMatch(/too old to start from/);
  });

  it('starts from the same test for a plan beginning two days after it, not for one beginning after a test taken later', async () => {
    const { user, c } = await keeper();
    const tank = await settledTank(user.id);
    const dayAfterTomorrow = new Date(Date.now() + 2 * DAY_MS).toISOString().slice(0, 10);
    await createReading(ctx.deps.dataSource, tank.id, { takenAt: new Date(Date.now() - 3_600_000), tanMgN: 1.5, no2MgN: 0.5 });
    const later = await newPlanForecast(c, tank.id, dayAfterTomorrow);
    expect(later.startState.test?.used).toBe(true);
    expect(later.forecast.tanMgN[0]).toBeCloseTo(1.5, 6);
    // A plan that began last month starts from what was known then (nothing): the test is its history, not its start.
    const earlier = await newPlanForecast(c, tank.id, new Date(Date.now() - 30 * DAY_MS).toISOString().slice(0, 10));
    expect(earlier.startState.test).toBeNull();
  });
});

describe("the keeper's account of the tank's past", () => {
  it('is stored on the tank, refused by field when malformed, and an emptied filter starts with fewer nitrifiers than a settled one', async () => {
    const { user, c } = await keeper();
    const tank = await createTank(ctx.deps.dataSource, user.id);
    const bad = await c.patch(`/api/tanks/${tank.id}`, { history: { kind: 'emptied', matureUntil: '2026-02-30', formerFish: [] } }).expect(400);
    expect(Object.keys(bad.body.error.fields)).toEqual(expect.arrayContaining(['history.matureUntil', 'history.formerFish']));
    const matureUntil = new Date(Date.now() - 14 * DAY_MS).toISOString().slice(0, 10);
    const history = { kind: 'emptied', matureUntil, formerFish: [{ speciesId: 'neon-tetra', count: 20 }] };
    const saved = tankDetailSchema.parse((await c.patch(`/api/tanks/${tank.id}`, { history }).expect(200)).body);
    expect(saved.history).toEqual(history);
    const emptied = await newPlanForecast(c, tank.id);
    expect(emptied.startReason).toBe('described-emptied');
    expect(emptied.explanation[0]).toMatch(/fed 20 Neon tetra until/i);

    // The same filter as if it still had its 20 fish (starved 0 days): more capacity at day 0.
    await c.patch(`/api/tanks/${tank.id}`, { history: { ...history, matureUntil: today() } }).expect(200);
    const fresh = await newPlanForecast(c, tank.id);
    expect(fresh.forecast.aoMgNPerDay[0]).toBeGreaterThan(emptied.forecast.aoMgNPerDay[0]);

    // A new tank, as the keeper says: hardly any nitrifiers, far fewer than the emptied filter kept.
    await c.patch(`/api/tanks/${tank.id}`, { history: { kind: 'new' } }).expect(200);
    const fresher = await newPlanForecast(c, tank.id);
    expect(fresher.startReason).toBe('described-new');
    expect(fresher.forecast.aoMgNPerDay[0]).toBeLessThan(emptied.forecast.aoMgNPerDay[0]);
    // Seeded with half mature media: between new and settled.
    await c.patch(`/api/tanks/${tank.id}`, { history: { kind: 'seeded', sharePercent: 50 } }).expect(200);
    expect((await newPlanForecast(c, tank.id)).startReason).toBe('described-seeded');
    await c.patch(`/api/tanks/${tank.id}`, { history: null }).expect(200);
    expect((await newPlanForecast(c, tank.id)).startReason).toBe('new-unseeded');
  });
});

describe('an applied fit', () => {
  it('is kept, applied with one call, used by the next forecast, which says how much its band narrowed; and can be dropped', async () => {
    const ds = ctx.deps.dataSource;
    const { user, c } = await keeper();
    const tank = await settledTank(user.id);
    // Invented log of a settled tank: ammonia and nitrite near zero for three weeks, taken before the plan's day.
    for (let d = 21; d >= 6; d -= 3) await createReading(ds, tank.id, { takenAt: new Date(Date.now() - d * DAY_MS), tanMgN: 0.05, no2MgN: 0.02 });
    const before = await newPlanForecast(c, tank.id);
    expect(before.startReason).toBe('mature-present-load');
    expect(before.fitBand).toBeNull();

    const fit = calibrationAdviceResponseSchema.parse((await c.post(`/api/tanks/${tank.id}/calibration`, { fit: ['ao', 'no'] }).expect(200)).body);
    expect(fit.fit.appliedAt).toBeNull();
    expect(fit.fit.capacities.map((z) => z.zoneId).sort()).toEqual(fit.capacity.presentByZone.map((z) => z.zoneId).sort());
    await c.post(`/api/tanks/${tank.id}/fit`, { fitId: '00000000-0000-4000-8000-000000000000' }).expect(404);
    const applied = tankFitSchema.parse((await c.post(`/api/tanks/${tank.id}/fit`, { fitId: fit.fit.id }).expect(200)).body);
    expect(applied.appliedAt).not.toBeNull();
    const shown = tankDetailSchema.parse((await c.get(`/api/tanks/${tank.id}`).expect(200)).body);
    expect(shown.fit?.id).toBe(fit.fit.id);

    const after = await newPlanForecast(c, tank.id);
    expect(after.startReason).toBe('fitted');
    expect(after.startState.fittedAt).toBe(applied.fittedAt);
    // Day-0 capacity is the fitted one (summed over zones).
    const fitted = fit.capacity.presentByZone.reduce((s, z) => s + z.aoMgNPerDay, 0);
    expect(after.forecast.aoMgNPerDay[0]).toBeCloseTo(fitted, 0);
    // The band is compared with the same plan started as before: "prior" is that band's width, "calibrated" this one's.
    const band = after.fitBand!;
    expect(band.tanMgN.calibrated).toBeCloseTo(meanBandWidth(after.forecast.band!.tanMgN), 3);
    expect(band.tanMgN.prior).toBeCloseTo(meanBandWidth(before.forecast.band!.tanMgN), 3);
    expect(band.tanMgN.calibrated).toBeLessThan(band.tanMgN.prior);
    const line = after.explanation.find((l) => l.startsWith('With the fit'))!;
    expect(line).toContain(`narrows by ${Math.round((1 - band.tanMgN.calibrated / band.tanMgN.prior) * 100)} %`);

    await c.del(`/api/tanks/${tank.id}/fit`).expect(204);
    expect((await newPlanForecast(c, tank.id)).startReason).toBe('mature-present-load');
  });

  it("is another keeper's 404", async () => {
    const { user } = await keeper('own@example.org');
    const tank = await settledTank(user.id);
    const { c } = await keeper('other@example.org');
    await c.post(`/api/tanks/${tank.id}/fit`, { fitId: '00000000-0000-4000-8000-000000000000' }).expect(404);
    await c.del(`/api/tanks/${tank.id}/fit`).expect(404);
  });
});
