/** What the forecast shows at a running session's current day: the water and the capacities. */
import { aoIndex, I_NO2, I_NO3, I_ORG, I_TAN, noIndex, type Model } from '../model';

export interface ForecastReading {
  day: number;
  tanMgN: number;
  no2MgN: number;
  no3MgN: number;
  orgMgN: number;
  /** capacities at the water temperature, mg N/day */
  zones: { zoneId: string; aoMgNPerDay: number; noMgNPerDay: number }[];
  aoMgNPerDay: number;
  noMgNPerDay: number;
}

export function readingOf(model: Model, day: number, y: readonly number[]): ForecastReading {
  const act = model.current;
  const zs = model.zones.map((zone, z) => ({ zoneId: zone.id, aoMgNPerDay: y[aoIndex(z)] * act.activityAo, noMgNPerDay: y[noIndex(z)] * act.activityNo }));
  return {
    day,
    tanMgN: y[I_TAN],
    no2MgN: y[I_NO2],
    no3MgN: y[I_NO3],
    orgMgN: y[I_ORG],
    zones: zs,
    aoMgNPerDay: zs.reduce((s, z) => s + z.aoMgNPerDay, 0),
    noMgNPerDay: zs.reduce((s, z) => s + z.noMgNPerDay, 0),
  };
}
