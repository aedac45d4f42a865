import { afterAll, describe, expect, it } from 'vitest';
import {
  additionResponseSchema,
  calibrationResponseSchema,
  removalResponseSchema,
  rescueResponseSchema,
} from '../../simulation/advice/schemas.js';
import { capacityTestResponseSchema, ensembleResponseSchema, planForecastResponseSchema } from '../../shared/schemas/plan.js';
import { addDays } from '../../shared/plan-check-days.js';
import { CSRF_HEADER, CSRF_HEADER_VALUE } from '../../shared/api-error.js';
import { forecastVerdict } from '../../shared/forecast-view.js';
import { applySchedule } from '../../shared/plan-schedule.js';
import { dayAsDate } from '../../simulation/calendar.js';
import type { ScenarioEvent } from '../../simulation/scenario.js';
import { closeEnginePool } from '../../server/workers/engine-pool.js';
import { GOOD_PASSWORD, createLivestock, createPlan, createReading, createTank, createUser } from './helpers/factories.js';
import { client, useTestApp } from './helpers/test-app.js';

const ctx = useTestApp();
afterAll(async () => {
  await closeEnginePool();
});

async function keeper(email = 'ray@example.org') {
  const user = await createUser(ctx.deps.dataSource, { email });
  const c = client(ctx.app);
  await c.post('/api/auth/sign-in', { email, password: GOOD_PASSWORD }).expect(200);
  return { user, c };
}

/** A settled 120 L tank with 12 neons (invented), optionally with a plan. */
async function settledTank(ownerId: string) {
  const ds = ctx.deps.dataSource;
  const tank = await createTank(ds, ownerId);
  await createLivestock(ds, tank.id, { speciesId: 'neon-tetra', count: 12, lengthCm: 3 });
  return tank;
}

const rasboras = { species: 'harlequin-rasbora', count: 12, lengthCm: 3 };

