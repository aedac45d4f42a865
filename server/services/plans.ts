import type { DataSource } from 'typeorm';
import { Between, MoreThanOrEqual } from 'typeorm';
import { independentQueries, isUniqueViolation, type Db } from '../data-source.js';
import { parseScenario, ScenarioError, type ScenarioEvent } from '../../simulation/scenario.js';
import type { PlanStatus } from '../../shared/schemas/tank.js';
import { MAX_HORIZON_DAYS, tankScenario, type ScenarioTank } from '../../shared/tank-scenario.js';
import type { StartReading } from '../../shared/tank-start.js';
import { buildTimeline } from '../../simulation/timeline.js';
import { DEFAULT_PARAMETERS } from '../../simulation/parameters.js';
import type { TankFit } from '../entities/tank-fit.js';
import { appliedFit } from './tank-fits.js';
import { Livestock } from '../entities/livestock.js';
import { Plan } from '../entities/plan.js';
import { Reading } from '../entities/reading.js';
import { Tank } from '../entities/tank.js';
import { planStateRefused, validationFailed } from '../errors.js';

/** A plan with the tank it belongs to (the owner already checked). */
export interface OwnPlan {
  plan: Plan;
  tank: Tank;
}

/** The plan only when its tank belongs to `ownerId`. */
export async function findOwnPlan(ds: DataSource, ownerId: string, planId: string): Promise<OwnPlan | null> {
  // One query: the plan with its tank, only when the tank is the keeper's.
  const found = await ds.getRepository(Plan).findOne({ where: { id: planId, tank: { ownerId } }, relations: { tank: true } });
  if (!found?.tank) return null;
  const { tank, ...fields } = found;
  return { plan: Object.assign(new Plan(), fields), tank };
}

export async function listTankPlans(ds: DataSource, tank: Tank): Promise<OwnPlan[]> {
  const plans = await ds.getRepository(Plan).find({ where: { tankId: tank.id }, order: { startDate: 'DESC', createdAt: 'DESC' } });
  return plans.map((plan) => ({ plan, tank }));
}

/** Every plan of the keeper's tanks, active first, then newest start. */
export async function listOwnPlans(ds: DataSource, ownerId: string): Promise<OwnPlan[]> {
  const tanks = await ds.getRepository(Tank).find({ where: { ownerId } });
  if (tanks.length === 0) return [];
  const byId = new Map(tanks.map((t) => [t.id, t]));
  const plans = await ds
    .getRepository(Plan)
    .createQueryBuilder('p')
    .where('p.tank_id IN (:...ids)', { ids: [...byId.keys()] })
    .orderBy(`CASE p.status WHEN 'active' THEN 0 WHEN 'draft' THEN 1 ELSE 2 END`)
    .addOrderBy('p.start_date', 'DESC')
    .addOrderBy('p.created_at', 'DESC')
    .getMany();
  return plans.map((plan) => ({ plan, tank: byId.get(plan.tankId)! }));
}

/**
 * A stored tank and its livestock as the engine's tank (shared/tank-scenario.ts). `readings`
 * are the tests the start rule may read (newest first; shared/tank-start.ts), `fit` the
 * applied fit; with `hasReadings` only, the tank's history is known but no test is used.
 */
export function toScenarioTank(tank: Tank, livestock: readonly Livestock[], hasReadings: boolean, evidence: { readings?: readonly Reading[]; fit?: TankFit | null } = {}): ScenarioTank {
  const readings = evidence.readings?.length ? evidence.readings.map(startReadingOf) : hasReadings ? [null] : [];
  return {
    volumeL: tank.volumeL,
    temperatureC: tank.temperatureC,
    ph: tank.ph,
    khDkh: tank.khDkh,
    tapWater: { tanMgN: tank.tapTanMgN, no2MgN: tank.tapNo2MgN, no3MgN: tank.tapNo3MgN },
    setup: tank.setup ?? {},
    history: tank.history ?? null,
    fit: evidence.fit ? { fittedAt: evidence.fit.fittedAt.toISOString(), capacities: evidence.fit.capacities } : null,
    livestock: livestock.map((l) => ({ id: l.id, speciesId: l.speciesId, customName: l.customName, count: l.count, lengthCm: l.lengthCm })),
    readings,
  };
}

function startReadingOf(r: Reading): StartReading {
  return { takenAt: r.takenAt.toISOString(), tanMgN: r.tanMgN, no2MgN: r.no2MgN, no3MgN: r.no3MgN, ph: r.ph, temperatureC: r.temperatureC };
}

const DAY_MS = 86_400_000;

