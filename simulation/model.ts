/**
 * Right-hand side of the nitrogen-cycle model (model.md §1–§4), written for speed: all
 * per-segment constants are computed once in `setConditions`, and `rhs` writes into one
 * preallocated array.
 *
 * State y (length 6 + 2·zones):
 *   0 TAN, 1 NO2, 2 NO3, 3 ORG (mg N/L), 4 KH (°dKH; constant when pH is fixed),
 *   5 cumulative plant uptake (mg N, bookkeeping for the nitrogen balance),
 *   6 + 2z  C_AO of zone z, 7 + 2z  C_NO of zone z (mg N/day at 20 °C, "reference capacity").
 *
 * Capacity is kept at the 20 °C reference of the kinetic table; the capacity a keeper sees
 * (at the water's temperature) is C·θ^(T−20). Nitrifier biomass is X = Y·C/μmax,20 (g VSS),
 * its N content i_N·(COD/VSS)·X — a fixed multiple of C, so total nitrogen
 * V·(TAN+NO2+NO3+ORG) + Σ N_biomass + plant uptake changes only by the fish sources: a linear
 * invariant that every Runge–Kutta/extrapolation step preserves to round-off.
 *
 * Non-negativity: every loss term vanishes with its own state (Monod factors S/(K+S), decay
 * ∝ C, ammonification ∝ ORG), so the exact solution stays ≥ 0; numerical values may dip
 * below zero by at most the absolute tolerance and are reported as computed, not clamped.
 * The one deliberate floor: crowding 1 − C/Cmax is taken as 0 above the ceiling (a biofilm
 * over its area ceiling does not grow; it still decays).
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
export const ZONE_BASE = 6;

export const aoIndex = (z: number) => ZONE_BASE + 2 * z;
export const noIndex = (z: number) => ZONE_BASE + 2 * z + 1;

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
  /** Current segment's derived values, read by the output layer. */
  readonly current: {
    activityAo: number;
    activityNo: number;
    growthAo: number;
    growthNo: number;
    decayAo: number;
    decayNo: number;
    ammonification: number;
    excretionTan: number;
    orgInput: number;
    plantUptake: number;
    freeNh3Fraction: number;
    fixedPh: number;
  };
  /**
   * Substrate-and-condition factors s of each zone (the Monod, O2, light, medication, pH and
   * free-ammonia terms) at the given water, written into outAo / outNo.
   */
  saturations(tan: number, no2: number, kh: number, outAo: number[], outNo: number[]): void;
  /** pH for a KH value under the current conditions (carbonate mode), else the fixed pH. */
  phOf(kh: number): number;
  /** Free NH3 share for a KH value under the current conditions. */
  freeFractionOf(kh: number): number;
}

/** pH factor of nitrification (US EPA 1975): 1 above the optimum, then falls linearly to 0. */
export function phFactor(ph: number, p: Parameters): number {
  if (ph >= p.phLowOptimum) return 1;
  const f = 1 - p.phSlope * (p.phLowOptimum - ph);
  return f > 0 ? f : 0;
}

