/**
 * The one parameter table of the nitrogen-cycle model (science brief model.md §2–§4).
 * Engine, documentation and the uncertainty ensemble all read it: the ensemble samples each
 * entry's [min, max]; calibration overrides entries by key. Tags: `pub` (published source
 * named), `practice` (common practice, no single source), `memory` (recalled, not confirmed —
 * a default to calibrate, never a check value).
 */

export type SourceTag = 'pub' | 'practice' | 'memory';

export interface ParameterSpec {
  readonly unit: string;
  readonly default: number;
  /** Plausible range sampled by the ensemble. */
  readonly min: number;
  readonly max: number;
  readonly source: string;
  readonly tag: SourceTag;
  readonly description: string;
}

export const PARAMETERS = {
  muMaxAo: {
    unit: '1/d', default: 0.9, min: 0.2, max: 1.0, tag: 'pub',
    source: 'Metcalf & Eddy, Wastewater Engineering 5th ed. (2014) Table 8-14; Rittmann & McCarty (2001) 0.76',
    description: 'maximum specific growth rate of ammonia oxidisers at 20 °C',
  },
  muMaxNo: {
    unit: '1/d', default: 0.8, min: 0.6, max: 1.8, tag: 'memory',
    source: 'Metcalf & Eddy (2014) [range from memory]; Rittmann & McCarty (2001) 0.81 [pub]',
    description: 'maximum specific growth rate of nitrite oxidisers at 20 °C',
  },
  kTanAo: {
    unit: 'mg N/L', default: 0.5, min: 0.1, max: 1.0, tag: 'pub',
    source: 'Metcalf & Eddy (2014)',
    description: 'half-saturation constant of ammonia oxidisers for TAN',
  },
  kNo2No: {
    unit: 'mg N/L', default: 0.2, min: 0.05, max: 1.3, tag: 'memory',
    source: 'Metcalf & Eddy (2014) [memory]; Nitrospira Km 0.08–0.14 mg N/L (Ushiki et al. 2017) [pub]',
    description: 'half-saturation constant of nitrite oxidisers for nitrite',
  },
  kO2Ao: {
    unit: 'mg O2/L', default: 0.5, min: 0.3, max: 1.0, tag: 'pub',
    source: 'Metcalf & Eddy (2014); Rittmann & McCarty (2001) 0.50',
    description: 'oxygen half-saturation constant of ammonia oxidisers',
  },
  kO2No: {
    unit: 'mg O2/L', default: 0.9, min: 0.3, max: 1.5, tag: 'memory',
    source: 'Metcalf & Eddy (2014) [memory]; Rittmann & McCarty (2001) 0.68 [pub]',
    description: 'oxygen half-saturation constant of nitrite oxidisers',
  },
  yieldAo: {
    unit: 'g VSS/g N', default: 0.15, min: 0.1, max: 0.2, tag: 'pub',
    source: 'Metcalf & Eddy (2014) [range from memory]',
    description: 'biomass yield of ammonia oxidisers',
  },
  yieldNo: {
    unit: 'g VSS/g N', default: 0.05, min: 0.03, max: 0.09, tag: 'memory',
    source: 'Metcalf & Eddy (2014) [memory]',
    description: 'biomass yield of nitrite oxidisers',
  },
  decayAo: {
    unit: '1/d', default: 0.08, min: 0.02, max: 0.2, tag: 'pub',
    source: 'Siegrist et al. (1999) Water Sci. Technol. 39(1): ~0.2/d aerobic, ~0.03/d anaerobic; ASM3 0.15',
    description: 'decay (activity loss) rate of ammonia oxidisers at 20 °C',
  },
  decayNo: {
    unit: '1/d', default: 0.08, min: 0.02, max: 0.2, tag: 'pub',
    source: 'Siegrist et al. (1999); ASM3 (Gujer et al. 1999) 0.15 aerobic',
    description: 'decay (activity loss) rate of nitrite oxidisers at 20 °C',
  },
  thetaAo: {
    unit: '-', default: 1.072, min: 1.05, max: 1.1, tag: 'memory',
    source: 'Metcalf & Eddy θ [memory]; Ea 68 kJ/mol ≈ θ 1.10 (Vannecke & Volcke 2015) [pub]',
    description: 'Arrhenius temperature factor of ammonia-oxidiser growth and activity',
  },
  thetaNo: {
    unit: '-', default: 1.063, min: 1.04, max: 1.08, tag: 'memory',
    source: 'Metcalf & Eddy θ [memory]; Ea 44 kJ/mol (Vannecke & Volcke 2015) [pub]',
    description: 'Arrhenius temperature factor of nitrite-oxidiser growth and activity',
  },
  thetaDecay: {
    unit: '-', default: 1.029, min: 1.0, max: 1.04, tag: 'memory',
    source: 'Metcalf & Eddy [memory]',
    description: 'temperature factor of decay, both populations',
  },
  nPerCod: {
    unit: 'g N/g COD', default: 0.07, min: 0.06, max: 0.086, tag: 'pub',
    source: 'ASM3 (Gujer et al. 1999) i_N,BM [range from memory]',
    description: 'nitrogen content of nitrifier biomass',
  },
  codPerVss: {
    unit: 'g COD/g VSS', default: 1.42, min: 1.37, max: 1.48, tag: 'pub',
    source: 'stoichiometry of C5H7NO2 (Metcalf & Eddy 2014) [range from memory]',
    description: 'oxygen demand of one gram of volatile biomass',
  },
  phLowOptimum: {
    unit: 'pH', default: 7.2, min: 7.0, max: 7.5, tag: 'pub',
    source: 'US EPA (1975) Process Design Manual for Nitrogen Control',
    description: 'pH below which nitrification slows',
  },
  phSlope: {
    unit: '1/pH unit', default: 0.833, min: 0.6, max: 1.0, tag: 'pub',
    source: 'US EPA (1975): factor 1 − 0.833·(7.2 − pH) [range from memory]',
    description: 'loss of nitrification rate per pH unit below the optimum',
  },
  kiFreeAmmoniaNo: {
    unit: 'mg NH3/L', default: 0.8, min: 0.1, max: 1.0, tag: 'pub',
    source: 'Park & Bae (2009) K_I ≈ 0.8 mg NH3/L; onset 0.1–1.0 (Anthonisen et al. 1976, J. WPCF 48:835)',
    description: 'non-competitive free-ammonia inhibition constant of nitrite oxidisers',
  },
  lightInhibitionAo: {
    unit: '-', default: 0.5, min: 0.1, max: 0.9, tag: 'memory',
    source: 'qualitative: Guerrero & Jones (1996) MEPS 141:183; Merbt et al. (2012) [pub]; magnitude from memory',
    description: 'share of ammonia-oxidiser activity lost in a fully lit zone while the light is on',
  },
  lightInhibitionNo: {
    unit: '-', default: 0.05, min: 0, max: 0.3, tag: 'memory',
    source: 'Guerrero & Jones (1996): cool-white light did not inhibit nitrite oxidation [pub]; small default from memory',
    description: 'share of nitrite-oxidiser activity lost in a fully lit zone while the light is on',
  },
  arealCapacity: {
    unit: 'mg N/(m²·d) at 24 °C', default: 500, min: 200, max: 690, tag: 'pub',
    source: 'Nijhof & Bovendeur (1990) Aquaculture 87:133: max 0.69 g N/m²/d at 24 °C; design practice 0.2–0.5 [memory]',
    description: 'ceiling of a mature biofilm per m² of effective area (each population)',
  },
  ammonification: {
    unit: '1/d', default: 0.2, min: 0.05, max: 0.5, tag: 'memory',
    source: 'detritus mineralisation in aquaculture [memory]',
    description: 'first-order rate at which detritus N (ORG) is released as TAN, at 20 °C',
  },
  thetaAmmonification: {
    unit: '-', default: 1.04, min: 1.02, max: 1.08, tag: 'memory',
    source: 'typical θ of hydrolysis processes [memory]',
    description: 'temperature factor of ammonification',
  },
  tanPerProteinFed: {
    unit: 'g TAN-N/g protein eaten', default: 0.092, min: 0.07, max: 0.1, tag: 'pub',
    source: 'Timmons & Ebeling, Recirculating Aquaculture: 0.16 × 0.8 × 0.8 × 0.9 [factor from memory]',
    description: 'TAN excreted per gram of feed protein eaten',
  },
  nPerProtein: {
    unit: 'g N/g protein', default: 0.16, min: 0.155, max: 0.165, tag: 'pub',
    source: 'Jones factor 6.25 (Timmons & Ebeling)',
    description: 'nitrogen content of protein',
  },
  fishRetention: {
    unit: 'share of eaten N', default: 0.16, min: 0.1, max: 0.35, tag: 'memory',
    source: 'Timmons & Ebeling split 0.8 assimilated × 0.2 retained [memory]',
    description: 'share of eaten feed N kept in fish growth (leaves the water)',
  },
  appetite: {
    unit: '% body mass/d', default: 3, min: 1.5, max: 6, tag: 'pub',
    source: 'Wheaton, RAS overview: 3–4 % body weight/d warm water, 1–2 % cool',
    description: 'most food the fish eat per day; feed beyond it stays uneaten and becomes detritus',
  },
  feedPercent: {
    unit: '% body mass/d', default: 2, min: 1, max: 4, tag: 'practice',
    source: 'model.md §4 default; adult small tropical fish 1–10 % (zebrafish husbandry) [pub]',
    description: 'default feeding when the scenario gives none',
  },
  proteinShare: {
    unit: 'g protein/g feed', default: 0.45, min: 0.3, max: 0.55, tag: 'practice',
    source: 'typical flake and pellet labels [practice]',
    description: 'default protein share of the food',
  },
  lengthWeightB: {
    unit: '-', default: 3.03, min: 2.5, max: 3.5, tag: 'pub',
    source: 'Froese (2006) J. Appl. Ichthyol. 22:241: median b = 3.03',
    description: 'exponent of the length–mass relation W = a·L^b',
  },
  plantUptakeHeavy: {
    unit: 'mg N/(L·d)', default: 0.1, min: 0.02, max: 0.3, tag: 'memory',
    source: 'planted-tank practice [memory]',
    description: 'most N a heavily planted tank takes up per litre per day (light 0.25×, moderate 0.5×)',
  },
  kTanPlants: {
    unit: 'mg N/L', default: 0.05, min: 0.01, max: 0.2, tag: 'memory',
    source: 'aquatic plant uptake kinetics [memory]',
    description: 'half-saturation of plant ammonium uptake (plants take TAN first)',
  },
  kNo3Plants: {
    unit: 'mg N/L', default: 0.5, min: 0.1, max: 2, tag: 'memory',
    source: 'aquatic plant uptake kinetics [memory]',
    description: 'half-saturation of plant nitrate uptake',
  },
  alkalinityPerN: {
    unit: 'mg CaCO3/mg N', default: 7.14, min: 6.3, max: 7.4, tag: 'pub',
    source: 'stoichiometry; US EPA (1975) observed 6.3–7.4',
    description: 'alkalinity consumed per mg N oxidised by ammonia oxidisers',
  },
  substrateActiveDepth: {
    unit: 'cm', default: 2, min: 1, max: 5, tag: 'memory',
    source: 'only the top few cm of a substrate are oxic (model.md §1) [memory]',
    description: 'depth of substrate that carries nitrifiers',
  },
  inoculum: {
    unit: 'mg N/(L·d)', default: 1e-4, min: 1e-5, max: 1e-3, tag: 'practice',
    source: 'model.md §6.1 prototype; unseeded tanks (Lekang; Mnyoro et al. 2022 timing) [pub for timing]',
    description: 'starting capacity of each population in an unseeded tank, at the tank temperature',
  },
} as const satisfies Record<string, ParameterSpec>;