describe('POST /api/tanks/:tankId/advice/addition', () => {
  it('needs a session', async () => {
    await client(ctx.app).post('/api/tanks/00000000-0000-4000-8000-000000000000/advice/addition', { fish: rasboras }).expect(401);
  });

  it("answers the schedule beside all at once for the plan's fish, keeping the plan's other events", async () => {
    const { user, c } = await keeper();
    const tank = await settledTank(user.id);
    const plan = await createPlan(ctx.deps.dataSource, tank.id, {
      events: [
        { type: 'add-fish', day: 0, fish: [rasboras] },
        { type: 'water-change', day: 4, percent: 25 },
      ],
    });
    const res = await c.post(`/api/tanks/${tank.id}/advice/addition`, { planId: plan.id, fish: rasboras, searchDays: 60 }).expect(200);
    const advice = additionResponseSchema.parse(res.body);
    expect(['all-at-once-is-safe', 'staged', 'no-safe-schedule']).toContain(advice.status);
    // Every schedule adds exactly the fish asked for (addition-schedule.ts splitCount).
    if (advice.status !== 'no-safe-schedule') expect(advice.batches.reduce((n, b) => n + b.count, 0)).toBe(12);
    expect(advice.events.every((e) => e.type === 'add-fish')).toBe(true);
    expect(advice.allAtOnce.upperEdge.limits.length).toBeGreaterThan(0);
    expect(advice.explanation.length).toBeGreaterThan(0);
    expect(advice.cautions.join(' ')).toMatch(/estimate/);
  });

  it('keeps the planned day: neons planned for day 7 are never scheduled earlier, the answer is dated from the plan start, and applying it keeps the forecast under the limits (issue 14)', async () => {
    const { user, c } = await keeper();
    const tank = await settledTank(user.id);
    const neons = { species: 'neon-tetra', count: 6, lengthCm: 3 };
    const platies = { species: 'platy', count: 2 };
    const events: ScenarioEvent[] = [
      { type: 'add-fish', day: 2, fish: [platies] },
      { type: 'add-fish', day: 7, fish: [neons] },
      { type: 'water-change', day: 10, percent: 25 },
    ];
    const plan = await createPlan(ctx.deps.dataSource, tank.id, { startDate: '2026-12-04', events });
    // Asking for an earlier first day does not move the planned day.
    const res = await c.post(`/api/tanks/${tank.id}/advice/addition`, { planId: plan.id, fish: neons, searchDays: 60, constraints: { firstDay: 0 } }).expect(200);
    const advice = additionResponseSchema.parse(res.body);
    expect(advice.earliestDay).toBe(7);
    expect(advice.status).not.toBe('no-safe-schedule');
    expect(Math.min(...advice.batches.map((b) => b.day))).toBeGreaterThanOrEqual(7);
    expect(advice.finishDate).toBe(addDays('2026-12-04', advice.finishDay!));
    expect(advice.summary).toContain(dayAsDate('2026-12-04', advice.finishDay!));

    // Apply as the plan editor does, save, and forecast the saved plan.
    const next = applySchedule(events, advice.events as ScenarioEvent[])!;
    expect(next.filter((e) => e.type === 'add-fish' && e.fish[0].species === 'platy')).toEqual([events[0]]);
    expect(next.filter((e) => e.type === 'add-fish' && e.fish[0].species === 'neon-tetra').map((e) => e.day)).toEqual(advice.batches.map((b) => b.day));
    await c.agent.patch(`/api/plans/${plan.id}`).set(CSRF_HEADER, CSRF_HEADER_VALUE).send({ events: next }).expect(200);
    const forecast = planForecastResponseSchema.parse((await c.post(`/api/plans/${plan.id}/forecast`, {}).expect(200)).body);
    // The advice promised the band's upper edge stays under; the saved plan's own verdict agrees.
    expect(forecastVerdict(forecast.forecast).level).not.toBe('over');
  });

  it('when nothing is safe within the limits, names the limit in the way and offers suggestions it checked', async () => {
    const { user, c } = await keeper();
    const tank = await settledTank(user.id);
    const many = { species: 'platy', count: 30 };
    const res = await c.post(`/api/tanks/${tank.id}/advice/addition`, { fish: many, searchDays: 30, constraints: { maxBatches: 1 } }).expect(200);
    const advice = additionResponseSchema.parse(res.body);
    if (advice.status !== 'no-safe-schedule') return expect(advice.batches).toEqual([{ day: 0, count: 30 }]);
    expect(advice.blocker).not.toBeNull();
    expect(advice.binding.key).toBe(advice.blocker!.limit);
    expect(advice.suggestions.every((s) => s.batches.length > 0 && s.summary.length > 0)).toBe(true);
    expect(advice.finishDate).toBeNull();
  });

  it.each([
    ['searchDays', { fish: rasboras, searchDays: 0 }],
    ['fish.count', { fish: { ...rasboras, count: 0 } }],
    ['fish', {}],
    ['constraints.maxBatches', { fish: rasboras, constraints: { maxBatches: 50 } }],
    ['planId', { fish: rasboras, planId: 'not-a-plan' }],
    ['settings.limits.sensitivityFactor', { fish: rasboras, settings: { limits: { sensitivityFactor: 2 } } }],
  ] as [string, object][])('refuses a bad %s with 400 naming it', async (field, body) => {
    const { user, c } = await keeper();
    const tank = await settledTank(user.id);
    const res = await c.post(`/api/tanks/${tank.id}/advice/addition`, body).expect(400);
    expect(res.body.error.fields).toHaveProperty([field]);
  });

  it('answers 400, not 500, when the advice layer refuses the request', async () => {
    const { user, c } = await keeper();
    const tank = await settledTank(user.id);
    // latestFinishDay before firstDay leaves no possible day (addition-schedule.ts RangeError).
    const res = await c.post(`/api/tanks/${tank.id}/advice/addition`, { fish: rasboras, constraints: { firstDay: 10, latestFinishDay: 5 } }).expect(400);
    expect(res.body.error.message).toMatch(/no possible day/);
  });

  it("answers 404 for another keeper's tank, and for a plan of another tank", async () => {
    const ds = ctx.deps.dataSource;
    const { user, c } = await keeper();
    const other = await createUser(ds, { email: 'skate@example.org' });
    const foreign = await settledTank(other.id);
    const foreignPlan = await createPlan(ds, foreign.id);
    await c.post(`/api/tanks/${foreign.id}/advice/addition`, { fish: rasboras }).expect(404);
    const mine = await settledTank(user.id);
    await c.post(`/api/tanks/${mine.id}/advice/addition`, { fish: rasboras, planId: foreignPlan.id }).expect(404);
  });
});

