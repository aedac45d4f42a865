/**
 * Peaks at event instants: a dose lands at once, so the highest water may fall between two
 * samples. The run notes the water at every event instant; the summary takes the higher of
 * these and the sampled peaks.
 */
import { I_KH, I_NO2, I_NO3, I_TAN, type Model } from '../model';
import type { Peak } from '../series-stats';
import { NH3_PER_N } from './series';

export interface EventPeaks {
  tan: Peak;
  freeNh3: Peak;
  no2: Peak;
  no3: Peak;
}

export function noEventPeaks(): EventPeaks {
  return { tan: { value: -Infinity, day: 0 }, freeNh3: { value: -Infinity, day: 0 }, no2: { value: -Infinity, day: 0 }, no3: { value: -Infinity, day: 0 } };
}

export function notePeaks(peaks: EventPeaks, model: Model, y: readonly number[], t: number): void {
  const fa = y[I_TAN] * model.freeFractionOf(y[I_KH]) * NH3_PER_N;
  if (y[I_TAN] > peaks.tan.value) peaks.tan = { value: y[I_TAN], day: t };
  if (fa > peaks.freeNh3.value) peaks.freeNh3 = { value: fa, day: t };
  if (y[I_NO2] > peaks.no2.value) peaks.no2 = { value: y[I_NO2], day: t };
  if (y[I_NO3] > peaks.no3.value) peaks.no3 = { value: y[I_NO3], day: t };
}

/** The higher of a sampled peak and an event-instant peak (the sampled one on a tie). */
export function higherPeak(sampled: Peak, atEvent: Peak): Peak {
  return atEvent.value > sampled.value ? { value: atEvent.value, day: atEvent.day } : sampled;
}
