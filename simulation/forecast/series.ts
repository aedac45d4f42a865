/** The forecast's output series: the sample grid, the buffers, and how a state is recorded into them. */
import { aoIndex, I_KH, I_NO2, I_NO3, I_ORG, I_TAN, noIndex, type Model } from '../model';
import { MOLAR_MASS } from '../units';

export interface ZoneSeries {
  zoneId: string;
  /** capacities at the water temperature, mg N/day */
  ao: number[];
  no: number[];
}

export interface ForecastSeries {
  days: number[];
  tanMgN: number[];
  /** free ammonia, mg NH3/L (as the molecule) */
  freeNh3MgL: number[];
  no2MgN: number[];
  no3MgN: number[];
  orgMgN: number[];
  /** °dKH, when pH follows carbonate hardness; else null */
  khDegrees: number[] | null;
  ph: number[];
  temperatureC: number[];
  zones: ZoneSeries[];
  /** TAN supplied by fish and detritus, mg N/day (doses excluded) */
  loadMgNPerDay: number[];
}

/** mg NH3 per mg N: free ammonia is reported as the molecule. */
export const NH3_PER_N = MOLAR_MASS.NH3 / MOLAR_MASS.N;

/**
 * Sample times on the global grid k·step from the start day on (a continued run lines up with
 * a full one), ending at the horizon.
 */
export function sampleTimes(horizon: number, step: number, startDay: number): number[] {
  const nGrid = Math.floor(horizon / step + 1e-9);
  const times: number[] = [];
  for (let j = Math.max(0, Math.ceil(startDay / step - 1e-9)); j <= nGrid; j++) times.push(j * step);
  if (times.length === 0 || horizon - times[times.length - 1] > 1e-9) times.push(horizon);
  return times;
}

export function createSeries(times: readonly number[], zoneIds: readonly string[], carbonate: boolean): ForecastSeries {
  const alloc = () => new Array<number>(times.length).fill(0);
  return {
    days: times.slice(),
    tanMgN: alloc(),
    freeNh3MgL: alloc(),
    no2MgN: alloc(),
    no3MgN: alloc(),
    orgMgN: alloc(),
    khDegrees: carbonate ? alloc() : null,
    ph: alloc(),
    temperatureC: alloc(),
    zones: zoneIds.map((zoneId) => ({ zoneId, ao: alloc(), no: alloc() })),
    loadMgNPerDay: alloc(),
  };
}

/**
 * Writes sample k from state s, under the model's current conditions and the given temperature.
 * The load is the fish's and the food's: a continuous dose (`doseFlow`, mg N/(L·d)) shares the
 * model's TAN source term and is taken back out of it.
 */
export function createRecorder(
  series: ForecastSeries,
  model: Model,
  temperatureC: () => number,
  doseFlow: () => number = () => 0,
): (k: number, s: ArrayLike<number>) => void {
  const act = model.current;
  const nz = series.zones.length;
  const V = model.volumeL;
  return (k, s) => {
    series.tanMgN[k] = s[I_TAN];
    series.no2MgN[k] = s[I_NO2];
    series.no3MgN[k] = s[I_NO3];
    series.orgMgN[k] = s[I_ORG];
    if (series.khDegrees) series.khDegrees[k] = s[I_KH];
    series.ph[k] = model.phOf(s[I_KH]);
    series.freeNh3MgL[k] = s[I_TAN] * model.freeFractionOf(s[I_KH]) * NH3_PER_N;
    series.temperatureC[k] = temperatureC();
    for (let z = 0; z < nz; z++) {
      series.zones[z].ao[k] = s[aoIndex(z)] * act.activityAo;
      series.zones[z].no[k] = s[noIndex(z)] * act.activityNo;
    }
    series.loadMgNPerDay[k] = (act.excretionTan - doseFlow() + act.ammonification * s[I_ORG]) * V;
  };
}
