/** Day-0 water and populations of a scenario: a new tank's inoculum, given capacities, or a mature tank's steady state. */
import type { FeedFlows } from '../bioload';
import { aoIndex, I_KH, I_NO2, I_NO3, I_ORG, I_TAN, noIndex, type Model } from '../model';
import type { Parameters } from '../parameters';
import type { ResolvedZone } from '../presets';
import type { Scenario } from '../scenario';
import { LoadTooHighError, matureSteadyState } from '../steady-state';
import { optionError } from './options';
import { describedStartState } from './starved-start';

/** Writes the day-0 state into y (the model's conditions must be those of day 0). */
export function initialState(scenario: Scenario, model: Model, zones: readonly ResolvedZone[], feedFlows: FeedFlows, kh0: number, y: number[], p: Parameters): void {
  const tank = scenario.tank;
  const V = tank.volumeL;
  const nz = zones.length;
  const w = scenario.initialWater;
  y[I_TAN] = w.tanMgN ?? tank.tapWater.tanMgN;
  y[I_NO2] = w.no2MgN ?? tank.tapWater.no2MgN;
  y[I_NO3] = w.no3MgN ?? tank.tapWater.no3MgN;
  y[I_ORG] = w.orgMgN ?? 0;
  y[I_KH] = kh0;
  const start = scenario.start;
  const act = model.current;
  if (start.kind === 'new') {
    // Inoculum per litre at the tank temperature, shared among zones by area.
    const perL = start.inoculumMgNPerLPerDay ?? p.inoculum;
    const totalArea = zones.reduce((s, z) => s + z.areaM2, 0);
    for (let z = 0; z < nz; z++) {
      const share = zones[z].areaM2 / totalArea;
      y[aoIndex(z)] = (perL * V * share) / act.activityAo;
      y[noIndex(z)] = (perL * V * share) / act.activityNo;
    }
  } else if (start.kind === 'explicit') {
    for (const c of start.capacities) {
      const z = zones.findIndex((zone) => zone.id === c.zoneId);
      y[aoIndex(z)] = c.aoMgNPerDay / act.activityAo;
      y[noIndex(z)] = c.noMgNPerDay / act.activityNo;
    }
  } else if (start.kind === 'starved' || start.kind === 'seeded') {
    describedStartState(scenario, start, zones, kh0, y, p);
  } else {
    const load = start.loadMgNPerDay ?? feedFlows.excretedTan + feedFlows.toOrg;
    let ss;
    try {
      ss = matureSteadyState(model, load, kh0);
    } catch (e) {
      if (e instanceof LoadTooHighError) {
        throw optionError(start.loadMgNPerDay === undefined ? 'fish' : 'start.loadMgNPerDay', e.message);
      }
      throw e;
    }
    y[I_TAN] = w.tanMgN ?? ss.tan + tank.tapWater.tanMgN;
    y[I_NO2] = w.no2MgN ?? ss.no2 + tank.tapWater.no2MgN;
    y[I_ORG] = w.orgMgN ?? ss.org;
    for (let z = 0; z < nz; z++) {
      y[aoIndex(z)] = ss.capAo[z];
      y[noIndex(z)] = ss.capNo[z];
    }
  }
}
