import type { DataSource } from 'typeorm';
import { MoreThanOrEqual } from 'typeorm';
import type { z } from 'zod';
import type {
  additionAdviceBodySchema,
  calibrationBodySchema,
  capacityTestBodySchema,
  ensembleBodySchema,
  removalAdviceBodySchema,
  rescueAdviceBodySchema,
} from '../../shared/schemas/plan.js';
import { parseScenario, ScenarioError, type Scenario, type ScenarioEvent, type Start } from '../../simulation/scenario.js';
import { tankScenario } from '../../shared/tank-scenario.js';
import { plannedDay, withoutFish } from '../../shared/plan-schedule.js';
import {
  additionResponseSchema,
  calibrationResponseSchema,
  capacityTestResponseSchema,
  ensembleResponseSchema,
  removalResponseSchema,
  rescueResponseSchema,
} from '../../simulation/advice/schemas.js';
import { CALIBRATION_DEFAULT_DAYS } from '../../shared/schemas/plan.js';
import { Plan } from '../entities/plan.js';
import { Reading } from '../entities/reading.js';
import type { Tank } from '../entities/tank.js';
import { notFound, validationFailed } from '../errors.js';
import { runEngine, type EngineCaller } from './engine-runs.js';
import { scenarioTankOf } from './plans.js';
import { keepOfferedFit } from './tank-fits.js';
import { fitAdvice } from '../../shared/fit-advice.js';
import type { Db } from '../data-source.js';

/**
 * Advice on a saved tank (and optionally one of its plans): the request carries only what the
 * keeper chooses; the tank and plan come from the database. Each function builds the scenario,
 * runs the advice on the engine pool and returns the advice layer's own response shape.
 */

const DAY_MS = 86_400_000;
/** Most readings one calibration uses (calibrationRequestSchema allows 2000; these are the newest). */
export const CALIBRATION_MAX_READINGS = 500;

/** The plan (or none), its events and its start date (day 0); without a plan, no events and today (UTC). */
async function planOf(ds: DataSource, tank: Tank, planId: string | undefined, now = new Date()): Promise<{ plan: Plan | null; events: ScenarioEvent[]; startDate: string }> {
  if (!planId) return { plan: null, events: [], startDate: now.toISOString().slice(0, 10) };
  const plan = await ds.getRepository(Plan).findOneBy({ id: planId, tankId: tank.id });
  if (!plan) throw notFound('No such plan on this tank.');
  return { plan, events: plan.events, startDate: plan.startDate };
}

/**
 * The tank's scenario running `events`. With `startDate` it starts from the tank's evidence
 * on that day (latest test, applied fit: shared/tank-start.ts); with `evidence: 'description'`
 * from its description or the default only (the calibration's prior, which the fit replaces).
 */
async function scenarioOf(ds: DataSource, tank: Tank, events: ScenarioEvent[], options: { start?: Start; horizonDays?: number; startDate?: string; evidence?: 'all' | 'description' } = {}): Promise<Scenario> {
  const readsEvidence = !options.start && options.evidence !== 'description';
  try {
    return parseScenario(tankScenario(await scenarioTankOf(ds, tank, readsEvidence ? options.startDate : undefined), { events }, options).scenario);
  } catch (e) {
    if (e instanceof ScenarioError) throw validationFailed(e.fields);
    throw e;
  }
}

/**
 * Fastest safe schedule for the fish. On a plan, the schedule replaces the plan's own additions
 * of these fish (its other events stay in the forecast), never starts before the first of them
 * (the keeper's planned day; a later `firstDay` asked for is kept), and is dated from the
 * plan's start date.
 */
export async function additionAdvice(ds: DataSource, tank: Tank, body: z.output<typeof additionAdviceBodySchema>, caller?: EngineCaller) {
  const { planId, ...request } = body;
  const plan = await planOf(ds, tank, planId);
  const events = withoutFish(plan.events, request.fish);
  const firstDay = Math.max(plannedDay(plan.events, request.fish), request.constraints?.firstDay ?? 0);
  const scenario = await scenarioOf(ds, tank, events, { horizonDays: 365, startDate: plan.startDate });
  const { value } = await runEngine(
    { kind: 'addition', request: { ...request, constraints: { ...request.constraints, firstDay }, ...(plan.plan ? { startDate: plan.startDate } : {}), scenario } },
    caller,
  );
  return additionResponseSchema.parse(value);
}

