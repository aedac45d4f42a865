/**
 * Error model for colour-chart test kits. A colour chart reports the swatch nearest the
 * water's colour, so a reading is the true value rounded to the chart's step h (0.25–0.5 mg/L
 * on common kits, MODEL.md §5.2). Rounding error spread evenly over one step has standard
 * deviation h/√12 (the variance of a uniform distribution of width h); on top of it comes a
 * share proportional to the value (colour judgement, reagent age, lighting), and the two add
 * in quadrature. A reading of 0 is censored: it says only that the true value lay below half
 * the first step (nearer the "0" swatch than the next one), so it costs nothing while the
 * model stays below that and is penalised only for the excess.
 */

/** A keeper's kit for one species, in mg N/L. */
export interface KitSpec {
  /** Distance between swatches, mg N/L. */
  stepMgN: number;
  /** Share of the value a reading may be off by beyond rounding (0.1 = 10 %). */
  relativeError: number;
}

/** Common practice: liquid colour charts step 0.25 mg/L at the low end; 10 % judgement error. */
export const DEFAULT_KIT: Readonly<KitSpec> = Object.freeze({ stepMgN: 0.25, relativeError: 0.1 });

/** Standard deviation of a reading around the value `modelled` (mg N/L). */
export function readingSigma(kit: KitSpec, modelled: number): number {
  const rounding = kit.stepMgN / Math.sqrt(12);
  const relative = kit.relativeError * Math.max(modelled, 0);
  return Math.sqrt(rounding * rounding + relative * relative);
}

/**
 * Scaled residual (reading − model)/σ, zero for a "0" reading while the model stays below half
 * the first step. The σ uses the modelled value so a wrong model cannot hide behind a large σ
 * built from a high reading.
 */
export function scaledResidual(kit: KitSpec, reading: number, modelled: number): number {
  const sigma = readingSigma(kit, modelled);
  if (reading <= 0) {
    const excess = modelled - kit.stepMgN / 2;
    return excess > 0 ? -excess / sigma : 0;
  }
  return (reading - modelled) / sigma;
}

/** Rounds a value to the kit's swatch, as a keeper reading the chart would (tests, synthetic data). */
export function roundToKit(kit: KitSpec, value: number): number {
  return Math.max(0, Math.round(value / kit.stepMgN) * kit.stepMgN);
}
