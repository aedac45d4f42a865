/**
 * A tank's default safety limits, each with its basis and source, for the forecast summary
 * and the advice layer. The EPA criteria protect the most sensitive wild species and are
 * conservative for aquarium fish; they are shown as such.
 */
import {
  CCME_FREE_AMMONIA_MG_NH3,
  EIFAC_FREE_AMMONIA_MG_NH3,
  epaAcuteTan,
  epaChronicTan,
  freeAmmoniaFraction,
} from './chemistry';
import { MOLAR_MASS } from './units';

export interface Limit {
  value: number;
  unit: 'mg NH3/L' | 'mg N/L';
  basis: string;
  source: string;
}

export interface TankLimits {
  /** Free ammonia, as the molecule. */
  freeNh3: Limit;
  /** The same free-ammonia guideline expressed as TAN at the tank's pH and temperature. */
  freeNh3AsTan: Limit;
  tanChronic: Limit;
  tanAcute: Limit;
  nitrite: Limit;
}

/** Default culture-practice nitrite limit, mg NO2-N/L (Boyd, Global Seafood Alliance: keep < 0.1 mg/L). */
export const NITRITE_PRACTICE_LIMIT_MG_N = 0.1;
/** Cl⁻ : NO2⁻ molar ratio that fully suppressed methaemoglobin in channel catfish (Tomasso et al. 1979). */
export const CHLORIDE_NITRITE_MOLAR_RATIO = 16;

/** Nitrite (mg N/L) that a chloride level protects against at a Cl⁻:NO2⁻ molar ratio. */
export function nitriteLimitFromChloride(chlorideMgL: number, molarRatio = CHLORIDE_NITRITE_MOLAR_RATIO): number {
  if (!(chlorideMgL >= 0) || !(molarRatio > 0)) throw new RangeError('chloride must be ≥ 0 and the ratio above 0');
  return (chlorideMgL / MOLAR_MASS.Cl / molarRatio) * MOLAR_MASS.N;
}

export interface LimitConditions {
  ph: number;
  temperatureC: number;
  chlorideMgL?: number;
}

export interface LimitChoices {
  /** 'culture-practice' (default, 0.1 mg N/L) or 'chloride' (needs chlorideMgL). */
  nitriteBasis?: 'culture-practice' | 'chloride';
  /** 'ccme' (default, 0.019 mg NH3/L) or 'eifac' (0.025). */
  freeAmmoniaGuideline?: 'ccme' | 'eifac';
}

/** Free-ammonia guideline converted to TAN (mg N/L) at pH and temperature (Emerson et al. 1975). */
export function freeAmmoniaLimitAsTan(limitMgNH3: number, ph: number, temperatureC: number): number {
  return (limitMgNH3 * MOLAR_MASS.N) / MOLAR_MASS.NH3 / freeAmmoniaFraction(temperatureC, ph);
}

export function defaultLimits(c: LimitConditions, choices: LimitChoices = {}): TankLimits {
  const eifac = choices.freeAmmoniaGuideline === 'eifac';
  const fa = eifac ? EIFAC_FREE_AMMONIA_MG_NH3 : CCME_FREE_AMMONIA_MG_NH3;
  const faSource = eifac ? 'EIFAC (1970) Technical Paper 11 (value recalled)' : 'CCME Canadian Water Quality Guidelines';
  let nitrite: Limit;
  if (choices.nitriteBasis === 'chloride') {
    if (c.chlorideMgL === undefined) throw new RangeError('the chloride-based nitrite limit needs chlorideMgL');
    nitrite = {
      value: nitriteLimitFromChloride(c.chlorideMgL),
      unit: 'mg N/L',
      basis: `nitrite kept at or below 1/${CHLORIDE_NITRITE_MOLAR_RATIO} of chloride (molar) at ${c.chlorideMgL} mg Cl/L`,
      source: 'Tomasso et al. (1979): 16 Cl⁻ : 1 NO2⁻ fully suppressed methaemoglobin; SRAC 462 ≥ 10:1 in ponds',
    };
  } else {
    nitrite = {
      value: NITRITE_PRACTICE_LIMIT_MG_N,
      unit: 'mg N/L',
      basis: 'culture practice: keep nitrite below 0.1 mg/L',
      source: 'Boyd, Global Seafood Alliance (basis "as N" assumed)',
    };
  }
  return {
    freeNh3: { value: fa, unit: 'mg NH3/L', basis: 'free-ammonia guideline', source: faSource },
    freeNh3AsTan: {
      value: freeAmmoniaLimitAsTan(fa, c.ph, c.temperatureC),
      unit: 'mg N/L',
      basis: `free-ammonia guideline as TAN at pH ${c.ph}, ${c.temperatureC} °C`,
      source: `${faSource}; Emerson et al. (1975) free-ammonia fraction`,
    },
    tanChronic: {
      value: epaChronicTan(c.ph, c.temperatureC),
      unit: 'mg N/L',
      basis: `chronic criterion (30-day average) at pH ${c.ph}, ${c.temperatureC} °C; protects sensitive wild species`,
      source: 'US EPA (2013) EPA-822-R-13-001',
    },
    tanAcute: {
      value: epaAcuteTan(c.ph, c.temperatureC),
      unit: 'mg N/L',
      basis: `acute criterion (1-hour average), salmonids absent, at pH ${c.ph}, ${c.temperatureC} °C`,
      source: 'US EPA (2013) EPA-822-R-13-001',
    },
    nitrite,
  };
}
