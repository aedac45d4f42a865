import { planCheckDays } from '../../shared/plan-check-days.js';
import type { PlanDetail, PlanReadings } from '../../shared/schemas/plan.js';
import type { Reading } from '../entities/reading.js';
import { presentReading } from './reading.js';
import type { OwnPlan } from '../services/plans.js';

/** A plan with its tank's name and its check days (when to test). */
export function presentPlanDetail({ plan, tank }: OwnPlan): PlanDetail {
  return {
    id: plan.id,
    tankId: tank.id,
    tankName: tank.name,
    name: plan.name,
    startDate: plan.startDate,
    status: plan.status,
    startedAt: plan.startedAt?.toISOString() ?? null,
    finishedAt: plan.finishedAt?.toISOString() ?? null,
    events: plan.events,
    checkDays: planCheckDays(plan.events, plan.startDate),
    createdAt: plan.createdAt.toISOString(),
    updatedAt: plan.updatedAt.toISOString(),
  };
}

/** The tests taken while a plan ran, oldest first. */
export function presentPlanReadings({ readings, total }: { readings: readonly Reading[]; total: number }): PlanReadings {
  return { readings: readings.map(presentReading), total };
}
