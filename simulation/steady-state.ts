/**
 * Steady state of a settled tank at a constant load (MODEL.md §3.8): every zone's populations
 * have grown or shrunk until growth, loss, exchange with the other zones and arrival from
 * outside balance, and oxidation matches the supply. Solved per population in turn, each by
 * a bracketed root on the bulk concentration (the oxidation each level sustains rises with it).
 *
 * At a given bulk concentration each zone z has an achievable growth g_z = μ·s_z, a loss b_z
 * (its starvation clock at equilibrium) and a ceiling Cmax_z, and receives
 * w_z·(k_ex·T + I) from the shed cells of all zones (T = Σ C) and from outside:
 *   0 = g_z·C·(1 − C/Cmax) − (b_z + k_ex)·C + w_z·(k_ex·T + I),
 * whose positive root gives C_z(T); T is then the fixed point T = Σ C_z(T), unique because
 * each C_z is concave in T. So every zone with area holds some of each population — the
 * best-placed zone most — instead of one zone holding all.
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
  /** starvation clocks at equilibrium, days */
  clockAo: number[];
  clockNo: number[];
  /** acid adaptation the community has reached (0–1) */
  acid: number;
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

/**
 * Root of fn on [lo, hi] (fn(lo) ≤ 0 < fn(hi)) by the Illinois variant of regula falsi, which
 * keeps the bracket of bisection and converges superlinearly (Dowell & Jarratt 1971): a few
 * tens of evaluations instead of bisection's ~45 per root, which matters because the settled
 * start nests two of them.
 */
function bracketedRoot(fn: (x: number) => number, lo: number, hi: number, relTol: number): number {
  let flo = fn(lo);
  let fhi = fn(hi);
  if (flo > 0) return lo;
  if (!(fhi > 0)) return hi;
  let side = 0;
  for (let i = 0; i < 200 && hi - lo > relTol * hi; i++) {
    let x = (lo * fhi - hi * flo) / (fhi - flo);
    // Inside the bracket (and not NaN), else bisect.
    if (!(x > lo && x < hi)) x = 0.5 * (lo + hi);
    const fx = fn(x);
    if (fx > 0) {
      hi = x;
      fhi = fx;
      if (side === 1) flo *= 0.5;
      side = 1;
    } else {
      lo = x;
      flo = fx;
      if (side === -1) fhi *= 0.5;
      side = -1;
    }
  }
  return 0.5 * (lo + hi);
}

/** Capacity of one zone receiving `arriving` mg N/d per day, at growth g, loss b (MODEL.md §3.8). */
function zoneCapacity(g: number, b: number, kEx: number, ceiling: number, arriving: number): number {
  if (!(ceiling > 0)) return 0;
  const net = g - b - kEx;
  const a = g / ceiling;
  if (a > 0) {
    const c = (net + Math.sqrt(net * net + 4 * a * arriving)) / (2 * a);
    // Above its ceiling a zone does not grow (crowding floored at 0): only arrivals balance loss.
    return c <= ceiling ? c : arriving / (b + kEx);
  }
  return net < 0 ? arriving / -net : 0;
}

/**
 * Capacities of one population over all zones at the given growth rates g[z] and losses b[z],
 * written into out; returns the total.
 */
function populationCapacities(g: number[], b: number[], ceiling: number[], share: number[], kEx: number, immigration: number, out: number[]): number {
  const nz = g.length;
  const sumAt = (total: number, store: boolean) => {
    let sum = 0;
    for (let z = 0; z < nz; z++) {
      const c = zoneCapacity(g[z], b[z], kEx, ceiling[z], share[z] * (kEx * total + immigration));
      if (store) out[z] = c;
      sum += c;
    }
    return sum;
  };
  // F(T) = Σ C_z(T) − T is concave with F(0) ≥ 0: one crossing. Bracket it, then bisect.
  let hi = 0;
  for (let z = 0; z < nz; z++) hi += ceiling[z];
  hi = Math.max(hi, 1e-12);
  while (sumAt(hi, false) > hi && hi < 1e15) hi *= 4;
  const total = sumAt(0, false) <= 0 ? 0 : bracketedRoot((t) => t - sumAt(t, false), 0, hi, 1e-13);
  sumAt(total, true);
  return total;
}