export function createModel(zones: readonly ResolvedZone[], volumeL: number, p: Parameters): Model {
  if (!(p.muMaxAo > 0 && p.muMaxNo > 0)) throw new RangeError('muMaxAo and muMaxNo must be above 0');
  const nz = zones.length;
  const n = ZONE_BASE + 2 * nz;
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
  for (let z = 0; z < nz; z++) {
    ceilingAo[z] = (p.arealCapacity * zones[z].areaM2) / Math.pow(p.thetaAo, 4);
    ceilingNo[z] = (p.arealCapacity * zones[z].areaM2) / Math.pow(p.thetaNo, 4);
    invCeilAo[z] = ceilingAo[z] > 0 ? 1 / ceilingAo[z] : Infinity;
    invCeilNo[z] = ceilingNo[z] > 0 ? 1 / ceilingNo[z] : Infinity;
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
  let actAo = 1;
  let actNo = 1;
  let muAo = 0;
  let muNo = 0;
  let bAo = 0;
  let bNo = 0;
  let kAm = 0;
  let excretion = 0;
  let orgIn = 0;
  let plantU = 0;
  let carbonate = false;
  let fixedFph = 1;
  let fixedFnh3 = 0;
  let fixedPh = 7;
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
    }
    const pKa = ammoniaPKa(c.temperatureC);
    carbonate = c.phModel === 'carbonate';
    if (carbonate) {
      const pK1 = carbonatePK1(c.temperatureC);
      // pH = pK1 + log10(15.66·KH/CO2) (model.md §3) ⇒ 10^(pKa − pH) = 10^(pKa − pK1)·CO2/(15.66·KH).
      nh3Coef = (Math.pow(10, pKa - pK1) * c.co2MgL) / CO2_PER_DKH;
      phBase = pK1 + Math.log10(CO2_PER_DKH / c.co2MgL);
      kh72 = Math.pow(10, phLow - phBase);
      khPerN = p.alkalinityPerN / MG_CACO3_PER_DKH;
    } else {
      fixedPh = c.ph;
      fixedFph = phFactor(c.ph, p);
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
    current.excretionTan = excretion;
    current.orgInput = orgIn;
    current.plantUptake = plantU;
    current.freeNh3Fraction = fixedFnh3;
    current.fixedPh = fixedPh;
  }

  function rhs(_t: number, y: number[]): number[] {
    const tan = y[0];
    const no2 = y[1];
    const no3 = y[2];
    const org = y[3];
    let fph: number;
    let fnh3: number;
    if (carbonate) {
      const kh = y[4];
      // Inline (not a helper returning a pair) to keep the hot path allocation-free.
      if (kh > 0) {
        fnh3 = kh / (kh + nh3Coef);
        if (kh >= kh72) fph = 1;
        else {
          const f = 1 - phSlope * (phLow - (phBase + Math.log10(kh)));
          fph = f > 0 ? f : 0;
        }
      } else {
        // pH → −∞ as KH → 0: no free ammonia, no nitrification (the limit, not a clamp).
        fnh3 = 0;
        fph = 0;
      }
    } else {
      fph = fixedFph;
      fnh3 = fixedFnh3;
    }
    const fa = tan * fnh3 * toNH3; // mg NH3/L
    const inhib = ki / (ki + fa);
    let sumAo = 0;
    let sumNo = 0;
    let assim = 0;
    let decayN = 0;
    for (let z = 0, i = ZONE_BASE; z < nz; z++, i += 2) {
      const cA = y[i];
      const cN = y[i + 1];
      const sA = (tan / (kAo[z] + tan)) * gAo[z] * fph;
      const sN = (no2 / (kNo[z] + no2)) * gNo[z] * fph * inhib;
      let crowdA = 1 - cA * invCeilAo[z];
      if (crowdA < 0) crowdA = 0;
      let crowdN = 1 - cN * invCeilNo[z];
      if (crowdN < 0) crowdN = 0;
      const growA = cA * muAo * sA * crowdA;
      const growN = cN * muNo * sN * crowdN;
      const decA = cA * bAo;
      const decN = cN * bNo;
      dy[i] = growA - decA;
      dy[i + 1] = growN - decN;
      sumAo += cA * actAo * sA;
      sumNo += cN * actNo * sN;
      assim += bnAo * growA + bnNo * growN;
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
    return dy;
  }

  function saturations(tan: number, no2: number, kh: number, outAo: number[], outNo: number[]): void {
    const fnh3 = carbonate ? (kh > 0 ? kh / (kh + nh3Coef) : 0) : fixedFnh3;
    const fph = carbonate ? (kh > 0 ? phFactor(phBase + Math.log10(kh), p) : 0) : fixedFph;
    const inhib = ki / (ki + tan * fnh3 * toNH3);
    for (let z = 0; z < nz; z++) {
      outAo[z] = (tan / (kAo[z] + tan)) * gAo[z] * fph;
      outNo[z] = (no2 / (kNo[z] + no2)) * gNo[z] * fph * inhib;
    }
  }

  return {
    n,
    zones,
    params: p,
    saturations,
    volumeL,
    rhs,
    setConditions,
    biomassNPerCapacity: { ao: bnAo, no: bnNo },
    ceilingAo,
    ceilingNo,
    current,
    phOf: (kh: number) => (carbonate ? phBase + Math.log10(kh) : fixedPh),
    freeFractionOf: (kh: number) => (carbonate ? (kh > 0 ? kh / (kh + nh3Coef) : 0) : fixedFnh3),
  };
}