describe('POST /api/tanks/:tankId/advice/removal', () => {
  it('answers the supplementary dose in mg N/L, grams and mL, with dosing and rehoming cautions', async () => {
    const { user, c } = await keeper();
    const tank = await settledTank(user.id);
    const res = await c
      .post(`/api/tanks/${tank.id}/advice/removal`, { removals: [{ species: 'neon-tetra', count: 12 }], restockDay: 21, solution: { percentNH3: 10 } })
      .expect(200);
    const advice = removalResponseSchema.parse(res.body);
    expect(advice.dose.mgNPerLPerDay).toBeGreaterThanOrEqual(0);
    // NH4Cl is 26.2 % N by mass (14.007 / 53.49, CRC Handbook molar masses): grams follow from mg N/L × 120 L.
    if (advice.dose.mgNPerLPerDay > 0) expect(advice.dose.ammoniumChlorideGPerDay).toBeCloseTo((advice.dose.mgNPerLPerDay * 120) / 1000 / (14.007 / 53.49), 2);
    expect(advice.dose.ammoniaSolutionMlPerDay).not.toBeNull();
    expect(advice.cautions.join(' ')).toMatch(/gloves/);
    expect(advice.cautions.join(' ')).toMatch(/never release/);
  });

  it('refuses a restock day of 0 with 400 naming it', async () => {
    const { user, c } = await keeper();
    const tank = await settledTank(user.id);
    const res = await c.post(`/api/tanks/${tank.id}/advice/removal`, { removals: [{ species: 'neon-tetra', count: 2 }], restockDay: 0 }).expect(400);
    expect(res.body.error.fields).toHaveProperty('restockDay');
  });

  it("answers 404 for another keeper's tank", async () => {
    const other = await createUser(ctx.deps.dataSource, { email: 'skate@example.org' });
    const foreign = await settledTank(other.id);
    const { c } = await keeper();
    await c.post(`/api/tanks/${foreign.id}/advice/removal`, { removals: [], restockDay: 10 }).expect(404);
  });
});

describe('POST /api/tanks/:tankId/advice/rescue', () => {
  it("answers the water changes for a plan's spike, with the plan from the database", async () => {
    const { user, c } = await keeper();
    const tank = await settledTank(user.id);
    const plan = await createPlan(ctx.deps.dataSource, tank.id, { events: [{ type: 'add-fish', day: 1, fish: [{ species: 'harlequin-rasbora', count: 40, lengthCm: 3 }] }] });
    const advice = rescueResponseSchema.parse((await c.post(`/api/tanks/${tank.id}/advice/rescue`, { planId: plan.id, maxPercent: 50 }).expect(200)).body);
    expect(['no-changes-needed', 'rescued', 'cannot-rescue']).toContain(advice.status);
    expect(advice.changes.every((ch) => ch.percent <= 50)).toBe(true);
    expect(advice.cautions.join(' ')).toMatch(/dechlorinator/);
  });

  it('refuses a maximum above 100 % with 400 naming it', async () => {
    const { user, c } = await keeper();
    const tank = await settledTank(user.id);
    expect((await c.post(`/api/tanks/${tank.id}/advice/rescue`, { maxPercent: 150 }).expect(400)).body.error.fields).toHaveProperty('maxPercent');
  });

  it("answers 404 for another keeper's tank", async () => {
    const other = await createUser(ctx.deps.dataSource, { email: 'skate@example.org' });
    const foreign = await settledTank(other.id);
    const { c } = await keeper();
    await c.post(`/api/tanks/${foreign.id}/advice/rescue`, {}).expect(404);
  });
});

describe('POST /api/tanks/:tankId/ensemble', () => {
  it('answers a 10–50–90 % band of the plan from 64 members', async () => {
    const { user, c } = await keeper();
    const tank = await settledTank(user.id);
    const plan = await createPlan(ctx.deps.dataSource, tank.id);
    const body = ensembleResponseSchema.parse((await c.post(`/api/tanks/${tank.id}/ensemble`, { planId: plan.id }).expect(200)).body);
    expect(body.members + body.failed).toBe(64);
    body.band.tanMgN.p10.forEach((lo, i) => expect(body.band.tanMgN.p90[i]).toBeGreaterThanOrEqual(lo));
  });

  it('refuses fewer than 64 members with 400 naming it, and 404s for another keeper', async () => {
    const ds = ctx.deps.dataSource;
    const { user, c } = await keeper();
    const tank = await settledTank(user.id);
    expect((await c.post(`/api/tanks/${tank.id}/ensemble`, { members: 8 }).expect(400)).body.error.fields).toHaveProperty('members');
    const other = await createUser(ds, { email: 'skate@example.org' });
    await c.post(`/api/tanks/${(await settledTank(other.id)).id}/ensemble`, {}).expect(404);
  });
});

