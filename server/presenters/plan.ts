import { planCheckDays } from '../../shared/plan-check-days.js';
import type { PlanDetail } from '../../shared/schemas/plan.js';
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
    events: plan.events,
    checkDays: planCheckDays(plan.events, plan.startDate),
    createdAt: plan.createdAt.toISOString(),
    updatedAt: plan.updatedAt.toISOString(),
  };
}
