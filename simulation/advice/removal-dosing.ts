/**
 * Keeping a biofilter for a planned restock (issue 4, point 3). After a rehoming, or while a
 * tank stands empty, the nitrifiers shrink toward the smaller load (model.md §6.4). A daily
 * supplementary ammonia dose from the removal day until the day before the restock keeps
 * them at the size the restocked tank needs.
 *
 * Target: the ammonia-oxidiser capacity the tank would settle at carrying the restocked fish
 * (the engine's mature steady state for that stocking). Dose: found by bisection on the daily
 * dose (capacity at the restock day rises with the dose) with the engine at its default
 * values. Feeding: food beyond what the remaining fish eat still becomes ammonia through
 * detritus (model.md §4), so grams-per-day feeding is cut in proportion to the fish mass left;
 * feeding given as a share of body mass already follows the fish.
 */
import type { FishGroup, Scenario, ScenarioEvent } from '../scenario';
import { fishMassG } from '../bioload';
import { fishGroupName } from '../catalogue';
import { ammoniaSolutionForDose, ammoniumChlorideForDose, type AmmoniaSolution } from '../dosing';
import { steadyStateCapacity } from '../capacity';
import { forecastParsed, type Forecast } from '../forecast';
import { DEFAULT_PARAMETERS } from '../parameters';
import { adviceContext, type AdviceSettings } from './advice-context';
import { DOSING_CAUTIONS, ESTIMATE_CAUTIONS, REHOMING_CAUTIONS } from './cautions';
import { runConditionedEnsemble } from './ensemble';
import { bandExplanation } from './ensemble';
import { describeOutcome } from './explain';
import { settledTankAccepts } from './judge';
import { planOutcome, type PlanOutcome } from './plan-outcome';
import { withEvents } from './scenario-edit';
import { formatValue, type AppliedLimit } from './tank-limits';

export interface RemovalRequest {
  /** The tank as it is now, with all its fish. */
  scenario: Scenario;
  /** Fish leaving (species or name, and count), on `removalDay`; empty when the tank is already empty. */
  removals: { species?: string; name?: string; count: number }[];
  removalDay?: number;
  restockDay: number;
  /** Fish planned for the restock; default: the same fish that leave. */
  restock?: FishGroup[];
  /** The keeper's ammonia solution, for the dose in mL. */
  solution?: AmmoniaSolution;
  /** Days forecast after the restock (default 28). */
  daysAfterRestock?: number;
  settings?: AdviceSettings;
}

export interface DoseAmounts {
  mgNPerLPerDay: number;
  ammoniumChlorideGPerDay: number;
  ammoniaSolutionMlPerDay: number | null;
  solution: AmmoniaSolution | null;
}

export interface RemovalAdvice {
  targetCapacityMgNPerDay: number;
  /** capacity at the restock day with the advice / without it (engine defaults) */
  capacityAtRestock: { withAdvice: number; withoutAdvice: number };
  dose: DoseAmounts;
  feeding: { before: string; after: string; cutShare: number };
  events: ScenarioEvent[];
  withAdvice: PlanOutcome;
  withoutAdvice: PlanOutcome;
  limits: AppliedLimit[];
  explanation: string[];
  cautions: string[];
}

function groupMass(groups: { species?: string; name?: string; count: number; lengthCm?: number; massG?: number; shape?: FishGroup['shape'] }[], b: number): number {
  return groups.reduce((s, g) => s + g.count * fishMassG(g, b), 0);
}

function removedGroups(scenario: Scenario, removals: RemovalRequest['removals']): FishGroup[] {
  return removals.map((r) => {
    const match = scenario.fish.find((f) => (r.species !== undefined ? f.species === r.species : f.name === r.name));
    if (!match) throw new RangeError(`This tank holds no ${fishGroupName(r)} to rehome.`);
    return { ...match, count: r.count };
  });
}

function capacityAt(f: Forecast, day: number): number {
  const i = f.series.days.findIndex((d) => d >= day - 1e-9);
  return f.series.zones.reduce((s, z) => s + z.ao[i], 0);
}

