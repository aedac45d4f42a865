/**
 * Water chemistry as pure functions. Each formula cites its source once; the check values
 * in tests/simulation/chemistry.test.ts come from those sources.
 */
import { MOLAR_MASS, kelvin } from './units';

/**
 * pKa of NH4+ ⇌ NH3 + H+ in fresh water (Emerson et al. 1975, J. Fish. Res. Board Can.
 * 32:2379): pKa = 0.09018 + 2729.92 / T(K).
 */
export function ammoniaPKa(temperatureC: number): number {
  return 0.09018 + 2729.92 / kelvin(temperatureC);
}

/** Share of total ammonia present as free NH3 (Emerson et al. 1975): 1/(1 + 10^(pKa − pH)). */
export function freeAmmoniaFraction(temperatureC: number, ph: number): number {
  return 1 / (1 + Math.pow(10, ammoniaPKa(temperatureC) - ph));
}

/** Free ammonia in mg NH3/L (as the molecule) from TAN in mg N/L. */
export function freeAmmoniaMgNH3(tanMgN: number, temperatureC: number, ph: number): number {
  return (tanMgN * freeAmmoniaFraction(temperatureC, ph) * MOLAR_MASS.NH3) / MOLAR_MASS.N;
}

/**
 * US EPA (2013) EPA-822-R-13-001, freshwater chronic criterion (CCC) in mg TAN-N/L:
 * 0.8876·(0.0278/(1+10^(7.688−pH)) + 1.1994/(1+10^(pH−7.688)))·2.126·10^(0.028·(20−max(T,7))).
 */
export function epaChronicTan(ph: number, temperatureC: number): number {
  const phTerm = 0.0278 / (1 + Math.pow(10, 7.688 - ph)) + 1.1994 / (1 + Math.pow(10, ph - 7.688));
  return 0.8876 * phTerm * 2.126 * Math.pow(10, 0.028 * (20 - Math.max(temperatureC, 7)));
}

/**
 * US EPA (2013), freshwater acute criterion (CMC), salmonids absent, in mg TAN-N/L:
 * 0.7249·(0.0114/(1+10^(7.204−pH)) + 1.6181/(1+10^(pH−7.204)))·min(51.93, 23.12·10^(0.036·(20−T))).
 */
export function epaAcuteTan(ph: number, temperatureC: number): number {
  const phTerm = 0.0114 / (1 + Math.pow(10, 7.204 - ph)) + 1.6181 / (1 + Math.pow(10, ph - 7.204));
  return 0.7249 * phTerm * Math.min(51.93, 23.12 * Math.pow(10, 0.036 * (20 - temperatureC)));
}

/** Free-ammonia guideline of the Canadian Council of Ministers of the Environment, mg NH3/L. */
export const CCME_FREE_AMMONIA_MG_NH3 = 0.019;
/** EIFAC (1970) Technical Paper 11 upper guideline, mg NH3/L (value recalled, not re-checked). */
export const EIFAC_FREE_AMMONIA_MG_NH3 = 0.025;

/**
 * Dissolved-oxygen saturation of fresh water at 1 atm, mg/L (Benson & Krause 1984, in the form
 * of APHA Standard Methods 4500-O): ln C = −139.34411 + 1.575701e5/T − 6.642308e7/T²
 * + 1.243800e10/T³ − 8.621949e11/T⁴, T in K.
 */
export function oxygenSaturation(temperatureC: number): number {
  const t = kelvin(temperatureC);
  const t2 = t * t;
  return Math.exp(
    -139.34411 + 1.575701e5 / t - 6.642308e7 / t2 + 1.2438e10 / (t2 * t) - 8.621949e11 / (t2 * t2),
  );
}

/**
 * First dissociation constant of carbonic acid (Plummer & Busenberg 1982, Geochim.
 * Cosmochim. Acta 46:1011): log K1 = −356.3094 − 0.06091964·T + 21834.37/T
 * + 126.8339·log10 T − 1684915/T². Gives 6.38 / 6.35 / 6.34 at 20 / 25 / 28 °C.
 */
export function carbonatePK1(temperatureC: number): number {
  const t = kelvin(temperatureC);
  return -(-356.3094 - 0.06091964 * t + 21834.37 / t + 126.8339 * Math.log10(t) - 1684915 / (t * t));
}

/** mg CO2/L per °dKH at pH = pK1 (bicarbonate of 1 °dKH × CO2 molar mass; MODEL.md §4.3). */
export const CO2_PER_DKH = 15.66;

/** Dissolved CO2 (mg/L) from carbonate hardness and pH: 15.66·KH·10^(pK1 − pH). */
export function carbonateCo2(khDegrees: number, ph: number, temperatureC: number): number {
  return CO2_PER_DKH * khDegrees * Math.pow(10, carbonatePK1(temperatureC) - ph);
}

/** The inverse: pH from KH and CO2, pH = pK1 + log10(15.66·KH/CO2). */
export function phFromCarbonate(khDegrees: number, co2MgL: number, temperatureC: number): number {
  return carbonatePK1(temperatureC) + Math.log10((CO2_PER_DKH * khDegrees) / co2MgL);
}

/** The trade's rule of thumb CO2 ≈ 3·KH·10^(7 − pH) (common practice), for comparison. */
export function carbonateCo2RuleOfThumb(khDegrees: number, ph: number): number {
  return 3 * khDegrees * Math.pow(10, 7 - ph);
}

/** Oxygen used per g N fully nitrified: 3.43 (to nitrite) + 1.14 (to nitrate) g O2 (stoichiometry). */
export const OXYGEN_PER_N_NITRIFIED = { ammoniaOxidation: 3.43, nitriteOxidation: 1.14 } as const;
