/**
 * Spare capacity of a tank's nitrifiers at day 0 (MODEL.md §3.3): how many times today's
 * ammonia supply the populations, as they are now, could oxidise before the water reaches a
 * test kit's first colour step. It is a number a keeper can use before an addition: beyond
 * it a kit will show ammonia or nitrite until the populations have grown (days).
 */
import { zeros } from '../arrays';
import { I_ACID, I_KH, aoIndex, noIndex, type Model } from '../model';
import { ionToN } from '../units';

/**
 * First colour steps of hobby test kits: 0.25 mg/L read as the ammonium ion and 0.25 mg/L as
 * the nitrite ion (common practice), as N: ≈ 0.19 mg TAN-N/L and ≈ 0.076 mg NO2-N/L.
 */
export const KIT_FIRST_STEP_MG_N = {
  tan: ionToN(0.25, 'NH4'),
  no2: ionToN(0.25, 'NO2'),
} as const;

export interface SpareCapacity {
  /** times today's load the populations could clear before a kit shows a colour */
  times: number;
  /** which reading would show first */
  showsFirst: 'ammonia' | 'nitrite';
}

/**
 * @param load TAN the fish supply per day (excretion + detritus), mg N/d; none → null.
 * Returns null too when the water already reads at or above a kit's first step.
 */
export function spareCapacity(model: Model, y: readonly number[], load: number): SpareCapacity | null {
  if (!(load > 0)) return null;
  if (y[0] >= KIT_FIRST_STEP_MG_N.tan || y[1] >= KIT_FIRST_STEP_MG_N.no2) return null;
  const nz = model.zones.length;
  const sA = zeros(nz);
  const sN = zeros(nz);
  // Both kits at their first step at once: nitrite oxidisers then see the inhibition of that ammonia.
  model.saturations(KIT_FIRST_STEP_MG_N.tan, KIT_FIRST_STEP_MG_N.no2, y[I_KH], y[I_ACID], sA, sN);
  const act = model.current;
  let ao = 0;
  let no = 0;
  for (let z = 0; z < nz; z++) {
    ao += y[aoIndex(z)] * act.activityAo * sA[z];
    no += y[noIndex(z)] * act.activityNo * sN[z];
  }
  const byTan = ao / load;
  const byNo2 = no / load;
  return byTan <= byNo2 ? { times: byTan, showsFirst: 'ammonia' } : { times: byNo2, showsFirst: 'nitrite' };
}

/** "about 3×": whole numbers from 2 up, one decimal below (1.4×). */
function timesWord(x: number): string {
  return x >= 2 ? `${Math.round(x)}×` : `${x.toFixed(1)}×`;
}

/**
 * What a keeper can add at once before a kit shows it, in one sentence; `low`–`high` is the
 * forecast's 10–90 % range when there is one.
 */
export function spareSentence(s: SpareCapacity & { low?: number | null; high?: number | null }): string {
  const reading = s.showsFirst;
  if (s.times < 1.05) return `Today the filter has almost no room to spare: any addition would show as ${reading} on a test kit until it has grown.`;
  const range = s.low != null && s.high != null && timesWord(s.low) !== timesWord(s.high) ? ` (${timesWord(s.low)} to ${timesWord(s.high)} across the forecast's range)` : '';
  return `The filter could take about ${timesWord(s.times)} today's fish at once${range} before ${reading} shows on a test kit; beyond that it needs days to grow.`;
}
