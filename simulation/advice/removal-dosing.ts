/**
 * Keeping a biofilter for a planned restock (issue 4, point 3). After a rehoming, or while a
 * tank stands empty, the nitrifiers shrink toward the smaller load (MODEL.md §3.4). A daily
 * supplementary ammonia dose from the removal day until the day before the restock keeps
 * them at the size the restocked tank needs.
 *
 * Target: the ammonia-oxidiser capacity the tank would settle at carrying the restocked fish
 * (the engine's mature steady state for that stocking). Dose: found by bisection on the daily
 * dose (capacity at the restock day rises with the dose) with the engine at its default
 * values. Feeding: food beyond what the remaining fish eat still becomes ammonia through
 * detritus (MODEL.md §6.2), so grams-per-day feeding is cut in proportion to the fish mass left;
 * feeding given as a share of body mass already follows the fish.
 *
 * Delivery (issue 13): while fish stay, the day's dose is split or given continuously, as far
 * as it takes to keep the forecast under its limits while dosing (./dose-delivery); an emptied
 * tank keeps one dose a day.
 */
import type { FishGroup, Scenario, ScenarioEvent } from '../scenario';
import { fishMassG } from '../bioload';
import { fishGroupName } from '../catalogue';
import { ammoniaSolutionForDose, ammoniumChlorideForDose, type AmmoniaSolution } from '../dosing';
import { steadyStateCapacity } from '../capacity';
import { forecastParsed, type Forecast } from '../forecast';
import { DEFAULT_PARAMETERS } from '../parameters';
import { adviceContext, type AdviceSettings } from './advice-context';
import { DOSING_CAUTIONS, DOSING_WITH_FISH_CAUTIONS, ESTIMATE_CAUTIONS, REHOMING_CAUTIONS } from './cautions';
import {
  boundingMembers,
  chooseDelivery,
  DELIVERY_CANDIDATES,
  deliveryFields,
  edgeRatioUntil,
  fitsBudget,
  largestDoseUnder,
  partsPerDay,
  verdictUntil,
  type DeliveryChoice,
} from './dose-delivery';
import { bandExplanation, bandOf, forecastMember, runConditionedEnsemble, type EnsembleResult } from './ensemble';
import { describeOutcome, limitByKey } from './explain';
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

/** How the day's dose goes in, with each part's amount (null for a steady flow) and why, in words. */
export interface DoseDelivery {
  method: DeliveryChoice['method'];
  /** parts a day (1 once a day; null continuous) */
  timesPerDay: number | null;
  perDose: { mgNPerL: number; ammoniumChlorideG: number; ammoniaSolutionMl: number | null } | null;
  /** whether the forecast's upper edge stays under every limit while dosing */
  underLimitsWhileDosing: boolean;
  /** the dose the restock needs, when it was lowered to keep the fish that stay under the limits; else null */
  reducedFrom: number | null;
  reason: string;
}

export interface RemovalAdvice {
  targetCapacityMgNPerDay: number;
  /** capacity at the restock day with the advice / without it (engine defaults) */
  capacityAtRestock: { withAdvice: number; withoutAdvice: number };
  dose: DoseAmounts;
  delivery: DoseDelivery;
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

  const removalEvents: ScenarioEvent[] = removed.map((g) => ({ type: 'remove-fish', day: removalDay, fish: [g.species ? { species: g.species, count: g.count } : { name: g.name, count: g.count }] }));
  const restockEvents: ScenarioEvent[] = restock.map((g) => ({ type: 'add-fish', day: restockDay, fish: [g] }));
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
  const doseEvents = (d: number, choice: DeliveryChoice): ScenarioEvent[] =>
    d > 0
      ? [{ type: 'ammonia-dose', day: removalDay, amount: { unit: 'mgN-per-L', value: d }, repeatEveryDays: 1, repeatCount: restockDay - removalDay, ...deliveryFields(choice) }]
      : [];
  const withPlan = (d: number, choice: DeliveryChoice) => withEvents(base, [...feedEvents, ...doseEvents(d, choice)]);
  const capOpts = { ...ctx.options, horizonDays: restockDay, stepDays: 1 };
  const capWith = (d: number, choice: DeliveryChoice) => capacityAt(forecastParsed(withPlan(d, choice), capOpts), restockDay);
  const onceADayCap = (d: number) => capWith(d, DELIVERY_CANDIDATES[0]);