export async function removalAdvice(ds: DataSource, tank: Tank, body: z.output<typeof removalAdviceBodySchema>, caller?: EngineCaller) {
  const { planId, ...request } = body;
  const plan = await planOf(ds, tank, planId);
  const scenario = await scenarioOf(ds, tank, plan.events, { horizonDays: 365, startDate: plan.startDate });
  const { value } = await runEngine({ kind: 'removal', request: { ...request, scenario } }, caller);
  return removalResponseSchema.parse(value);
}

export async function rescueAdvice(ds: DataSource, tank: Tank, body: z.output<typeof rescueAdviceBodySchema>, caller?: EngineCaller) {
  const { planId, ...request } = body;
  const plan = await planOf(ds, tank, planId);
  const scenario = await scenarioOf(ds, tank, plan.events, { startDate: plan.startDate });
  const { value } = await runEngine({ kind: 'rescue', request: { ...request, scenario } }, caller);
  return rescueResponseSchema.parse(value);
}

export async function ensembleAdvice(ds: DataSource, tank: Tank, body: z.output<typeof ensembleBodySchema>, caller?: EngineCaller) {
  const plan = await planOf(ds, tank, body.planId);
  const scenario = await scenarioOf(ds, tank, plan.events, { startDate: plan.startDate });
  const { value } = await runEngine({ kind: 'ensemble', scenario, members: body.members, seed: body.seed, horizonDays: body.horizonDays }, caller);
  return ensembleResponseSchema.parse(value);
}

/** Fits the model to the tank's own logged ammonia and nitrite tests (day 0 = the first one used). */
export async function calibrationAdvice(ds: DataSource, db: Db, tank: Tank, body: z.output<typeof calibrationBodySchema>, caller?: EngineCaller, now = new Date()) {
  const since = new Date(now.getTime() - (body.sinceDays ?? CALIBRATION_DEFAULT_DAYS) * DAY_MS);
  const rows = (
    await ds.getRepository(Reading).find({
      where: { tankId: tank.id, takenAt: MoreThanOrEqual(since) },
      order: { takenAt: 'DESC' },
      take: CALIBRATION_MAX_READINGS,
    })
  )
    .filter((r) => r.tanMgN !== null || r.no2MgN !== null)
    .reverse();
  if (rows.length < 2) {
    throw validationFailed({ readings: 'Log at least two ammonia or nitrite tests in this period before fitting the model to them.' });
  }
  const t0 = rows[0].takenAt.getTime();
  const readings = rows.map((r) => ({
    day: (r.takenAt.getTime() - t0) / DAY_MS,
    ...(r.tanMgN !== null ? { tanMgN: Math.min(r.tanMgN, 100) } : {}),
    ...(r.no2MgN !== null ? { no2MgN: Math.min(r.no2MgN, 100) } : {}),
  }));
  const lastDay = readings.at(-1)!.day;
  // The prior: the tank as described (or by default) on the day of the first test; the fit replaces any fit applied before.
  const scenario = await scenarioOf(ds, tank, [], { horizonDays: Math.max(1, Math.ceil(lastDay) + 1), startDate: rows[0].takenAt.toISOString().slice(0, 10), evidence: 'description' });
  const { sinceDays: _since, ...options } = body;
  const { value } = await runEngine({ kind: 'calibration', request: { ...options, scenario, readings } }, caller);
  const result = calibrationResponseSchema.parse(value);
  // Kept as the tank's offered fit (through the key's transaction when there is one), so one tap applies it.
  const fit = await keepOfferedFit(db, tank, {
    lastReadingAt: rows.at(-1)!.takenAt,
    readingsUsed: rows.length,
    verdict: result.quality.verdict,
    capacities: result.capacity.presentByZone,
  });
  return { ...result, readingsUsed: rows.length, firstReadingAt: rows[0].takenAt.toISOString(), fit, advice: fitAdvice(readings, { verdict: result.quality.verdict, standardErrors: result.standardErrors }) };
}

export async function capacityTestAdvice(ds: DataSource, tank: Tank, body: z.output<typeof capacityTestBodySchema>, caller?: EngineCaller) {
  const scenario = await scenarioOf(ds, tank, [], body.start ? { start: body.start } : { startDate: new Date().toISOString().slice(0, 10) });
  const { value } = await runEngine({ kind: 'capacity-test', scenario, solution: body.solution, limits: body.limits, test: body.test }, caller);
  return capacityTestResponseSchema.parse(value);
}