/**
 * The stored tank for a scenario. With `startDate` (the forecast's day 0), also the latest
 * test with a nitrogen value up to the end of that day and the applied fit: the evidence the
 * start rule reads (shared/tank-start.ts).
 */
export async function scenarioTankOf(ds: Db, tank: Tank, startDate?: string): Promise<ScenarioTank> {
  if (!startDate) {
    const [livestock, hasReadings] = await independentQueries(
      ds,
      () => ds.getRepository(Livestock).find({ where: { tankId: tank.id }, order: { createdAt: 'ASC' } }),
      // Not a count: a tank's log grows for years, and only "any at all" matters here.
      () => ds.getRepository(Reading).exists({ where: { tankId: tank.id } }),
    );
    return toScenarioTank(tank, livestock, hasReadings);
  }
  const dayEnd = new Date(Date.parse(`${startDate}T00:00:00Z`) + DAY_MS);
  const [livestock, hasReadings, latest, fit] = await independentQueries(
    ds,
    () => ds.getRepository(Livestock).find({ where: { tankId: tank.id }, order: { createdAt: 'ASC' } }),
    () => ds.getRepository(Reading).exists({ where: { tankId: tank.id } }),
    () =>
      ds
        .getRepository(Reading)
        .createQueryBuilder('r')
        .where('r.tank_id = :id AND r.taken_at < :end', { id: tank.id, end: dayEnd })
        .andWhere('(r.tan_mg_n IS NOT NULL OR r.no2_mg_n IS NOT NULL OR r.no3_mg_n IS NOT NULL)')
        .orderBy('r.taken_at', 'DESC')
        .limit(1)
        .getMany(),
    () => appliedFit(ds, tank.id),
  );
  return toScenarioTank(tank, livestock, hasReadings, { readings: latest, fit });
}

/**
 * Refuses events that cannot run in this tank (e.g. rinsing a zone it does not have, taking
 * out fish it will not have, more fish than its water could hold), naming the event field.
 * Problems of the tank itself (a custom fish without a length) do not stop a plan being saved;
 * its forecast reports them. The timeline is cheap (bounded by the schema's work budget): no
 * forecast runs here.
 */
export async function checkEventsFitTank(ds: Db, tank: Tank, events: ScenarioEvent[]): Promise<void> {
  try {
    const scenario = parseScenario(tankScenario(await scenarioTankOf(ds, tank), { events }).scenario);
    buildTimeline(scenario, scenario.horizonDays ?? MAX_HORIZON_DAYS, DEFAULT_PARAMETERS);
  } catch (e) {
    if (!(e instanceof ScenarioError)) throw e;
    const eventFields = Object.fromEntries(Object.entries(e.fields).filter(([k]) => k.startsWith('events.')));
    if (Object.keys(eventFields).length > 0) throw validationFailed(eventFields);
  }
}

export interface PlanFields {
  name: string;
  startDate: string;
  events: ScenarioEvent[];
}

/** A new plan is always a draft: its status moves only through `startPlan` and `finishPlan`. */
export async function createPlan(ds: Db, tank: Tank, fields: PlanFields & { status?: 'draft' }): Promise<Plan> {
  await checkEventsFitTank(ds, tank, fields.events);
  const repo = ds.getRepository(Plan);
  return repo.save(repo.create({ tankId: tank.id, name: fields.name, startDate: fields.startDate, events: fields.events, status: 'draft' }));
}

const FINISHED_READ_ONLY = 'This plan is finished and kept as it ran: it cannot be changed. Start a new plan for the next change.';

/**
 * A draft changes freely. A running plan keeps the start date it was started on (day 0 is the
 * day the keeper began; the check days hang on it) but its name and events may change. A
 * finished plan is read-only.
 */
export async function updatePlan(ds: DataSource, own: OwnPlan, fields: Partial<PlanFields>): Promise<Plan> {
  const { status } = own.plan;
  if (status === 'done') throw planStateRefused(FINISHED_READ_ONLY);
  if (status === 'active' && fields.startDate !== undefined && fields.startDate !== own.plan.startDate)
    throw planStateRefused('A running plan keeps the day it was started as day 0.', { startDate: 'A running plan keeps the day it was started as day 0.' });
  if (fields.events) await checkEventsFitTank(ds, own.tank, fields.events);
  const repo = ds.getRepository(Plan);
  const changes = Object.fromEntries(Object.entries(fields).filter(([, v]) => v !== undefined)) as Partial<PlanFields>;
  await repo.update({ id: own.plan.id }, changes);
  return repo.findOneByOrFail({ id: own.plan.id });
}

const utcDay = (ms: number) => new Date(ms).toISOString().slice(0, 10);
/** The one index that keeps one running plan per tank (migration 1796326000000). */
const ONE_RUNNING_PER_TANK = 'plans_one_running_per_tank';

