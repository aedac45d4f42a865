/**
 * Right-hand side of the nitrogen-cycle model (MODEL.md §2–§4), written for speed: all
 * per-segment constants are computed once in `setConditions`, and `rhs` writes into one
 * preallocated array.
 *
 * State y (length 7 + 4·zones):
 *   0 TAN, 1 NO2, 2 NO3, 3 ORG (mg N/L), 4 KH (°dKH; constant when pH is fixed),
 *   5 cumulative plant uptake (mg N, bookkeeping for the nitrogen balance),
 *   6 acid adaptation a (0 = unadapted, 1 = adapted to acid water; MODEL.md §3.6),
 *   per zone z at 7 + 4z: C_AO, C_NO (mg N/day at 20 °C, "reference capacity"), then τ_AO,
 *   τ_NO, each population's days without food (its starvation clock, MODEL.md §3.4).
 *
 * Capacity is kept at the 20 °C reference of the kinetic table; the capacity a keeper sees
 * (at the water's temperature) is C·θ^(T−20). Nitrifier biomass is X = Y·C/μmax,20 (g VSS),
 * its N content i_N·(COD/VSS)·X — a fixed multiple of C, so total nitrogen
 * V·(TAN+NO2+NO3+ORG) + Σ N_biomass + plant uptake changes only by the fish sources: a linear
 * invariant that every Runge–Kutta/extrapolation step preserves to round-off. Cells arriving
 * from outside (immigration) are built from the water's TAN, and cells moving between zones
 * (exchange) keep their nitrogen, so neither breaks the invariant.
 *
 * Non-negativity: every loss term vanishes with its own state (saturation factors S/(K+S),
 * losses ∝ C, ammonification ∝ ORG), so the exact solution stays ≥ 0 — except immigration's
 * draw on TAN, ~1e-9 mg N/(L·d), far below the absolute tolerance; numerical values may dip
 * below zero by at most that tolerance and are reported as computed, not clamped.
 * The one deliberate floor: crowding 1 − C/Cmax is taken as 0 above the ceiling (a biofilm
 * over its area ceiling does not grow; it still loses cells).
 */
import { zeros } from './arrays';
import { ammoniaPKa, carbonatePK1, CO2_PER_DKH, oxygenSaturation } from './chemistry';
import type { Parameters } from './parameters';
import type { ResolvedZone } from './presets';
import { MG_CACO3_PER_DKH, MOLAR_MASS } from './units';

export const I_TAN = 0;
export const I_NO2 = 1;
export const I_NO3 = 2;
export const I_ORG = 3;
export const I_KH = 4;
export const I_PLANT = 5;
export const I_ACID = 6;
export const ZONE_BASE = 7;
const PER_ZONE = 4;

export const aoIndex = (z: number) => ZONE_BASE + PER_ZONE * z;
export const noIndex = (z: number) => ZONE_BASE + PER_ZONE * z + 1;
export const aoClockIndex = (z: number) => ZONE_BASE + PER_ZONE * z + 2;
export const noClockIndex = (z: number) => ZONE_BASE + PER_ZONE * z + 3;

/**
 * Days over which a fed population's starvation clock runs back to zero: starved nitrifiers
 * regain full activity within minutes to ~12 h of fresh ammonia (Bollmann et al. 2005;
 * Manser, Gujer & Siegrist 2006, abstracts: SOURCES.md §2, §9).
 */
export const CLOCK_RESET_DAYS = 0.5;
/** Width, in units of the pH factor, over which adaptation to acid water switches on (smooth, not a step). */
const ACID_RAMP = 0.05;
/**
 * pH range over which even an adapted community's floor fades to nothing: full at 5.5 and
 * above (the lowest pH the product accepts), none at 4.5 (judgement: acid-adapted biofilms
 * nitrify down to pH ~4.3 — Tarre & Green 2004 — but no tank filter data exist below 5.5).
 * It also keeps a carbonate tank's KH from being driven below zero: as KH → 0, pH → −∞.
 */
const ACID_FLOOR_FULL_PH = 5.5;
const ACID_FLOOR_NONE_PH = 4.5;