/**
 * What one population oxidises once settled, when its zones' saturation factors are s[z]: each
 * zone's growth and loss, the capacities they settle to (written into out), their sum of
 * oxidation at the water's temperature. g and b are scratch arrays.
 */
function settledOxidation(model: Model, s: number[], growth: number, fedLoss: number, ceiling: number[], activity: number, g: number[], b: number[], out: number[]): number {
  const nz = s.length;
  for (let z = 0; z < nz; z++) {
    g[z] = growth * s[z];
    b[z] = model.settledLoss(g[z], fedLoss);
  }
  populationCapacities(g, b, ceiling, model.settleShare, model.current.exchange, model.current.immigration, out);
  let sum = 0;
  for (let z = 0; z < nz; z++) sum += out[z] * activity * s[z];
  return sum;
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
  const gA = zeros(nz);
  const gN = zeros(nz);
  const bA = zeros(nz);
  const bN = zeros(nz);
  const capAo = zeros(nz);
  const capNo = zeros(nz);
  const scratch = zeros(nz);
  const V = model.volumeL;
  const acid = model.acidTarget(kh);
  const plantTan = (tan: number) => (c.plantUptake > 0 ? (c.plantUptake * tan) / (model.params.kTanPlants + tan) : 0) * V;

  const aoOxidation = (tan: number, store: boolean) => {
    model.saturations(tan, 0, kh, acid, sA, sN);
    return settledOxidation(model, sA, c.growthAo, c.decayAo, model.ceilingAo, c.activityAo, gA, bA, store ? capAo : scratch);
  };
  const load = Math.max(0, loadMgNPerDay);
  let tan = 0;
  if (load > 0) {
    const total = (x: number) => aoOxidation(x, false) + plantTan(x) - load;
    let hi = 1;
    while (total(hi) <= 0 && hi < 1e4) hi *= 4;
    if (total(hi) <= 0) throw new LoadTooHighError(load, aoOxidation(1e6, false));
    tan = bracketedRoot(total, 0, hi, 1e-13);
  }
  const oxidation = aoOxidation(tan, true);

  const noOxidation = (x: number, store: boolean) => {
    model.saturations(tan, x, kh, acid, sA, sN);
    return settledOxidation(model, sN, c.growthNo, c.decayNo, model.ceilingNo, c.activityNo, gN, bN, store ? capNo : scratch);
  };
  let no2 = 0;
  if (oxidation > 0) {
    const gap = (x: number) => noOxidation(x, false) - oxidation;
    let hi = 1;
    while (gap(hi) <= 0 && hi < 1e4) hi *= 4;
    if (gap(hi) <= 0) throw new LoadTooHighError(oxidation, noOxidation(1e6, false));
    no2 = bracketedRoot(gap, 0, hi, 1e-13);
  }
  noOxidation(no2, true);

  // Clocks and the loss nitrogen at the settled water.
  model.saturations(tan, no2, kh, acid, sA, sN);
  const clockAo = zeros(nz);
  const clockNo = zeros(nz);
  const bn = model.biomassNPerCapacity;
  let decayN = 0;
  for (let z = 0; z < nz; z++) {
    const ga = c.growthAo * sA[z];
    const gn = c.growthNo * sN[z];
    clockAo[z] = model.settledClock(ga, c.decayAo);
    clockNo[z] = model.settledClock(gn, c.decayNo);
    decayN += bn.ao * model.settledLoss(ga, c.decayAo) * capAo[z] + bn.no * model.settledLoss(gn, c.decayNo) * capNo[z];
  }
  // Arrivals from outside are built from TAN, so ORG gets the losses minus nothing extra.
  const org = c.ammonification > 0 ? (c.orgInput + decayN / V) / c.ammonification : 0;
  return { tan, no2, org, capAo, capNo, clockAo, clockNo, acid, oxidation };
}