  // Bisection on the dose (mg N/L/day): capacity at the restock rises with it — up to a point:
  // far above the load, free ammonia inhibits the nitrifiers and capacity falls again. So the
  // bracket grows from a small dose only while capacity still rises; past that peak the best
  // dose found is the answer (the target cannot be reached by dosing).
  const doseFor = (): number => {
    let lo = 0;
    if (onceADayCap(0) >= target) return 0;
    let hi = 0.05;
    let capHi = onceADayCap(hi);
    while (capHi < target && hi < 50) {
      const next = Math.min(50, 2 * hi);
      const capNext = onceADayCap(next);
      if (capNext <= capHi) return hi;
      lo = hi;
      hi = next;
      capHi = capNext;
    }
    if (capHi < target) return hi;
    for (let i = 0; i < 30 && hi - lo > 1e-4 * hi; i++) {
      const mid = 0.5 * (lo + hi);
      if (onceADayCap(mid) < target) lo = mid;
      else hi = mid;
    }
    return Math.min(hi, 50); // the engine refuses single doses over 50 mg N/L
  };
  const planWith = (d: number, choice: DeliveryChoice) => withEvents(scenario, [...feedEvents, ...doseEvents(d, choice), ...removalEvents, ...restockEvents]);
  // The plausible tanks are drawn once, judged on the tank as it is (the plan without the
  // advice: no dose yet on day 0's sample), and every plan runs on those same members.
  const accept = settledTankAccepts(scenario, ctx.limits, 1);
  const ensembleWithout = runConditionedEnsemble(base, ctx.ensemble, ctx.options, accept);
  const ensembleOf = (s: Scenario): EnsembleResult => {
    const forecasts = ensembleWithout.members.map((m) => forecastMember(s, m, ctx.options));
    return { members: ensembleWithout.members, forecasts, failed: [], band: bandOf(forecasts) };
  };

  // Once a day first; with fish staying, gentler deliveries until the dosing period stays under the limits.
  let choice: DeliveryChoice = DELIVERY_CANDIDATES[0];
  let dose = doseFor();
  let withScenario = planWith(dose, choice);
  let ensembleWith = ensembleOf(withScenario);
  const onceADay = ensembleWith;
  const fishStay = massAfter > 0;
  let underLimits = edgeRatioUntil(ensembleWith.forecasts, ctx.limits, restockDay) <= 1;
  if (fishStay && dose > 0 && !underLimits) {
    let from = 1;
    while (from < DELIVERY_CANDIDATES.length) {
      const pick = chooseDelivery({
        onceADay,
        scenarioFor: (c) => planWith(dose, c),
        limits: ctx.limits,
        options: ctx.options,
        untilDay: restockDay,
        horizonDays: horizon,
        boundingSize: ctx.boundingSize,
        from,
      });
      // The day's dose stays the once-a-day one: spreading it moves the capacity at the
      // restock by well under 1 % (the same nitrogen feeds the same nitrifiers).
      choice = pick.choice;
      withScenario = planWith(dose, choice);
      ensembleWith = ensembleOf(withScenario);
      underLimits = edgeRatioUntil(ensembleWith.forecasts, ctx.limits, restockDay) <= 1;
      // The whole ensemble has the last word: a member past the bounding set's may still cross.
      if (underLimits || !pick.underLimits) break;
      from = pick.index + 1;
      while (from < DELIVERY_CANDIDATES.length && !fitsBudget(planWith(dose, DELIVERY_CANDIDATES[from]), horizon)) from++;
    }
  }
  // No delivery keeps the full dose under the limits with fish in the tank: lower the dose to
  // the largest that does (a smaller biofilter at the restock is the lesser harm).
  let fullDose: number | null = null;
  if (fishStay && dose > 0 && !underLimits) {
    const search = { limits: ctx.limits, options: ctx.options, untilDay: restockDay };
    const bounding = boundingMembers(onceADay, ctx.limits, restockDay, ctx.boundingSize);
    fullDose = dose;
    let lowered = largestDoseUnder(dose, (d) => planWith(d, choice), bounding, search, { forecasts: 0 });
    for (let tries = 0; ; tries++) {
      withScenario = planWith(lowered, choice);
      ensembleWith = ensembleOf(withScenario);
      underLimits = edgeRatioUntil(ensembleWith.forecasts, ctx.limits, restockDay) <= 1;
      if (underLimits || lowered === 0 || tries === 2) break;
      lowered *= 0.8; // a member beyond the bounding set crosses: step down
    }
    dose = lowered;
  }
  const events = [...removalEvents, ...feedEvents, ...doseEvents(dose, choice), ...restockEvents];
  const withAdvice = planOutcome(ensembleWith.forecasts, ctx.limits, forecastParsed(withScenario, ctx.options));
  const withoutAdvice = planOutcome(ensembleWithout.forecasts, ctx.limits, forecastParsed(base, ctx.options));