/** The acid floor available at a pH (MODEL.md §3.6). */
export function acidFloorAt(ph: number, floor: number): number {
  if (ph >= ACID_FLOOR_FULL_PH) return floor;
  if (ph <= ACID_FLOOR_NONE_PH) return 0;
  return (floor * (ph - ACID_FLOOR_NONE_PH)) / (ACID_FLOOR_FULL_PH - ACID_FLOOR_NONE_PH);
}

/** What may change at an event: the conditions of one integration segment. */
export interface SegmentConditions {
  temperatureC: number;
  /** pH when fixed; in carbonate mode the pH at day 0 (with khRef and co2MgL). */
  ph: number;
  phModel: 'fixed' | 'carbonate';
  /** Tank CO2, mg/L (carbonate mode): held constant, set by aeration and respiration. */
  co2MgL: number;
  /** Share of saturation the water holds (aeration level × any aeration loss). */
  oxygenShare: number;
  /** Multiplier on nitrifier activity and growth (medication); 1 = none. */
  activityMultiplier: number;
  /** TAN excreted by fish, mg N/(L·d). */
  excretionTan: number;
  /** Faeces, non-TAN excretion and uneaten food to ORG, mg N/(L·d). */
  orgInput: number;
  /** Plant uptake ceiling, mg N/(L·d). */
  plantUptake: number;
  lightHoursPerDay: number;
}

export interface Model {
  readonly n: number;
  readonly zones: readonly ResolvedZone[];
  readonly volumeL: number;
  readonly params: Parameters;
  /** dy/dt; returns the same preallocated array on every call. */
  readonly rhs: (t: number, y: number[]) => number[];
  setConditions(c: SegmentConditions): void;
  /** mg N held in biomass per unit of reference capacity (AO, NO). */
  readonly biomassNPerCapacity: { ao: number; no: number };
  /** Ceilings Cmax (reference capacity, mg N/d) per zone. */
  readonly ceilingAo: number[];
  readonly ceilingNo: number[];
  /** Each zone's share of the colonisable area: where arriving and shed cells settle. */
  readonly settleShare: number[];
  /** Current segment's derived values, read by the output layer. */
  readonly current: {
    activityAo: number;
    activityNo: number;
    growthAo: number;
    growthNo: number;
    /** loss rates while fed (at the water's temperature) */
    decayAo: number;
    decayNo: number;
    /** loss rates while starving, early and late (at the water's temperature) */
    starveEarly: number;
    starveLate: number;
    /** capacity arriving from outside per day, mg N/d at 20 °C, each population (whole tank) */
    immigration: number;
    exchange: number;
    ammonification: number;
    excretionTan: number;
    orgInput: number;
    plantUptake: number;
    freeNh3Fraction: number;
    fixedPh: number;
  };
  /**
   * Substrate-and-condition factors s of each zone (the saturation with its oxygen cap,
   * O2, light, medication, pH with adaptation `acid`, and free-ammonia terms) at the given
   * water, written into outAo / outNo.
   */
  saturations(tan: number, no2: number, kh: number, acid: number, outAo: number[], outNo: number[]): void;
  /** Loss rate of a population whose achievable growth is `growth` (1/d), its clock at equilibrium. */
  settledLoss(growth: number, fedLoss: number): number;
  /** Starvation clock at equilibrium for that growth, days. */
  settledClock(growth: number, fedLoss: number): number;
  /** Adaptation a toward which the community moves at this KH (1 where the water is acid enough to matter). */
  acidTarget(kh: number): number;
  /** pH for a KH value under the current conditions (carbonate mode), else the fixed pH. */
  phOf(kh: number): number;
  /** Free NH3 share for a KH value under the current conditions. */
  freeFractionOf(kh: number): number;
}

/** pH factor of nitrification before adaptation (US EPA 1975, unconfirmed): 1 above the optimum, then falls linearly to 0. */
export function phFactor(ph: number, p: Parameters): number {
  if (ph >= p.phLowOptimum) return 1;
  const f = 1 - p.phSlope * (p.phLowOptimum - ph);
  return f > 0 ? f : 0;
}

