/**
 * Ammonia dosing arithmetic (stoichiometry only; molar masses from ./units).
 * Handling caution for keepers: ammonia solutions and ammonium chloride are irritants —
 * wear gloves and eye protection, use only pure products without surfactants or scent.
 */
import { MOLAR_MASS } from './units';

/**
 * Density of an ammonia solution used when none is given, g/mL. About 0.96 g/mL for a
 * ~10 % w/w solution at 20 °C (CRC Handbook density table; value recalled). Stronger
 * solutions are lighter (≈ 0.90 g/mL at 25–28 %): pass the label's density for those.
 */
export const DEFAULT_AMMONIA_SOLUTION_DENSITY_G_PER_ML = 0.96;

/** Share of N in ammonium chloride by mass: 14.007/53.489 = 0.2619. */
export const NH4CL_N_SHARE = MOLAR_MASS.N / MOLAR_MASS.NH4Cl;

function requirePositive(name: string, value: number): void {
  if (!(Number.isFinite(value) && value > 0)) throw new RangeError(`${name} must be a positive number, got ${value}`);
}

/** Concentration (mg N/L) produced by dissolving `grams` of NH4Cl in `volumeL` litres. */
export function ammoniumChlorideToMgNPerL(grams: number, volumeL: number): number {
  requirePositive('volumeL', volumeL);
  return (grams * 1000 * NH4CL_N_SHARE) / volumeL;
}

/** Grams of NH4Cl that raise `volumeL` litres by `mgNPerL`. */
export function ammoniumChlorideForDose(mgNPerL: number, volumeL: number): number {
  requirePositive('volumeL', volumeL);
  return (mgNPerL * volumeL) / 1000 / NH4CL_N_SHARE;
}

/** Options describing an ammonia solution: strength as % w/w NH3, density in g/mL. */
export interface AmmoniaSolution {
  percentNH3: number;
  densityGPerMl?: number;
}

/** mg N delivered by one mL of the solution. */
export function ammoniaSolutionMgNPerMl(solution: AmmoniaSolution): number {
  requirePositive('percentNH3', solution.percentNH3);
  if (solution.percentNH3 > 35) throw new RangeError('percentNH3 above 35 % w/w is not an aqueous ammonia solution');
  const density = solution.densityGPerMl ?? DEFAULT_AMMONIA_SOLUTION_DENSITY_G_PER_ML;
  requirePositive('densityGPerMl', density);
  const mgNH3 = 1000 * density * (solution.percentNH3 / 100);
  return (mgNH3 * MOLAR_MASS.N) / MOLAR_MASS.NH3;
}

/** Concentration (mg N/L) produced by `ml` of ammonia solution in `volumeL` litres. */
export function ammoniaSolutionToMgNPerL(ml: number, solution: AmmoniaSolution, volumeL: number): number {
  requirePositive('volumeL', volumeL);
  return (ml * ammoniaSolutionMgNPerMl(solution)) / volumeL;
}

/** mL of ammonia solution that raise `volumeL` litres by `mgNPerL`. */
export function ammoniaSolutionForDose(mgNPerL: number, solution: AmmoniaSolution, volumeL: number): number {
  requirePositive('volumeL', volumeL);
  return (mgNPerL * volumeL) / ammoniaSolutionMgNPerMl(solution);
}