  const V = scenario.tank.volumeL;
  const doseAmounts: DoseAmounts = {
    mgNPerLPerDay: dose,
    ammoniumChlorideGPerDay: dose > 0 ? ammoniumChlorideForDose(dose, V) : 0,
    ammoniaSolutionMlPerDay: request.solution && dose > 0 ? ammoniaSolutionForDose(dose, request.solution, V) : request.solution ? 0 : null,
    solution: request.solution ?? null,
  };
  const parts = partsPerDay(choice);
  const onceVerdict = verdictOfEdge(onceADay.forecasts, ctx.limits, restockDay);
  const delivery: DoseDelivery = {
    method: choice.method,
    timesPerDay: parts,
    perDose:
      parts === null || dose === 0
        ? null
        : {
            mgNPerL: dose / parts,
            ammoniumChlorideG: doseAmounts.ammoniumChlorideGPerDay / parts,
            ammoniaSolutionMl: doseAmounts.ammoniaSolutionMlPerDay === null ? null : doseAmounts.ammoniaSolutionMlPerDay / parts,
          },
    underLimitsWhileDosing: underLimits,
    reducedFrom: fullDose,
    reason: deliveryReason({ choice, dose, fullDose, fishStay, underLimits, once: onceVerdict, limits: ctx.limits }),
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
      `Dose ${formatValue(dose)} mg N/L every day from day ${removalDay} to day ${restockDay - 1}: ${formatValue(doseAmounts.ammoniumChlorideGPerDay)} g of ammonium chloride${sol} a day in your ${formatValue(V)} L. This replaces ${fullDose === null ? '' : 'part of '}the ammonia the departed fish supplied.`,
    );
    explanation.push(delivery.reason);
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
    `Ammonia the filter bacteria can clear on the restock day (at the model's usual values): about ${formatValue(capacityAt(forecastParsed(withPlan(dose, choice), capOpts), restockDay))} mg N a day with this advice, ${formatValue(capacityAt(forecastParsed(base, capOpts), restockDay))} mg N a day without it.`,
  );
  explanation.push(describeOutcome(withAdvice, ctx.limits, 'With the advice'));
  explanation.push(describeOutcome(withoutAdvice, ctx.limits, 'Without it'));
  explanation.push(bandExplanation(ensembleWith.forecasts.length));
  return {
    targetCapacityMgNPerDay: target,
    capacityAtRestock: {
      withAdvice: capacityAt(forecastParsed(withPlan(dose, choice), capOpts), restockDay),
      withoutAdvice: capacityAt(forecastParsed(base, capOpts), restockDay),
    },
    dose: doseAmounts,
    delivery,
    feeding: { before: describeFeeding(feedingBefore), after: describeFeeding(feedingAfter), cutShare: feedingBefore.mode === 'grams' ? 1 - keptShare : 0 },
    events,
    withAdvice,
    withoutAdvice,
    limits: ctx.limits,
    explanation,
    cautions: [...ESTIMATE_CAUTIONS, ...(dose > 0 ? DOSING_CAUTIONS : []), ...(dose > 0 && fishStay ? DOSING_WITH_FISH_CAUTIONS : []), ...(removed.length ? REHOMING_CAUTIONS : [])],
  };
}

