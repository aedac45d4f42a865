/** Day-0 water and populations of a scenario: a new tank's inoculum, given capacities, or a mature tank's steady state. */
import type { FeedFlows } from '../bioload';
import { acidFloorAt, aoClockIndex, aoIndex, I_ACID, phFactor, I_KH, I_NO2, I_NO3, I_ORG, I_TAN, noClockIndex, noIndex, type Model } from '../model';
import type { Parameters } from '../parameters';
import type { ResolvedZone } from '../presets';
import type { Scenario } from '../scenario';
import { LoadTooHighError, matureSteadyState } from '../steady-state';
import { optionError } from './options';
import { MAX_SETTLED_CLOCK_DAYS } from './settled-clock';
import { describedStartState } from './starved-start';


/**
 * A load the zones cannot carry, named by its cause: the acid water when nitrification at a
 * neutral pH would carry it (the pH factor scales every zone's rate), else the stocking.
 */
function refusalOf(e: LoadTooHighError, loadField: string, ph: number, p: Parameters) {
  const f = Math.max(phFactor(ph, p), acidFloorAt(ph, p.acidFloor));
  if (f < 1 && (f <= 0 || e.loadMgNPerDay <= e.maxMgNPerDay / f)) {
    return optionError('tank.ph', f > 0
        ? `At pH ${ph} nitrifiers work at about ${Math.round(100 * f)} % of their rate at neutral pH: too slowly for this stocking. Raise the pH gradually or keep fewer fish.`
        : `At pH ${ph} nitrifiers stop working: no filter can keep up. Raise the pH gradually (above 5.5) before keeping fish here.`);
  }
  return optionError(loadField, e.message);
}

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
  // Clocks start at 0 (fed or freshly arrived) and the community unadapted, unless settled below.
  for (let z = 0; z < nz; z++) {
    y[aoClockIndex(z)] = 0;
    y[noClockIndex(z)] = 0;
  }
  y[I_ACID] = 0;
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
    // Given capacities describe an established community: adapted to the tank's own water.
    y[I_ACID] = model.acidTarget(kh0);
  } else if (start.kind === 'starved' || start.kind === 'seeded') {
    describedStartState(scenario, start, zones, kh0, y, p);
  } else {
    const load = start.loadMgNPerDay ?? feedFlows.excretedTan + feedFlows.toOrg;
    let ss;
    try {
      ss = matureSteadyState(model, load, kh0);
    } catch (e) {
      if (e instanceof LoadTooHighError) throw refusalOf(e, start.loadMgNPerDay === undefined ? 'fish' : 'start.loadMgNPerDay', tank.ph, p);
      throw e;
    }
    // A settled filter has long cleared what the tap brings: the water is at the steady state.
    y[I_TAN] = w.tanMgN ?? ss.tan;
    y[I_NO2] = w.no2MgN ?? ss.no2;
    y[I_ORG] = w.orgMgN ?? ss.org;
    for (let z = 0; z < nz; z++) {
      y[aoIndex(z)] = ss.capAo[z];
      y[noIndex(z)] = ss.capNo[z];
      y[aoClockIndex(z)] = Math.min(ss.clockAo[z], MAX_SETTLED_CLOCK_DAYS);
      y[noClockIndex(z)] = Math.min(ss.clockNo[z], MAX_SETTLED_CLOCK_DAYS);
    }
    y[I_ACID] = ss.acid;
  }
}
