/**
 * The one parameter table of the nitrogen-cycle model (MODEL.md §5).
 * Engine, documentation and the uncertainty ensemble all read it: the ensemble samples each
 * entry's [min, max]; calibration overrides entries by key. Tags: `pub` (published source
 * named), `practice` (common practice, no single source), `memory` (recalled, not confirmed —
 * a default to calibrate, never a check value), `judgement` (a modelling choice no source
 * fixes; its range is wide on purpose). Sections cited as MODEL.md §… are simulation/MODEL.md;
 * how far each source was read is in simulation/SOURCES.md.
 */

export type SourceTag = 'pub' | 'practice' | 'memory' | 'judgement';

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
    unit: 'mg N/L', default: 1.0, min: 0.5, max: 2.0, tag: 'pub',
    source: 'apparent (bulk-water) half-saturation of a nitrifying biofilm: first-order below ~1 mg N/L, zero-order above (Ebeling & Wheaton 2006, bead filter); linear 0.1–0.5 mg/L (Malone, Bergeron & Cristina 2006); 1.93 mg TAN/L at 27.2 °C (Zhu & Chen 1999) as the upper end. Read as abstracts (SOURCES.md §3–4)',
    description: 'apparent half-saturation of attached ammonia oxidisers for TAN, in the bulk water at full flow',
  },
  kNo2No: {
    unit: 'mg N/L', default: 0.15, min: 0.08, max: 0.6, tag: 'judgement',
    source: 'Nitrospira Km 0.08–0.14 mg N/L (Ushiki et al. 2017) [pub] raised by diffusion into the film as for ammonia; no biofilm value read (SOURCES.md R1)',
    description: 'apparent half-saturation of attached nitrite oxidisers for nitrite, at full flow',
  },
  oxygenPerTan: {
    unit: 'mg O2/mg N', default: 3.4, min: 3.0, max: 4.6, tag: 'pub',
    source: 'Tanaka & Dunn (1982) Biotechnol. Bioeng. 24:669: below a bulk O2:NH4-N ratio of 3.4 oxygen limits the biofilm (abstract, SOURCES.md §5)',
    description: 'bulk oxygen per unit of TAN below which oxygen transport, not ammonia, limits the ammonia oxidisers',
  },
  oxygenPerNitrite: {
    unit: 'mg O2/mg N', default: 4.5, min: 3.4, max: 6, tag: 'judgement',
    source: 'stricter than for ammonia because nitrite oxidation "decreased more" under low oxygen (Tanaka & Dunn 1982) [pub]; the value is a judgement',
    description: 'bulk oxygen per unit of nitrite below which oxygen transport limits the nitrite oxidisers',
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
    unit: '1/d', default: 0.05, min: 0.025, max: 0.12, tag: 'memory',
    source: 'loss while fed (endogenous decay, grazing, detachment): ASM-type 0.05–0.15/d [memory]; gives the settled floor ≈ 0.07 mg TAN/L that Zhu & Chen (1999) measured at 27.2 °C [pub] (MODEL.md §3.3). Siegrist et al. (1999) 0.2/d aerobic sludge with grazers [pub] is the upper edge',
    description: 'loss rate of fed ammonia oxidisers at 20 °C',
  },
  decayNo: {
    unit: '1/d', default: 0.05, min: 0.025, max: 0.12, tag: 'memory',
    source: 'as decayAo; aerobic decay of AOB and NOB "did not diverge significantly" (Manser, Gujer & Siegrist 2006) [pub]',
    description: 'loss rate of fed nitrite oxidisers at 20 °C',
  },
  starveLossEarly: {
    unit: '1/d', default: 0.01, min: 0.004, max: 0.022, tag: 'pub',
    source: 'biofilm nitrifiers lose < 20 % of activity in 10 days without ammonia (Ye, Hu, Poussade, Keller & Yuan, MBBR starvation study; journal unconfirmed) ⇒ ≤ 0.022/d; N. europaea starved 342 d kept its activity (Wilhelm et al. 1998). Abstracts (SOURCES.md §1–2, §9)',
    description: 'loss rate of starving nitrifiers in their first days without food, at 20 °C',
  },
  starveLossLate: {
    unit: '1/d', default: 0.085, min: 0.04, max: 0.12, tag: 'pub',
    source: 'activity loss 60–80 % after more than 20 days of starvation (Ye et al., as above) ⇒ 0.05–0.08/d averaged from day 0, faster once the early phase is over; their reactor was aerated 15 min in 6 h, so a fully aerated filter may lose faster (range)',
    description: 'loss rate of nitrifiers that have starved for weeks, at 20 °C',
  },
  starveSwitchDays: {
    unit: 'd', default: 12, min: 8, max: 20, tag: 'judgement',
    source: 'between the 10 days of small loss and the 20 days of large loss reported by Ye et al. [pub]; the switch time itself is a judgement',
    description: 'days without food after which starving nitrifiers lose activity at the late rate (half-way point)',
  },
  fedGrowthShare: {
    unit: '-', default: 0.2, min: 0.2, max: 0.2, tag: 'judgement',
    source: 'modelling choice (MODEL.md §3.4): a population counts as starving once its achievable growth falls below about a fifth of its fed loss',
    description: 'growth-to-loss ratio at which a population is half fed, half starving',
  },
  immigration: {
    unit: 'mg N/(L·d) per day', default: 1e-7, min: 1e-9, max: 1e-5, tag: 'judgement',
    source: 'order of magnitude only: ammonia oxidisers in chloraminated tap water < 0.2 to > 300 per mL, none below 16–18 °C (Wolfe et al. 1990, AEM 56:451) [pub] × a cell rate [memory] × water-change volume; food and hands: no estimate found (SOURCES.md §12)',
    description: 'capacity arriving per litre per day from outside (tap water, food, hands), each population',
  },
  exchange: {
    unit: '1/d', default: 0.003, min: 0.001, max: 0.01, tag: 'judgement',
    source: 'no published rate found for nitrifiers moving between surfaces of one water body (SOURCES.md R4); chosen so new media beside mature surfaces colonise within a start-up window',
    description: 'share of each zone\'s nitrifiers shed per day and settling on all surfaces by area',
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
    unit: 'pH', default: 7.2, min: 7.0, max: 7.5, tag: 'memory',
    source: 'US EPA (1975) Process Design Manual for Nitrogen Control (unconfirmed: not read, SOURCES.md §10)',
    description: 'pH below which nitrification slows',
  },
  phSlope: {
    unit: '1/pH unit', default: 0.833, min: 0.6, max: 1.0, tag: 'memory',
    source: 'US EPA (1975): factor 1 − 0.833·(7.2 − pH) for unacclimated sludge (unconfirmed: not read)',
    description: 'loss of nitrification rate per pH unit below the optimum, before the community adapts',
  },
  acidFloor: {
    unit: '-', default: 0.5, min: 0.2, max: 0.8, tag: 'judgement',
    source: 'acclimated biofilms nitrify at near-neutral specific rates at pH 4.3–5 (Tarre & Green 2004, AEM 70:6481) [pub]; acidophilic ammonia oxidisers grow at pH 4–5.5 (Lehtovirta-Morley et al. 2011) [pub]; no value for low-ammonia tank filters found, so the floor is a judgement with a wide range',
    description: 'share of the neutral rate an acid-adapted community keeps at pH 5.5–6.5',
  },
  acidAdaptDays: {
    unit: 'd', default: 21, min: 7, max: 42, tag: 'judgement',
    source: 'modelling choice: weeks, as the community shifts toward acid-tolerant oxidisers (MODEL.md §3.6)',
    description: 'time constant over which nitrifiers adapt to acid water',
  },
  kiFreeAmmoniaNo: {
    unit: 'mg NH3/L', default: 0.8, min: 0.1, max: 1.0, tag: 'pub',
    source: 'Park & Bae (2009) K_I 46 µM ≈ 0.8 mg NH3/L; onset 0.1–1.0 (Anthonisen et al. 1976, J. WPCF 48:835, via secondary sources)',
    description: 'free-ammonia inhibition constant of nitrite oxidisers (applied as a simple factor K/(K + NH3))',
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
    source: 'common default; adult small tropical fish 1–10 % (zebrafish husbandry) [pub]',
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
    source: 'only the top few cm of a substrate are oxic [memory]',
    description: 'depth of substrate that carries nitrifiers',
  },
  inoculum: {
    unit: 'mg N/(L·d)', default: 1e-4, min: 1e-5, max: 1e-3, tag: 'practice',
    source: 'set so an unseeded tank dosed daily clears in 6–7 weeks at 25 °C (Mnyoro et al. 2022, J. Cleaner Prod. 366:132929, pilot RAS) [pub for timing]',
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
