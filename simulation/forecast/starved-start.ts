/**
 * Day-0 state of a tank described by its history rather than its present: a filter that was
 * mature until `starvedDays` before day 0 and has had no fish since ('starved'), or a new tank
 * whose filter holds media from a mature one ('seeded'). Both begin from the mature steady
 * state at a load (steady-state.ts); a starved filter then runs those days with no fish, so
 * its nitrifiers decay as the model has them decay, before day 0.
 */
import { fishMassG } from '../bioload';
import { aoClockIndex, aoIndex, createModel, I_ACID, I_KH, I_NO2, I_NO3, I_ORG, I_PLANT, I_TAN, noClockIndex, noIndex, type Model } from '../model';
import { MAX_SETTLED_CLOCK_DAYS } from './settled-clock';
import type { Parameters } from '../parameters';
import type { ResolvedZone } from '../presets';
import type { FishGroup, Scenario, Start } from '../scenario';
import { LoadTooHighError, matureSteadyState } from '../steady-state';
import { feedFlowsOf, segmentConditions, tankChemistry } from './conditions';
import { createIntegrator, optionError, resolveOptions } from './options';

export type DescribedStart = Extract<Start, { kind: 'starved' | 'seeded' }>;

/** Mass of the fish, g (a custom animal without a length is refused on its field). */
function massOfFish(fish: readonly FishGroup[], p: Parameters, field: string): number {
  let massG = 0;
  fish.forEach((f, i) => {
    try {
      massG += f.count * fishMassG(f, p.lengthWeightB);
    } catch (e) {
      throw optionError(`${field}.${i}.lengthCm`, (e as Error).message);
    }
  });
  return massG;
}

/** The fish the scenario adds or moves in: the load a seeded filter is meant to carry when the tank starts empty. */
function addedFish(scenario: Scenario): FishGroup[] {
  return scenario.events.flatMap((e) => (e.type === 'add-fish' || (e.type === 'move-fish' && e.direction === 'in') ? e.fish : []));
}

/**
 * The tank's model under day 0's water and temperature with `fishMassG` of fish fed as the
 * scenario feeds: the steady state needs the load's detritus share (its ORG level), the
 * starved days need no fish at all.
 */
function setFish(model: Model, scenario: Scenario, p: Parameters, fishMassG: number): { load: number } {
  const tank = scenario.tank;
  const start = { temperatureC: tank.temperatureC, feeding: scenario.feeding, fishMassG };
  const feedFlows = feedFlowsOf(start, p, 1);
  model.setConditions(segmentConditions(tank, tankChemistry(tank), { ...start, medications: new Map(), aerationLosses: new Map(), doseFlows: new Map(), feedFlows }, p));
  return { load: feedFlows.excretedTan + feedFlows.toOrg };
}

/**
 * The mature steady state at the former fish (or at a load given as a number, taken as
 * excreted ammonia with no detritus share), on a model of its own.
 */
function formerSteadyState(scenario: Scenario, model: Model, p: Parameters, fish: readonly FishGroup[], loadMgNPerDay: number | undefined, kh0: number, field: string) {
  const { load } = setFish(model, scenario, p, loadMgNPerDay === undefined ? massOfFish(fish, p, field) : 0);
  return steadyAt(model, loadMgNPerDay ?? load, kh0, loadMgNPerDay === undefined ? field : 'start.loadMgNPerDay');
}

function steadyAt(model: Model, load: number, kh0: number, field: string) {
  try {
    return matureSteadyState(model, load, kh0);
  } catch (e) {
    if (e instanceof LoadTooHighError) throw optionError(field, e.message);
    throw e;
  }
}

/**
 * Writes the day-0 state of a starved or seeded start into y (populations, and the water the
 * starved days leave unless the scenario's initialWater says otherwise).
 */
export function describedStartState(scenario: Scenario, start: DescribedStart, zones: readonly ResolvedZone[], kh0: number, y: number[], p: Parameters): void {
  const model = createModel(zones, scenario.tank.volumeL, p);
  const w = scenario.initialWater;
  const tap = scenario.tank.tapWater;
  if (start.kind === 'starved') {
    const ss = formerSteadyState(scenario, model, p, start.formerFish ?? [], start.loadMgNPerDay, kh0, 'start.formerFish');
    y[I_TAN] = ss.tan;
    y[I_NO2] = ss.no2;
    y[I_NO3] = tap.no3MgN;
    y[I_ORG] = ss.org;
    y[I_KH] = kh0;
    y[I_PLANT] = 0;
    y[I_ACID] = ss.acid;
    zones.forEach((_, z) => {
      y[aoIndex(z)] = ss.capAo[z];
      y[noIndex(z)] = ss.capNo[z];
      // Clocks as the settled filter had them; the starved days then run them on.
      y[aoClockIndex(z)] = Math.min(ss.clockAo[z], MAX_SETTLED_CLOCK_DAYS);
      y[noClockIndex(z)] = Math.min(ss.clockNo[z], MAX_SETTLED_CLOCK_DAYS);
    });
    if (start.starvedDays > 0) {
      setFish(model, scenario, p, 0);
      const opt = resolveOptions(scenario, { horizonDays: start.starvedDays });
      const run = createIntegrator({}, opt, model).integrate({ f: model.rhs, from: 0, to: start.starvedDays, y, times: [], first: 0, end: 0, sink: () => {} });
      if (!run.outcome.ok) throw optionError('start.starvedDays', `The starved days could not be solved: ${run.outcome.message}`);
      // The solver may undershoot a population decayed to nothing by a rounding error: none is none.
      zones.forEach((_, z) => {
        y[aoIndex(z)] = Math.max(0, y[aoIndex(z)]);
        y[noIndex(z)] = Math.max(0, y[noIndex(z)]);
      });
    }
    // The day-0 water: what the keeper measured, else what the starved days left; KH as the tank says now.
    y[I_TAN] = w.tanMgN ?? y[I_TAN];
    y[I_NO2] = w.no2MgN ?? y[I_NO2];
    y[I_NO3] = w.no3MgN ?? y[I_NO3];
    y[I_ORG] = w.orgMgN ?? y[I_ORG];
    y[I_KH] = kh0;
    y[I_PLANT] = 0;
    return;
  }
  // Seeded: the filter zones hold their share of a mature filter's capacity at the load (the
  // fish at day 0, else those the scenario adds); the other zones start as a new tank's.
  const fish = scenario.fish.length > 0 ? scenario.fish : addedFish(scenario);
  const ss = formerSteadyState(scenario, model, p, fish, start.loadMgNPerDay, kh0, scenario.fish.length > 0 ? 'fish' : 'events');
  const act = model.current;
  const totalArea = zones.reduce((s, z) => s + z.areaM2, 0);
  zones.forEach((zone, z) => {
    const inoculum = p.inoculum * scenario.tank.volumeL * (zone.areaM2 / totalArea);
    const seeded = zone.kind === 'filter';
    y[aoIndex(z)] = Math.max(inoculum / act.activityAo, seeded ? start.share * ss.capAo[z] : 0);
    y[noIndex(z)] = Math.max(inoculum / act.activityNo, seeded ? start.share * ss.capNo[z] : 0);
  });
}