export type ParameterKey = keyof typeof PARAMETERS;
export type Parameters = Record<ParameterKey, number>;
export type ParameterOverrides = Partial<Parameters>;

export const PARAMETER_KEYS = Object.keys(PARAMETERS) as ParameterKey[];

export const DEFAULT_PARAMETERS: Readonly<Parameters> = Object.freeze(
  Object.fromEntries(PARAMETER_KEYS.map((k) => [k, PARAMETERS[k].default])) as Parameters,
);

/**
 * Defaults merged with overrides. Overrides must be finite and ≥ 0 (θ ≥ 1 would be a
 * physical requirement too, but the caller may test odd values); they may leave the plausible
 * range — calibration sometimes must — so only finiteness and sign are checked.
 */
export function resolveParameters(overrides?: ParameterOverrides): Parameters {
  if (!overrides) return DEFAULT_PARAMETERS as Parameters;
  const out = { ...DEFAULT_PARAMETERS } as Parameters;
  for (const key in overrides) {
    if (!(key in PARAMETERS)) throw new RangeError(`unknown parameter "${key}"`);
    const v = overrides[key as ParameterKey];
    if (v === undefined) continue;
    if (!Number.isFinite(v) || v < 0) throw new RangeError(`parameter "${key}" must be a finite number ≥ 0, got ${v}`);
    out[key as ParameterKey] = v;
  }
  return out;
}