/** Adaptation target for an unadapted pH factor f: 0 while f ≥ the acid floor, ramping to 1 just below it. */
function acidTargetOf(f: number, floor: number): number {
  const x = (floor - f) / ACID_RAMP;
  return x <= 0 ? 0 : x >= 1 ? 1 : x;
}

/** pH factor with adaptation a: the unadapted factor, raised toward the acid floor as the community adapts. */
function adaptedPhFactor(f: number, a: number, floor: number): number {
  return f < floor ? f + a * (floor - f) : f;
}

/**
 * Share of a population that counts as fed, from the growth its food allows against its fed
 * loss, q = growth/fedLoss: q²/(q² + q½²) (MODEL.md §3.4). Written without the division so a
 * zero loss (a test's choice) gives "fed", not NaN.
 */
function fedShareOf(growth: number, fedLoss: number, qHalf: number): number {
  const g2 = growth * growth;
  const h = qHalf * fedLoss;
  const den = g2 + h * h;
  return den > 0 ? g2 / den : 1;
}

/**
 * Late-loss weight after τ days of starvation: a smooth but steep switch at `switchDays`
 * (τ⁸/(τ⁸ + s⁸)), because the measured loss is small for ten days and large after twenty.
 */
function lateWeight(tau: number, switchDays: number): number {
  const t2 = tau * tau;
  const t4 = t2 * t2;
  const s2 = switchDays * switchDays;
  const s4 = s2 * s2;
  return (t4 * t4) / (t4 * t4 + s4 * s4);
}

