/**
 * Steady state of a mature tank at a constant load: every zone's population has grown until
 * growth equals decay, and oxidation matches the supply. Solved by bisection (the oxidation
 * each TAN level sustains rises monotonically with TAN), per population in turn.
 *
 * Per zone, growth = decay gives μ·s(S)·(1 − C/Cmax) = b, so C(S) = Cmax·(1 − b/(μ·s(S)))
 * where that is positive, else 0 (the zone cannot hold a population at that S).
 */
import { zeros } from './arrays';
import { formatFigure } from './format-number';
import type { Model } from './model';

export interface SteadyState {
  tan: number;
  no2: number;
  org: number;
  /** reference capacities, mg N/d at 20 °C */
  capAo: number[];
  capNo: number[];
  /** TAN oxidised per day, mg N/d */
  oxidation: number;
}

/** No steady state: the load exceeds what the zones can ever carry. */
export class LoadTooHighError extends Error {
  constructor(readonly loadMgNPerDay: number, readonly maxMgNPerDay: number) {
    super(
      `The fish and their food would put about ${formatFigure(loadMgNPerDay)} mg N of ammonia a day into the water, more than the filter bacteria this tank has room for can ever clear (about ${formatFigure(maxMgNPerDay)} mg N a day). Fewer fish, less food or more filter would help.`,
    );
    this.name = 'LoadTooHighError';
  }
}

function bisect(fn: (x: number) => number, hi: number): number {
  let lo = 0;
  for (let i = 0; i < 200 && hi - lo > 1e-13 * hi; i++) {
    const mid = 0.5 * (lo + hi);
    if (fn(mid) > 0) hi = mid;
    else lo = mid;
  }
  return 0.5 * (lo + hi);
}

/**
 * @param loadMgNPerDay TAN the populations must oxidise (plus what plants take), mg N/d.
 * @param kh carbonate hardness at which pH is evaluated (carbonate mode).
 */
export function matureSteadyState(model: Model, loadMgNPerDay: number, kh: number): SteadyState {
  const nz = model.zones.length;
  const c = model.current;
  const sA = zeros(nz);
  const sN = zeros(nz);
  const capAo = zeros(nz);
  const capNo = zeros(nz);
  const V = model.volumeL;
  const plantTan = (tan: number) => (c.plantUptake > 0 ? (c.plantUptake * tan) / (model.params.kTanPlants + tan) : 0) * V;

  const aoOxidation = (tan: number, store: boolean) => {
    model.saturations(tan, 0, kh, sA, sN);
    let sum = 0;
    for (let z = 0; z < nz; z++) {
      const s = sA[z];
      const cap = s > 0 && c.growthAo * s > c.decayAo ? model.ceilingAo[z] * (1 - c.decayAo / (c.growthAo * s)) : 0;
      if (store) capAo[z] = cap;
      sum += cap * c.activityAo * s;
    }
    return sum;
  };
  const load = Math.max(0, loadMgNPerDay);
  let tan = 0;
  if (load > 0) {
    const total = (x: number) => aoOxidation(x, false) + plantTan(x) - load;
    let hi = 1;
    while (total(hi) <= 0 && hi < 1e4) hi *= 4;
    if (total(hi) <= 0) throw new LoadTooHighError(load, aoOxidation(1e6, false));
    tan = bisect(total, hi);
  }
  const oxidation = aoOxidation(tan, true);

  let no2 = 0;
  const noOxidation = (x: number, store: boolean) => {
    model.saturations(tan, x, kh, sA, sN);
    let sum = 0;
    for (let z = 0; z < nz; z++) {
      const s = sN[z];
      const cap = s > 0 && c.growthNo * s > c.decayNo ? model.ceilingNo[z] * (1 - c.decayNo / (c.growthNo * s)) : 0;
      if (store) capNo[z] = cap;
      sum += cap * c.activityNo * s;
    }
    return sum;
  };
  if (oxidation > 0) {
    const gap = (x: number) => noOxidation(x, false) - oxidation;
    let hi = 1;
    while (gap(hi) <= 0 && hi < 1e4) hi *= 4;
    if (gap(hi) <= 0) throw new LoadTooHighError(oxidation, noOxidation(1e6, false));
    no2 = bisect(gap, hi);
  }
  noOxidation(no2, true);

  const bn = model.biomassNPerCapacity;
  let decayN = 0;
  for (let z = 0; z < nz; z++) decayN += bn.ao * c.decayAo * capAo[z] + bn.no * c.decayNo * capNo[z];
  const org = c.ammonification > 0 ? (c.orgInput + decayN / V) / c.ammonification : 0;
  return { tan, no2, org, capAo, capNo, oxidation };
}