describe('POST /api/tanks/:tankId/calibration', () => {
  it("fits the model to the tank's own logged tests", async () => {
    const ds = ctx.deps.dataSource;
    const { user, c } = await keeper();
    const tank = await settledTank(user.id);
    const now = Date.now();
    // Invented log of a settled tank: ammonia and nitrite near zero for three weeks.
    for (let d = 21; d >= 0; d -= 3) await createReading(ds, tank.id, { takenAt: new Date(now - d * 86_400_000), tanMgN: 0.05, no2MgN: 0.02 });
    const res = await c.post(`/api/tanks/${tank.id}/calibration`, { fit: ['ao', 'no'], forecastDays: 14 }).expect(200);
    const body = calibrationResponseSchema.extend({}).passthrough().parse(res.body);
    expect(res.body.readingsUsed).toBe(8);
    expect(body.fitted.aoFactor).toBeGreaterThan(0);
    expect(['good', 'fair', 'poor']).toContain(body.quality.verdict);
    expect(body.cautions.length).toBeGreaterThan(0);
  });

  it('fits a settled log with one high test (issue 14) by converging, with a bounded number of forecasts, and says which way the band moved', async () => {
    const ds = ctx.deps.dataSource;
    const { user, c } = await keeper();
    const tank = await settledTank(user.id);
    const now = Date.now();
    for (let d = 21; d >= 3; d -= 3) await createReading(ds, tank.id, { takenAt: new Date(now - d * 86_400_000), tanMgN: 0.05, no2MgN: 0.02 });
    await createReading(ds, tank.id, { takenAt: new Date(now - 3_600_000), tanMgN: 2, no2MgN: 1 });
    const body = calibrationResponseSchema.parse((await c.post(`/api/tanks/${tank.id}/calibration`, {}).expect(200)).body);
    // Before the fix every fit ran 383 forecasts (the optimiser never stopped early).
    expect(body.quality.stop).not.toBe('iterations');
    expect(body.quality.forecasts).toBeLessThan(150);
    const line = body.explanation.find((l) => l.startsWith('With the fit'))!;
    const tan = body.band.meanWidthTan;
    if (tan.calibrated > tan.prior * 1.05) expect(line).toMatch(/total ammonia widens/);
    if (tan.calibrated < tan.prior * 0.95) expect(line).toMatch(/total ammonia narrows by \d+ %/);
  });

  it('answers 400 naming readings when the tank has fewer than two tests', async () => {
    const { user, c } = await keeper();
    const tank = await settledTank(user.id);
    await createReading(ctx.deps.dataSource, tank.id);
    expect((await c.post(`/api/tanks/${tank.id}/calibration`, {}).expect(400)).body.error.fields).toHaveProperty('readings');
  });

  it('refuses an unknown fit key with 400 naming it, and 404s for another keeper', async () => {
    const ds = ctx.deps.dataSource;
    const { user, c } = await keeper();
    const tank = await settledTank(user.id);
    expect((await c.post(`/api/tanks/${tank.id}/calibration`, { fit: ['everything'] }).expect(400)).body.error.fields).toHaveProperty(['fit.0']);
    const other = await createUser(ds, { email: 'skate@example.org' });
    await c.post(`/api/tanks/${(await settledTank(other.id)).id}/calibration`, {}).expect(404);
  });
});

describe('POST /api/tanks/:tankId/capacity-test', () => {
  it('answers the protocol for an empty tank, then an estimate from the test readings', async () => {
    const ds = ctx.deps.dataSource;
    const { user, c } = await keeper();
    const tank = await createTank(ds, user.id);
    const protocol = capacityTestResponseSchema.parse((await c.post(`/api/tanks/${tank.id}/capacity-test`, {}).expect(200)).body);
    // Reading times of the guided test: hours 0, 4, 8, 24 (capacity-test.ts READING_HOURS).
    expect(protocol.protocol.readingHours).toEqual([0, 4, 8, 24]);
    expect(protocol.estimate).toBeNull();
    expect(protocol.protocol.cautions.join(' ')).toMatch(/gloves/);
    const dose = protocol.protocol.doseMgNPerL;
    const test = { doseMgNPerL: dose, readings: [{ hour: 0, tanMgN: dose }, { hour: 4, tanMgN: dose * 0.9 }, { hour: 8, tanMgN: dose * 0.8 }, { hour: 24, tanMgN: dose * 0.5 }] };
    const estimated = capacityTestResponseSchema.parse((await c.post(`/api/tanks/${tank.id}/capacity-test`, { test }).expect(200)).body);
    expect(estimated.estimate?.capacity.presentAoMgNPerDay).toBeGreaterThan(0);
  });

  it('refuses a dose above 10 mg N/L with 400 naming it, and 404s for another keeper', async () => {
    const ds = ctx.deps.dataSource;
    const { user, c } = await keeper();
    const tank = await createTank(ds, user.id);
    const bad = { test: { doseMgNPerL: 20, readings: [{ hour: 0, tanMgN: 1 }, { hour: 4, tanMgN: 1 }] } };
    expect((await c.post(`/api/tanks/${tank.id}/capacity-test`, bad).expect(400)).body.error.fields).toHaveProperty(['test.doseMgNPerL']);
    const other = await createUser(ds, { email: 'skate@example.org' });
    await c.post(`/api/tanks/${(await createTank(ds, other.id)).id}/capacity-test`, {}).expect(404);
  });
});
