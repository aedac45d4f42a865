import type { PlanItem, TankDetail, TankSummary, TankSummaryWithStatus } from '../../shared/schemas/tank.js';
import { tankStatus } from '../../shared/tank-status.js';
import type { Plan } from '../entities/plan.js';
import type { TankDetailRows, TankSummaryRow } from '../services/tanks.js';
import { presentLivestock } from './livestock.js';
import { presentReading } from './reading.js';
import { presentTankFit } from './tank-fit.js';

export function presentTankSummary(row: TankSummaryRow): TankSummary {
  const { tank, latestReading: r, activePlan: p } = row;
  return {
    id: tank.id,
    name: tank.name,
    volumeL: tank.volumeL,
    temperatureC: tank.temperatureC,
    ph: tank.ph,
    fishCount: row.fishCount,
    invertebrateCount: row.invertebrateCount,
    speciesCount: row.speciesCount,
    latestReading: r ? { takenAt: r.takenAt.toISOString(), tanMgN: r.tanMgN, no2MgN: r.no2MgN, no3MgN: r.no3MgN } : null,
    activePlan: p ? { id: p.id, name: p.name } : null,
  };
}

/** The summary plus the home status: the latest test judged against limits, and the next test day. */
export function presentTankSummaryWithStatus(row: TankSummaryRow, now: Date): TankSummaryWithStatus {
  const { tank, latestReading: r, activePlan: p } = row;
  return { ...presentTankSummary(row), status: tankStatus(tank, r, p ? { startDate: p.startDate, events: p.events } : null, now) };
}

export function presentPlan(p: Plan): PlanItem {
  return {
    id: p.id,
    name: p.name,
    startDate: p.startDate,
    status: p.status,
    startedAt: p.startedAt?.toISOString() ?? null,
    finishedAt: p.finishedAt?.toISOString() ?? null,
    events: p.events,
  };
}

export function presentTankDetail({ tank, livestock, readings, plans, fit }: TankDetailRows): TankDetail {
  return {
    id: tank.id,
    name: tank.name,
    volumeL: tank.volumeL,
    temperatureC: tank.temperatureC,
    ph: tank.ph,
    khDkh: tank.khDkh,
    tapWater: { tanMgN: tank.tapTanMgN, no2MgN: tank.tapNo2MgN, no3MgN: tank.tapNo3MgN },
    setup: tank.setup,
    notes: tank.notes,
    history: tank.history ?? null,
    fit: fit ? presentTankFit(fit) : null,
    livestock: livestock.map(presentLivestock),
    readings: readings.map(presentReading),
    plans: plans.map(presentPlan),
  };
}
