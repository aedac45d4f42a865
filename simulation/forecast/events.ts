/**
 * What each event kind does to a running forecast, in one place: the water, the nitrifiers,
 * the conditions of the following segments and the nitrogen ledger. The switch ends in a
 * never-check, so a new event kind in the scenario schema fails to compile until it is handled
 * here. Fish events change the fish mass, which the timeline has already summed per breakpoint.
 */
import { aoIndex, I_KH, I_NO2, I_NO3, I_ORG, I_TAN, noIndex, type Model } from '../model';
import type { Parameters } from '../parameters';
import type { ResolvedZone } from '../presets';
import type { ScenarioEvent, Tank } from '../scenario';
import { doseMgNPerL, type Breakpoint } from '../timeline';
import type { NitrogenLedger } from './balance';
import { feedFlowsOf, segmentConditions, type RunConditions, type TankChemistry } from './conditions';

/** What events act on: the run's state vector, conditions and ledger, and the fixed tank. */
export interface EventScope {
  readonly tank: Tank;
  readonly chemistry: TankChemistry;
  readonly zones: readonly ResolvedZone[];
  readonly model: Model;
  readonly params: Parameters;
  readonly feedingMultiplier: number;
  readonly y: number[];
  readonly conditions: RunConditions;
  readonly ledger: NitrogenLedger;
}

function unhandled(value: never): never {
  throw new Error(`The forecast has no rule for ${JSON.stringify(value)}.`);
}

/** Applies one event at `time`; `index` is its position in scenario.events (−1 for a routine water change). */
export function applyEvent(scope: EventScope, event: ScenarioEvent, index: number, time: number): void {
  const { tank, y, conditions, ledger } = scope;
  const V = tank.volumeL;
  switch (event.type) {
    case 'water-change': {
      const f = event.percent / 100;
      const tap = tank.tapWater;
      ledger.balance.waterChangeRemovedMg += f * V * (y[I_TAN] + y[I_NO2] + y[I_NO3] + y[I_ORG]);
      ledger.balance.tapWaterMg += f * V * (tap.tanMgN + tap.no2MgN + tap.no3MgN);
      y[I_TAN] = (1 - f) * y[I_TAN] + f * tap.tanMgN;
      y[I_NO2] = (1 - f) * y[I_NO2] + f * tap.no2MgN;
      y[I_NO3] = (1 - f) * y[I_NO3] + f * tap.no3MgN;
      y[I_ORG] = (1 - f) * y[I_ORG];
      if (scope.chemistry.phModel === 'carbonate') y[I_KH] = (1 - f) * y[I_KH] + f * scope.chemistry.tapKh;
      return;
    }
    case 'ammonia-dose': {
      const c = doseMgNPerL(event.amount, V);
      // A continuous dose flows at c a day until its 'end-dose-flow' (the ledger counts it per segment).
      if (event.delivery === 'continuous') {
        conditions.doseFlows.set(index, c);
        return;
      }
      // One pulse: the whole dose, or its 1/n share when split (timeline.ts places the n parts).
      const part = c / (event.timesPerDay ?? 1);
      y[I_TAN] += part;
      ledger.balance.dosedMg += part * V;
      ledger.doses.push({ from: time, to: time, mg: part * V });
      return;
    }
    case 'filter-clean': {
      const z = scope.zones.findIndex((zone) => zone.id === event.zoneId);
      const bn = scope.model.biomassNPerCapacity;
      const lostAo = y[aoIndex(z)] * event.shareLost;
      const lostNo = y[noIndex(z)] * event.shareLost;
      ledger.balance.mediaCleaningMg += bn.ao * lostAo + bn.no * lostNo;
      y[aoIndex(z)] -= lostAo;
      y[noIndex(z)] -= lostNo;
      return;
    }
    case 'medication':
      conditions.medications.set(index, event.oxidationMultiplier);
      return;
    case 'aeration-loss':
      conditions.aerationLosses.set(index, event.oxygenShare);
      return;
    case 'temperature':
      conditions.temperatureC = event.temperatureC;
      return;
    case 'feeding':
      conditions.feeding = event.feeding;
      return;
    case 'add-fish':
    case 'remove-fish':
    case 'move-fish':
      return; // the fish mass comes from the timeline (Breakpoint.fishMassG)
    default:
      return unhandled(event);
  }
}

/** Applies a breakpoint's actions in order, then sets the model's conditions for the next segment. */
export function applyBreakpoint(scope: EventScope, bp: Breakpoint): void {
  const { conditions } = scope;
  for (const action of bp.actions) {
    switch (action.kind) {
      case 'end-medication':
        conditions.medications.delete(action.index);
        break;
      case 'end-aeration-loss':
        conditions.aerationLosses.delete(action.index);
        break;
      case 'end-dose-flow':
        conditions.doseFlows.delete(action.index);
        break;
      case 'event':
      case 'routine':
        applyEvent(scope, action.event, action.index, bp.time);
        break;
      default:
        return unhandled(action);
    }
  }
  conditions.fishMassG = bp.fishMassG;
  conditions.feedFlows = feedFlowsOf(conditions, scope.params, scope.feedingMultiplier);
  scope.model.setConditions(segmentConditions(scope.tank, scope.chemistry, conditions, scope.params));
}