function anotherRunning(name: string) {
  return planStateRefused(`"${name}" is already running on this tank. Mark it as done first: one plan runs on a tank at a time.`);
}

/**
 * Starts a draft: day 0 becomes `startDate` (the keeper's today, which is within a day of the
 * server's UTC today in every time zone). Refused for a running or finished plan, a plan with
 * no events (it would have no check days), and while another plan of the tank runs (the
 * keeper finishes that one first; it is never ended behind their back). The partial unique
 * index decides a race between two starts.
 */
export async function startPlan(db: Db, own: OwnPlan, input: { startDate?: string }, now: Date): Promise<Plan> {
  const { plan } = own;
  if (plan.status === 'active') throw planStateRefused(`This plan is already running (day 0 was ${plan.startDate}).`);
  if (plan.status === 'done') throw planStateRefused(FINISHED_READ_ONLY);
  if (plan.events.length === 0) throw planStateRefused('Add at least one event before starting: a plan with nothing in it has no check days.', { events: 'Add at least one event.' });
  const startDate = input.startDate ?? utcDay(now.getTime());
  const offset = Math.abs(Date.parse(`${startDate}T00:00:00Z`) - Date.parse(`${utcDay(now.getTime())}T00:00:00Z`)) / DAY_MS;
  if (offset > 1) throw validationFailed({ startDate: 'A plan starts today: day 0 is the day you begin. Use today’s date.' });
  const repo = db.getRepository(Plan);
  const running = await repo.findOne({ where: { tankId: plan.tankId, status: 'active' }, select: { id: true, name: true } });
  if (running) throw anotherRunning(running.name);
  try {
    // Only a draft moves: a concurrent start or finish of this plan changes no row here.
    const moved = await repo.update({ id: plan.id, status: 'draft' }, { status: 'active', startDate, startedAt: now, finishedAt: null });
    if (!moved.affected) throw planStateRefused('This plan changed meanwhile; reload it.');
  } catch (err) {
    if (!isUniqueViolation(err, ONE_RUNNING_PER_TANK)) throw err;
    const other = await repo.findOne({ where: { tankId: plan.tankId, status: 'active' }, select: { id: true, name: true } });
    throw anotherRunning(other?.name ?? 'Another plan');
  }
  return repo.findOneByOrFail({ id: plan.id });
}

/** Marks a running plan done; it is kept read-only with its readings. Refused for a draft or a finished plan. */
export async function finishPlan(db: Db, own: OwnPlan, now: Date): Promise<Plan> {
  const { plan } = own;
  if (plan.status === 'draft') throw planStateRefused('This plan has not been started, so there is nothing to finish. Delete it if you no longer need it.');
  if (plan.status === 'done') throw planStateRefused(`This plan is already done (since ${plan.finishedAt ? utcDay(plan.finishedAt.getTime()) : 'earlier'}).`);
  const repo = db.getRepository(Plan);
  const moved = await repo.update({ id: plan.id, status: 'active' }, { status: 'done', finishedAt: now });
  if (!moved.affected) throw planStateRefused('This plan changed meanwhile; reload it.');
  return repo.findOneByOrFail({ id: plan.id });
}

/** Most tests one plan's readings answer holds (a year of tests, one a day, fits). */
export const PLAN_READING_LIMIT = 400;

/** The earliest a calendar day starts anywhere (UTC+14), so day 0 in the keeper's own zone is never cut. */
const EARLIEST_ZONE_MS = 14 * 3_600_000;

/**
 * The tank's tests taken while the plan ran, oldest first: from the first moment day 0 (its
 * start date) is day 0 in any time zone (the app keeps those of its own calendar) to when it
 * was marked done (or now). A draft has none. At most PLAN_READING_LIMIT, the first ones.
 */
export async function planReadings(ds: Db, own: OwnPlan): Promise<{ readings: Reading[]; total: number }> {
  const { plan } = own;
  if (plan.status === 'draft') return { readings: [], total: 0 };
  const from = new Date(Date.parse(`${plan.startDate}T00:00:00Z`) - EARLIEST_ZONE_MS);
  const where = { tankId: plan.tankId, takenAt: plan.finishedAt ? Between(from, plan.finishedAt) : MoreThanOrEqual(from) };
  const [readings, total] = await ds.getRepository(Reading).findAndCount({ where, order: { takenAt: 'ASC' }, take: PLAN_READING_LIMIT });
  return { readings, total };
}

export async function deletePlan(ds: DataSource, own: OwnPlan): Promise<void> {
  await ds.getRepository(Plan).delete({ id: own.plan.id });
}
