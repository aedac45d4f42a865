/**
 * Day-0 state of a tank described by its history rather than its present: a filter that was
 * mature until `starvedDays` before day 0 and has had no fish since ('starved'), or a new tank
 * whose filter holds media from a mature one ('seeded'). Both begin from the mature steady
 * state at a load (steady-state.ts); a starved filter then runs those days with no fish, so
 * its nitrifiers decay as the model has them decay, before day 0.
 */
import { fishMassG } from '../bioload';
import { aoIndex, createModel, I_KH, I_NO2, I_NO3, I_ORG, I_PLANT, I_TAN, noIndex, type Model } from '../model';
import type { Parameters } from '../parameters';
import type { ResolvedZone } from '../presets';
import type { FishGroup, Scenario, Start } from '../scenario';
import { LoadTooHighError, matureSteadyState } from '../steady-state';
import { feedFlowsOf, segmentConditions, tankChemistry } from './conditions';
import { createIntegrator, optionError, resolveOptions } from './options';

export type DescribedStart = Extract<Start, { kind: 'starved' | 'seeded' }>;

/** TAN-N a day that fish give at the scenario's feeding (the load a mature start uses: excreted + to detritus). */
function loadOfFish(scenario: Scenario, fish: readonly FishGroup[], p: Parameters, field: string): number {
  let massG = 0;
  fish.forEach((f, i) => {
    try {
      massG += f.count * fishMassG(f, p.lengthWeightB);
    } catch (e) {
      throw optionError(`${field}.${i}.lengthCm`, (e as Error).message);
    }
  });
  const flows = feedFlowsOf({ fishMassG: massG, feeding: scenario.feeding }, p, 1);
  return flows.excretedTan + flows.toOrg;
}

/** The fish the scenario adds or moves in: the load a seeded filter is meant to carry when the tank starts empty. */
function addedFish(scenario: Scenario): FishGroup[] {
  return scenario.events.flatMap((e) => (e.type === 'add-fish' || (e.type === 'move-fish' && e.direction === 'in') ? [e.fish] : []));
}

/** A model of the tank with no fish (the starved days): same zones, water and temperature as day 0. */
function fishlessModel(scenario: Scenario, zones: readonly ResolvedZone[], p: Parameters): Model {
  const tank = scenario.tank;
  const model = createModel(zones, tank.volumeL, p);
  const start = { temperatureC: tank.temperatureC, feeding: scenario.feeding, fishMassG: 0 };
  const conditions = { ...start, medications: new Map<number, number>(), aerationLosses: new Map<number, number>(), feedFlows: feedFlowsOf(start, p, 1) };
  model.setConditions(segmentConditions(tank, tankChemistry(tank), conditions, p));
  return model;
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
  const model = fishlessModel(scenario, zones, p);
  const w = scenario.initialWater;
  const tap = scenario.tank.tapWater;
  if (start.kind === 'starved') {
    const load = start.loadMgNPerDay ?? loadOfFish(scenario, start.formerFish ?? [], p, 'start.formerFish');
    const ss = steadyAt(model, load, kh0, start.loadMgNPerDay === undefined ? 'start.formerFish' : 'start.loadMgNPerDay');
    y[I_TAN] = ss.tan + tap.tanMgN;
    y[I_NO2] = ss.no2 + tap.no2MgN;
    y[I_NO3] = tap.no3MgN;
    y[I_ORG] = ss.org;
    y[I_KH] = kh0;
    y[I_PLANT] = 0;
    zones.forEach((_, z) => {
      y[aoIndex(z)] = ss.capAo[z];
      y[noIndex(z)] = ss.capNo[z];
    });
    if (start.starvedDays > 0) {
      const opt = resolveOptions(scenario, { horizonDays: start.starvedDays });
      const run = createIntegrator({}, opt, model).integrate({ f: model.rhs, from: 0, to: start.starvedDays, y, times: [], first: 0, end: 0, sink: () => {} });
      if (!run.outcome.ok) throw optionError('start.starvedDays', `The starved days could not be solved: ${run.outcome.message}`);
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
  // Seeded: the filter zones hold their share of a mature filter's capacity; the rest start as a new tank's.
  const load = start.loadMgNPerDay ?? (scenario.fish.length > 0 ? loadOfFish(scenario, scenario.fish, p, 'fish') : loadOfFish(scenario, addedFish(scenario), p, 'events'));
  const ss = steadyAt(model, load, kh0, start.loadMgNPerDay === undefined ? 'fish' : 'start.loadMgNPerDay');
  const act = model.current;
  const totalArea = zones.reduce((s, z) => s + z.areaM2, 0);
  zones.forEach((zone, z) => {
    const inoculumAo = (p.inoculum * scenario.tank.volumeL * (zone.areaM2 / totalArea)) / act.activityAo;
    const inoculumNo = (p.inoculum * scenario.tank.volumeL * (zone.areaM2 / totalArea)) / act.activityNo;
    const seeded = zone.kind === 'filter';
    y[aoIndex(z)] = Math.max(inoculumAo, seeded ? start.share * ss.capAo[z] : 0);
    y[noIndex(z)] = Math.max(inoculumNo, seeded ? start.share * ss.capNo[z] : 0);
  });
}