export function supplementaryDosing(request: RemovalRequest): RemovalAdvice {
  const { scenario } = request;
  const removalDay = request.removalDay ?? 0;
  const restockDay = request.restockDay;
  if (!(Number.isInteger(restockDay) && restockDay > removalDay)) throw new RangeError('restockDay must be a whole day after the removal day');
  const b = DEFAULT_PARAMETERS.lengthWeightB;
  const removed = removedGroups(scenario, request.removals);
  const restock = request.restock ?? removed;
  const massBefore = groupMass(scenario.fish, b);
  const massRemoved = groupMass(removed, b);
  const massAfter = Math.max(0, massBefore - massRemoved);
  const keptShare = massBefore > 0 ? massAfter / massBefore : 0;

  // Target: the mature capacity for the stocking after the restock.
  // Remaining + restock: remove the leaving fish from the list first.
  const target = steadyStateCapacity({ ...scenario, fish: [...subtract(scenario.fish, removed), ...restock] }).aoMgNPerDay;

  const removalEvents: ScenarioEvent[] = removed.map((g) => ({ type: 'remove-fish', day: removalDay, species: g.species, name: g.species ? undefined : g.name, count: g.count }));
  const restockEvents: ScenarioEvent[] = restock.map((g) => ({ type: 'add-fish', day: restockDay, fish: g }));
  const feedingBefore = scenario.feeding;
  const feedingAfter =
    feedingBefore.mode === 'grams' ? { ...feedingBefore, gramsPerDay: feedingBefore.gramsPerDay * keptShare } : feedingBefore;
  const feedingBack = feedingBefore; // restored with the restock
  const feedEvents: ScenarioEvent[] =
    feedingBefore.mode === 'grams'
      ? [
          { type: 'feeding', day: removalDay, feeding: feedingAfter },
          { type: 'feeding', day: restockDay, feeding: feedingBack },
        ]
      : [];
  const horizon = restockDay + (request.daysAfterRestock ?? 28);
  const ctx = adviceContext(scenario, horizon, request.settings);
  // Without the advice: an emptied tank is no longer fed; a partly emptied one is fed as before.
  const stopFeeding: ScenarioEvent[] =
    massAfter === 0 && feedingBefore.mode === 'grams'
      ? [
          { type: 'feeding', day: removalDay, feeding: { ...feedingBefore, gramsPerDay: 0 } },
          { type: 'feeding', day: restockDay, feeding: feedingBack },
        ]
      : [];
  const base = withEvents(scenario, [...removalEvents, ...stopFeeding, ...restockEvents]);
  const doseEvents = (d: number): ScenarioEvent[] =>
    d > 0
      ? [{ type: 'ammonia-dose', day: removalDay, amount: { unit: 'mgN-per-L', value: d }, repeatEveryDays: 1, repeatCount: restockDay - removalDay }]
      : [];
  const withPlan = (d: number) => withEvents(base, [...feedEvents, ...doseEvents(d)]);
  const capOpts = { ...ctx.options, horizonDays: restockDay, stepDays: 1 };
  const capWith = (d: number) => capacityAt(forecastParsed(withPlan(d), capOpts), restockDay);

  // Bisection on the dose (mg N/L/day): capacity at the restock rises with it.
  let lo = 0;
  let dose = 0;
  if (capWith(0) < target) {
    let hi = Math.max(0.05, (2 * target) / scenario.tank.volumeL);
    while (capWith(hi) < target && hi < 50) hi *= 2;
    for (let i = 0; i < 30 && hi - lo > 1e-4 * hi; i++) {
      const mid = 0.5 * (lo + hi);
      if (capWith(mid) < target) lo = mid;
      else hi = mid;
    }
    dose = Math.min(hi, 50); // the engine refuses single doses over 50 mg N/L
  }
  const events = [...removalEvents, ...feedEvents, ...doseEvents(dose), ...restockEvents];
  const withScenario = withEvents(scenario, [...feedEvents, ...doseEvents(dose), ...removalEvents, ...restockEvents]);
  const accept = settledTankAccepts(scenario, ctx.limits, 1);
  const ensembleWith = runConditionedEnsemble(withScenario, ctx.ensemble, ctx.options, accept);
  const ensembleWithout = runConditionedEnsemble(base, ctx.ensemble, ctx.options, accept);
  const withAdvice = planOutcome(ensembleWith.forecasts, ctx.limits, forecastParsed(withScenario, ctx.options));
  const withoutAdvice = planOutcome(ensembleWithout.forecasts, ctx.limits, forecastParsed(base, ctx.options));

  const V = scenario.tank.volumeL;
  const doseAmounts: DoseAmounts = {
    mgNPerLPerDay: dose,
    ammoniumChlorideGPerDay: dose > 0 ? ammoniumChlorideForDose(dose, V) : 0,
    ammoniaSolutionMlPerDay: request.solution && dose > 0 ? ammoniaSolutionForDose(dose, request.solution, V) : request.solution ? 0 : null,
    solution: request.solution ?? null,
  };
  const describeFeeding = (f: typeof feedingBefore) =>
    f.mode === 'grams' ? `${formatValue(f.gramsPerDay)} g of food a day` : `${f.percentPerDay ?? DEFAULT_PARAMETERS.feedPercent} % of the fish's body mass a day`;
  const explanation: string[] = [];
  explanation.push(
    `To take the restock on day ${restockDay} without a spike, the filter bacteria should be able to clear about ${formatValue(target)} mg of ammonia-nitrogen a day by then — what this tank settles at with the restocked fish.`,
  );
  if (dose > 0) {
    const sol = doseAmounts.ammoniaSolutionMlPerDay !== null && request.solution ? ` or ${formatValue(doseAmounts.ammoniaSolutionMlPerDay)} mL of your ${request.solution.percentNH3} % ammonia solution` : '';
    explanation.push(
      `Dose ${formatValue(dose)} mg N/L every day from day ${removalDay} to day ${restockDay - 1}: ${formatValue(doseAmounts.ammoniumChlorideGPerDay)} g of ammonium chloride${sol} in your ${formatValue(V)} L. This replaces the ammonia the departed fish supplied.`,
    );
  } else {
    explanation.push('No extra ammonia is needed: the fish that stay keep enough filter bacteria fed for the restock.');
  }
  if (feedingBefore.mode === 'grams') {
    explanation.push(
      `Cut feeding from ${describeFeeding(feedingBefore)} to ${describeFeeding(feedingAfter)} for the fish that stay, and go back up with the restock. Food the fish do not eat still rots into ammonia, so feeding the old amount to fewer fish does not lower the load — it only moves it into the gravel.`,
    );
  } else {
    explanation.push(
      `Feeding is set as a share of the fish's body mass, so it falls with the fish that leave. Do not keep feeding the old amount: food the fish do not eat still rots into ammonia.`,
    );
  }
  explanation.push(
    `Ammonia the filter bacteria can clear on the restock day (at the model's usual values): about ${formatValue(capacityAt(forecastParsed(withPlan(dose), capOpts), restockDay))} mg N a day with this advice, ${formatValue(capacityAt(forecastParsed(base, capOpts), restockDay))} mg N a day without it.`,
  );
  explanation.push(describeOutcome(withAdvice, ctx.limits, 'With the advice'));
  explanation.push(describeOutcome(withoutAdvice, ctx.limits, 'Without it'));
  explanation.push(bandExplanation(ensembleWith.forecasts.length));
  return {
    targetCapacityMgNPerDay: target,
    capacityAtRestock: {
      withAdvice: capacityAt(forecastParsed(withPlan(dose), capOpts), restockDay),
      withoutAdvice: capacityAt(forecastParsed(base, capOpts), restockDay),
    },
    dose: doseAmounts,
    feeding: { before: describeFeeding(feedingBefore), after: describeFeeding(feedingAfter), cutShare: feedingBefore.mode === 'grams' ? 1 - keptShare : 0 },
    events,
    withAdvice,
    withoutAdvice,
    limits: ctx.limits,
    explanation,
    cautions: [...ESTIMATE_CAUTIONS, ...(dose > 0 ? DOSING_CAUTIONS : []), ...(removed.length ? REHOMING_CAUTIONS : [])],
  };
}

/** The fish list with the removed counts taken out (by species, or by name for custom fish). */
function subtract(fish: readonly FishGroup[], removed: readonly FishGroup[]): FishGroup[] {
  const out = fish.map((f) => ({ ...f }));
  for (const r of removed) {
    let left = r.count;
    for (const f of out) {
      if (left === 0) break;
      const same = r.species !== undefined ? f.species === r.species : f.name === r.name;
      if (!same) continue;
      const take = Math.min(f.count, left);
      f.count -= take;
      left -= take;
    }
  }
  return out.filter((f) => f.count > 0);
}