/** The once-a-day plan's members judged while dosing: the binding limit at the upper edge, and its earliest crossing. */
function verdictOfEdge(forecasts: readonly Forecast[], limits: readonly AppliedLimit[], untilDay: number): { key: AppliedLimit['key']; ratio: number; firstDayOver: number | null } {
  const verdicts = forecasts.map((f) => verdictUntil(f, limits, untilDay));
  const ratio = edgeRatioUntil(forecasts, limits, untilDay);
  // The binding limit of the member at the edge (the one whose ratio is closest above it).
  const edge = verdicts.filter((v) => v.peakRatio >= ratio - 1e-12).sort((a, b) => a.peakRatio - b.peakRatio)[0] ?? verdicts[0];
  const lv = edge.limits.find((l) => l.key === edge.binding);
  return { key: edge.binding, ratio, firstDayOver: lv?.firstDayOver ?? null };
}

interface ReasonInput {
  choice: DeliveryChoice;
  dose: number;
  /** the full dose, when it was lowered */
  fullDose: number | null;
  fishStay: boolean;
  underLimits: boolean;
  once: { key: AppliedLimit['key']; ratio: number; firstDayOver: number | null };
  limits: readonly AppliedLimit[];
}

/** Why the dose goes in this way, in plain words. */
function deliveryReason(r: ReasonInput): string {
  if (r.fullDose !== null) {
    const how = r.choice.method === 'continuous' ? 'even given continuously' : 'even split';
    const instruction =
      r.choice.method === 'continuous'
        ? "Give the day's dose continuously, with a dosing pump or a drip spread evenly over the 24 hours."
        : r.choice.method === 'split'
          ? `Split the day's dose into ${r.choice.timesPerDay} equal doses, ${formatValue(24 / r.choice.timesPerDay)} hours apart.`
          : '';
    const lowered =
      r.dose > 0
        ? `so the advice doses ${formatValue(r.dose)} mg N/L a day instead, the most that keeps the forecast under the limits${r.underLimits ? '' : ' as far as it can be judged (it still crosses: test daily)'}. The biofilter will then be smaller than the restock needs: add the restocked fish in stages.`
        : 'so the advice does not dose: with these fish the forecast crosses a limit even without a dose. Ask the rescue advice which water changes help, and add the restocked fish in stages.';
    return `${instruction ? `${instruction} ` : ''}The full dose of ${formatValue(r.fullDose)} mg N/L a day would lift ammonia or nitrite over a limit while the fish are in the tank, ${how}, ${lowered}`;
  }
  if (r.dose === 0) return 'No dose, so nothing to split.';
  if (!r.fishStay) return 'The tank holds no fish while you dose, so one dose a day is fine: the ammonia it brings is cleared before the restock.';
  const limit = limitByKey(r.limits, r.once.key);
  const onceWords = `given all at once, the forecast's upper edge would cross the ${limit.label} limit (${formatValue(limit.value)} ${limit.unit})${r.once.firstDayOver !== null ? ` from day ${formatValue(r.once.firstDayOver)}` : ''} while the fish are in the tank`;
  const c = r.choice;
  if (c.method === 'once-a-day') return 'One dose a day keeps the forecast under the limits even with the fish still in the tank.';
  if (c.method === 'split') {
    const hours = formatValue(24 / c.timesPerDay);
    const part = `${formatValue(r.dose / c.timesPerDay)} mg N/L`;
    return r.underLimits
      ? `Split the day's dose into ${c.timesPerDay} equal doses, ${hours} hours apart, so no single dose raises total ammonia by more than ${part}: ${onceWords}.`
      : `Split the day's dose into ${c.timesPerDay} equal doses, ${hours} hours apart (${part} each): ${onceWords}, and even split the forecast crosses a limit. Test daily and stop dosing if ammonia or nitrite reads high.`;
  }
  return r.underLimits
    ? `Give the day's dose continuously, with a dosing pump or a drip spread evenly over the 24 hours, so ammonia never jumps: ${onceWords}, and split doses would still lift it too far.`
    : `Give the day's dose continuously, with a dosing pump or a drip spread evenly over the 24 hours — the gentlest way there is: ${onceWords}, and even a steady flow crosses a limit. Test daily and stop dosing if ammonia or nitrite reads high.`;
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
