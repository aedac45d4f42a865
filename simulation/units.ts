/**
 * Unit conversions used across Shoalshift. Molar masses are IUPAC standard atomic weights
 * (N 14.007, H 1.008, O 15.999, Cl 35.45); derived values are given to the precision the
 * model description (MODEL.md §4.6) lists.
 */

/** Molar masses in g/mol (IUPAC). */
export const MOLAR_MASS = {
  N: 14.007,
  NH3: 17.031,
  NH4: 18.039,
  NO2: 46.005,
  NO3: 62.004,
  NH4Cl: 53.489,
  Cl: 35.453,
} as const;

/** Nitrogen species a test kit may report. */
export type NitrogenSpecies = 'NH3' | 'NH4' | 'NO2' | 'NO3';

/** Mass of N per mass of the ion (e.g. NO3− → 0.2259). */
export function asNFactor(species: NitrogenSpecies): number {
  return MOLAR_MASS.N / MOLAR_MASS[species];
}

/** Converts a concentration reported as the ion (mg ion/L) to mg N/L. */
export function ionToN(mgIonPerL: number, species: NitrogenSpecies): number {
  return mgIonPerL * asNFactor(species);
}

/** Converts mg N/L to mg of the ion per litre. */
export function nToIon(mgNPerL: number, species: NitrogenSpecies): number {
  return mgNPerL / asNFactor(species);
}

/** One US liquid gallon is exactly 231 in³ = 3.785411784 L (NIST Handbook 44). */
export const LITRES_PER_US_GALLON = 3.785411784;

export function usGallonsToLitres(gal: number): number {
  return gal * LITRES_PER_US_GALLON;
}

export function litresToUsGallons(litres: number): number {
  return litres / LITRES_PER_US_GALLON;
}

export function celsiusToFahrenheit(c: number): number {
  return (c * 9) / 5 + 32;
}

export function fahrenheitToCelsius(f: number): number {
  return ((f - 32) * 5) / 9;
}

/**
 * 1 °dKH is 10 mg CaO/L; as CaCO3 that is 10 × 100.087/56.077 = 17.848 mg/L.
 */
export const MG_CACO3_PER_DKH = 17.848;

export function dkhToMgCaCO3(dkh: number): number {
  return dkh * MG_CACO3_PER_DKH;
}

export function mgCaCO3ToDkh(mgPerL: number): number {
  return mgPerL / MG_CACO3_PER_DKH;
}

/** Kelvin from degrees Celsius. */
export function kelvin(c: number): number {
  return c + 273.15;
}
