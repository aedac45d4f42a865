import type { DataSource } from 'typeorm';
import { independentQueries, type Db } from '../data-source.js';
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
import { validationFailed } from '../errors.js';

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
  status: PlanStatus;
  events: ScenarioEvent[];
}

export async function createPlan(ds: Db, tank: Tank, fields: PlanFields): Promise<Plan> {
  await checkEventsFitTank(ds, tank, fields.events);
  const repo = ds.getRepository(Plan);
  return repo.save(repo.create({ tankId: tank.id, ...fields }));
}

export async function updatePlan(ds: DataSource, own: OwnPlan, fields: Partial<PlanFields>): Promise<Plan> {
  if (fields.events) await checkEventsFitTank(ds, own.tank, fields.events);
  const repo = ds.getRepository(Plan);
  const changes = Object.fromEntries(Object.entries(fields).filter(([, v]) => v !== undefined)) as Partial<PlanFields>;
  await repo.update({ id: own.plan.id }, changes);
  return repo.findOneByOrFail({ id: own.plan.id });
}

export async function deletePlan(ds: DataSource, own: OwnPlan): Promise<void> {
  await ds.getRepository(Plan).delete({ id: own.plan.id });
}