export function createModel(zones: readonly ResolvedZone[], volumeL: number, p: Parameters): Model {
  if (!(p.muMaxAo > 0 && p.muMaxNo > 0)) throw new RangeError('muMaxAo and muMaxNo must be above 0');
  if (!(p.fedGrowthShare > 0)) throw new RangeError('fedGrowthShare must be above 0');
  const nz = zones.length;
  const n = ZONE_BASE + PER_ZONE * nz;
  const dy: number[] = new Array(n).fill(0);
  const invV = 1 / volumeL;

  // Biomass N per unit reference capacity: i_N · COD/VSS · Y / μmax,20.
  const bnAo = (p.nPerCod * p.codPerVss * p.yieldAo) / p.muMaxAo;
  const bnNo = (p.nPerCod * p.codPerVss * p.yieldNo) / p.muMaxNo;

  // Ceiling: areal rate (given at 24 °C, Nijhof & Bovendeur 1990) × area, moved to 20 °C.
  const ceilingAo = zeros(nz);
  const ceilingNo = zeros(nz);
  const invCeilAo = zeros(nz);
  const invCeilNo = zeros(nz);
  const totalArea = zones.reduce((sum, zone) => sum + zone.areaM2, 0);
  const settleShare = zeros(nz);
  for (let z = 0; z < nz; z++) {
    ceilingAo[z] = (p.arealCapacity * zones[z].areaM2) / Math.pow(p.thetaAo, 4);
    ceilingNo[z] = (p.arealCapacity * zones[z].areaM2) / Math.pow(p.thetaNo, 4);
    invCeilAo[z] = ceilingAo[z] > 0 ? 1 / ceilingAo[z] : Infinity;
    invCeilNo[z] = ceilingNo[z] > 0 ? 1 / ceilingNo[z] : Infinity;
    settleShare[z] = totalArea > 0 ? zones[z].areaM2 / totalArea : 0;
  }
  // Apparent half-saturation: weak flow thickens the diffusion layer (K / flow).
  const kAo = zeros(nz);
  const kNo = zeros(nz);
  for (let z = 0; z < nz; z++) {
    kAo[z] = p.kTanAo / zones[z].flow;
    kNo[z] = p.kNo2No / zones[z].flow;
  }
  // Per-segment constants.
  const gAo = zeros(nz); // O2 × light × medication factors
  const gNo = zeros(nz);
  const capTan = zeros(nz); // TAN above which oxygen transport limits the zone (DO / ν)
  const capNo2 = zeros(nz);
  let actAo = 1;
  let actNo = 1;
  let muAo = 0;
  let muNo = 0;
  let bAo = 0;
  let bNo = 0;
  let bs1 = 0;
  let bs2 = 0;
  let imm = 0;
  const kEx = p.exchange;
  const qHalf = p.fedGrowthShare;
  const switchDays = p.starveSwitchDays;
  const invReset = 1 / CLOCK_RESET_DAYS;
  const acidFloor = p.acidFloor;
  const invAdapt = p.acidAdaptDays > 0 ? 1 / p.acidAdaptDays : 0;
  let kAm = 0;
  let excretion = 0;
  let orgIn = 0;
  let plantU = 0;
  let carbonate = false;
  let fixedFph = 1;
  let fixedFnh3 = 0;
  let fixedPh = 7;
  let fixedTarget = 0;
  let fixedFloor = 0;
  let nh3Coef = 0; // carbonate mode: f_NH3 = KH/(KH + nh3Coef)
  let phBase = 0; // carbonate mode: pH = phBase + log10(KH)
  let kh72 = 0; // KH at which pH reaches the pH-factor optimum
  let khPerN = 0;
  const toNH3 = MOLAR_MASS.NH3 / MOLAR_MASS.N;
  const ki = p.kiFreeAmmoniaNo;
  const kPT = p.kTanPlants;
  const kPN = p.kNo3Plants;
  const phLow = p.phLowOptimum;
  const phSlope = p.phSlope;

  const current = {
    activityAo: 1,
    activityNo: 1,
    growthAo: 0,
    growthNo: 0,
    decayAo: 0,
    decayNo: 0,
    starveEarly: 0,
    starveLate: 0,
    immigration: 0,
    exchange: kEx,
    ammonification: 0,
    excretionTan: 0,
    orgInput: 0,
    plantUptake: 0,
    freeNh3Fraction: 0,
    fixedPh: 7,
  };

  function setConditions(c: SegmentConditions): void {
    const dT = c.temperatureC - 20;
    actAo = Math.pow(p.thetaAo, dT);
    actNo = Math.pow(p.thetaNo, dT);
    muAo = p.muMaxAo * actAo;
    muNo = p.muMaxNo * actNo;
    const decayFactor = Math.pow(p.thetaDecay, dT);
    bAo = p.decayAo * decayFactor;
    bNo = p.decayNo * decayFactor;
    bs1 = p.starveLossEarly * decayFactor;
    bs2 = p.starveLossLate * decayFactor;
    imm = p.immigration * volumeL;
    kAm = p.ammonification * Math.pow(p.thetaAmmonification, dT);
    excretion = c.excretionTan;
    orgIn = c.orgInput;
    plantU = c.plantUptake;
    const o2Sat = oxygenSaturation(c.temperatureC) * c.oxygenShare;
    const lit = c.lightHoursPerDay / 24;
    for (let z = 0; z < nz; z++) {
      const o2 = o2Sat * zones[z].oxygen;
      const lightZ = zones[z].light * lit;
      gAo[z] = (o2 / (p.kO2Ao + o2)) * (1 - p.lightInhibitionAo * lightZ) * c.activityMultiplier;
      gNo[z] = (o2 / (p.kO2No + o2)) * (1 - p.lightInhibitionNo * lightZ) * c.activityMultiplier;
      capTan[z] = o2 / p.oxygenPerTan;
      capNo2[z] = o2 / p.oxygenPerNitrite;
    }
    const pKa = ammoniaPKa(c.temperatureC);
    carbonate = c.phModel === 'carbonate';
    if (carbonate) {
      const pK1 = carbonatePK1(c.temperatureC);
      // pH = pK1 + log10(15.66·KH/CO2) (MODEL.md §4) ⇒ 10^(pKa − pH) = 10^(pKa − pK1)·CO2/(15.66·KH).
      nh3Coef = (Math.pow(10, pKa - pK1) * c.co2MgL) / CO2_PER_DKH;
      phBase = pK1 + Math.log10(CO2_PER_DKH / c.co2MgL);
      kh72 = Math.pow(10, phLow - phBase);
      khPerN = p.alkalinityPerN / MG_CACO3_PER_DKH;
    } else {
      fixedPh = c.ph;
      fixedFph = phFactor(c.ph, p);
      fixedFloor = acidFloorAt(c.ph, acidFloor);
      fixedTarget = acidTargetOf(fixedFph, fixedFloor);
      fixedFnh3 = 1 / (1 + Math.pow(10, pKa - c.ph));
      khPerN = 0;
    }
    current.activityAo = actAo;
    current.activityNo = actNo;
    current.ammonification = kAm;
    current.growthAo = muAo;
    current.growthNo = muNo;
    current.decayAo = bAo;
    current.decayNo = bNo;
    current.starveEarly = bs1;
    current.starveLate = bs2;
    current.immigration = imm;
    current.excretionTan = excretion;
    current.orgInput = orgIn;
    current.plantUptake = plantU;
    current.freeNh3Fraction = fixedFnh3;
    current.fixedPh = fixedPh;
  }

  /** Unadapted pH factor at a KH (carbonate mode). */
  function carbonateFph(kh: number): number {
    if (!(kh > 0)) return 0; // pH → −∞ as KH → 0: the limit, not a clamp
    if (kh >= kh72) return 1;
    const f = 1 - phSlope * (phLow - (phBase + Math.log10(kh)));
    return f > 0 ? f : 0;
  }
  /** Acid floor at a KH (carbonate mode); only needed where the unadapted factor is below it. */
  function carbonateFloor(kh: number): number {
    return kh > 0 ? acidFloorAt(phBase + Math.log10(kh), acidFloor) : 0;
  }

  function rhs(_t: number, y: number[]): number[] {
    const tan = y[0];
    const no2 = y[1];
    const no3 = y[2];
    const org = y[3];
    const acid = y[I_ACID];
    let fph0: number;
    let fnh3: number;
    let target: number;
    let floor: number;
    if (carbonate) {
      const kh = y[4];
      fnh3 = kh > 0 ? kh / (kh + nh3Coef) : 0;
      fph0 = carbonateFph(kh);
      floor = fph0 < acidFloor ? carbonateFloor(kh) : acidFloor;
      target = acidTargetOf(fph0, floor);
    } else {
      fph0 = fixedFph;
      fnh3 = fixedFnh3;
      target = fixedTarget;
      floor = fixedFloor;
    }
    const fph = adaptedPhFactor(fph0, acid, floor);
    const fa = tan * fnh3 * toNH3; // mg NH3/L
    const inhib = ki / (ki + fa);
    // Totals for exchange: shed cells settle on every zone by area.
    let totalA = 0;
    let totalN = 0;
    for (let z = 0, i = ZONE_BASE; z < nz; z++, i += PER_ZONE) {
      totalA += y[i];
      totalN += y[i + 1];
    }
    let sumAo = 0;
    let sumNo = 0;
    let assim = 0;
    let decayN = 0;
    for (let z = 0, i = ZONE_BASE; z < nz; z++, i += PER_ZONE) {
      const cA = y[i];
      const cN = y[i + 1];
      const tA = y[i + 2];
      const tN = y[i + 3];
      let crowdA = 1 - cA * invCeilAo[z];
      if (crowdA < 0) crowdA = 0;
      let crowdN = 1 - cN * invCeilNo[z];
      if (crowdN < 0) crowdN = 0;
      // Oxygen transport caps what a thick film can use: above DO/ν the film sees the cap, not
      // the bulk value, in proportion to how full the zone is (a thin film is fully penetrated).
      const mA = tan > capTan[z] ? tan - (1 - crowdA) * (tan - capTan[z]) : tan;
      const mN = no2 > capNo2[z] ? no2 - (1 - crowdN) * (no2 - capNo2[z]) : no2;
      const sA = (mA / (kAo[z] + mA)) * gAo[z] * fph;
      const sN = (mN / (kNo[z] + mN)) * gNo[z] * fph * inhib;
      const growA = cA * muAo * sA * crowdA;
      const growN = cN * muNo * sN * crowdN;
      // Two losses: the fed loss, and the starving loss (slow at first, faster after weeks).
      const phiA = fedShareOf(muAo * sA, bAo, qHalf);
      const phiN = fedShareOf(muNo * sN, bNo, qHalf);
      const lossA = phiA * bAo + (1 - phiA) * (bs1 + (bs2 - bs1) * lateWeight(tA, switchDays));
      const lossN = phiN * bNo + (1 - phiN) * (bs1 + (bs2 - bs1) * lateWeight(tN, switchDays));
      const decA = cA * lossA;
      const decN = cN * lossN;
      const w = settleShare[z];
      const arriveA = imm * w;
      const arriveN = imm * w;
      dy[i] = growA - decA + kEx * (w * totalA - cA) + arriveA;
      dy[i + 1] = growN - decN + kEx * (w * totalN - cN) + arriveN;
      dy[i + 2] = 1 - phiA - phiA * tA * invReset;
      dy[i + 3] = 1 - phiN - phiN * tN * invReset;
      sumAo += cA * actAo * sA;
      sumNo += cN * actNo * sN;
      assim += bnAo * (growA + arriveA) + bnNo * (growN + arriveN);
      decayN += bnAo * decA + bnNo * decN;
    }
    const amm = kAm * org;
    let upTan = 0;
    let upNo3 = 0;
    if (plantU > 0) {
      // Plants take ammonium first; nitrate with what is left of their uptake ceiling.
      upTan = (plantU * tan) / (kPT + tan);
      upNo3 = ((plantU - upTan) * no3) / (kPN + no3);
    }
    dy[0] = excretion + amm - (sumAo + assim) * invV - upTan;
    dy[1] = (sumAo - sumNo) * invV;
    dy[2] = sumNo * invV - upNo3;
    dy[3] = orgIn - amm + decayN * invV;
    dy[4] = -khPerN * sumAo * invV;
    dy[5] = (upTan + upNo3) * volumeL;
    dy[I_ACID] = (target - acid) * invAdapt;
    return dy;
  }

  function saturations(tan: number, no2: number, kh: number, acid: number, outAo: number[], outNo: number[]): void {
    const fnh3 = carbonate ? (kh > 0 ? kh / (kh + nh3Coef) : 0) : fixedFnh3;
    const fph = adaptedPhFactor(carbonate ? carbonateFph(kh) : fixedFph, acid, carbonate ? carbonateFloor(kh) : fixedFloor);
    const inhib = ki / (ki + tan * fnh3 * toNH3);
    // A settled film is taken as thick (the full oxygen cap): settled water sits far below the cap anyway.
    for (let z = 0; z < nz; z++) {
      const mA = tan < capTan[z] ? tan : capTan[z];
      const mN = no2 < capNo2[z] ? no2 : capNo2[z];
      outAo[z] = (mA / (kAo[z] + mA)) * gAo[z] * fph;
      outNo[z] = (mN / (kNo[z] + mN)) * gNo[z] * fph * inhib;
    }
  }

  function settledClock(growth: number, fedLoss: number): number {
    const phi = fedShareOf(growth, fedLoss, qHalf);
    // dτ/dt = 1 − φ − φτ/reset = 0; a population that never eats has an unbounded clock.
    return phi > 0 ? ((1 - phi) * CLOCK_RESET_DAYS) / phi : Infinity;
  }

  function settledLoss(growth: number, fedLoss: number): number {
    const phi = fedShareOf(growth, fedLoss, qHalf);
    const tau = settledClock(growth, fedLoss);
    const late = Number.isFinite(tau) ? lateWeight(tau, switchDays) : 1;
    return phi * fedLoss + (1 - phi) * (bs1 + (bs2 - bs1) * late);
  }

  return {
    n,
    zones,
    params: p,
    saturations,
    settledLoss,
    settledClock,
    acidTarget: (kh: number) => (carbonate ? acidTargetOf(carbonateFph(kh), carbonateFloor(kh)) : fixedTarget),
    volumeL,
    rhs,
    setConditions,
    biomassNPerCapacity: { ao: bnAo, no: bnNo },
    ceilingAo,
    ceilingNo,
    settleShare,
    current,
    phOf: (kh: number) => (carbonate ? phBase + Math.log10(kh) : fixedPh),
    freeFractionOf: (kh: number) => (carbonate ? (kh > 0 ? kh / (kh + nh3Coef) : 0) : fixedFnh3),
  };
}
