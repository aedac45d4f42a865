/**
 * A tank's safety limits, each with its basis and source. The EPA criteria protect the most
 * sensitive wild species and are conservative for aquarium fish; they are shown as such.
 * `tankLimits` is the ONE way any caller gets a tank's limits (the forecast summary, the
 * advice layer, the water-test judgement behind the home screen and the alert e-mails):
 * for given conditions, with the keeper's limit settings when there are any, without them for
 * the defaults. `limitRecord` only reshapes its answer by key.
 */
import {
  CCME_FREE_AMMONIA_MG_NH3,
  EIFAC_FREE_AMMONIA_MG_NH3,
  epaAcuteTan,
  epaChronicTan,
  freeAmmoniaFraction,
} from './chemistry';
import { formatFigure } from './format-number';
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

/** A free-ammonia limit (mg NH3/L, default or the keeper's) as the TAN limit at pH and temperature. */
export function freeNh3LimitAsTan(l: Pick<Limit, 'value' | 'basis' | 'source'>, ph: number, temperatureC: number): Limit {
  return {
    value: freeAmmoniaLimitAsTan(l.value, ph, temperatureC),
    unit: 'mg N/L',
    basis: `${l.basis} as TAN at pH ${ph}, ${temperatureC} °C`,
    source: `${l.source}; Emerson et al. (1975) free-ammonia fraction`,
  };
}

/** The published defaults; callers go through `tankLimits`. */
function defaultLimits(c: LimitConditions, choices: LimitChoices = {}): TankLimits {
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
      // [unconfirmed] the source gives 0.1 mg/L without saying as N or as the ion; read as N (the stricter reading, ~3.3× lower as the ion).
      source: 'Boyd, Global Seafood Alliance',
    };
  }
  return {
    freeNh3: { value: fa, unit: 'mg NH3/L', basis: 'free-ammonia guideline', source: faSource },
    freeNh3AsTan: freeNh3LimitAsTan({ value: fa, basis: 'free-ammonia guideline', source: faSource }, c.ph, c.temperatureC),
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

/** The limits a tank is judged against, in the order they are reported. */
export const LIMIT_KEYS = ['freeNh3', 'tanAcute', 'tanChronic', 'nitrite'] as const;
export type LimitKey = (typeof LIMIT_KEYS)[number];

/** The forecast series a limit applies to. */
export type LimitedSeries = 'freeNh3' | 'tan' | 'no2';

export interface AppliedLimit {
  key: LimitKey;
  /** Keeper-facing name. */
  label: string;
  series: LimitedSeries;
  value: number;
  unit: Limit['unit'];
  basis: string;
  source: string;
  /** The engine's default value, shown beside a keeper's adjustment. */
  defaultValue: number;
  adjusted: boolean;
  /** The keeper set this value: it stays fixed instead of following pH and temperature. */
  fixedByKeeper: boolean;
}

export interface LimitConditionsInput {
  ph: number;
  temperatureC: number;
  chlorideMgL?: number;
}

export interface LimitSettings extends LimitChoices {
  /**
   * Multiplies every default (e.g. 0.5 for species known to be sensitive); must lie in (0, 1]
   * — advice never loosens a published limit by a blanket factor.
   */
  sensitivityFactor?: number;
  /** Values the keeper set for single limits, in each limit's unit; they replace the default. */
  overrides?: Partial<Record<LimitKey, number>>;
}

const LABELS: Record<LimitKey, string> = {
  freeNh3: 'free ammonia',
  tanAcute: 'short-term total ammonia',
  tanChronic: 'long-term total ammonia',
  nitrite: 'nitrite',
};

const SERIES: Record<LimitKey, LimitedSeries> = { freeNh3: 'freeNh3', tanAcute: 'tan', tanChronic: 'tan', nitrite: 'no2' };

/**
 * The tank's limits: the defaults with the keeper's adjustments for sensitive species. Each
 * limit keeps its source and says when the keeper changed it. Nitrite follows the chloride basis when the tank's chloride is known,
 * else culture practice — unless the settings name a basis.
 */
export function tankLimits(conditions: LimitConditionsInput, settings: LimitSettings = {}): AppliedLimit[] {
  const factor = settings.sensitivityFactor ?? 1;
  if (!(factor > 0 && factor <= 1)) throw new RangeError(`sensitivityFactor must lie in (0, 1], got ${factor}`);
  const nitriteBasis = settings.nitriteBasis ?? (conditions.chlorideMgL !== undefined ? 'chloride' : 'culture-practice');
  const defaults = defaultLimits(conditions, { nitriteBasis, freeAmmoniaGuideline: settings.freeAmmoniaGuideline });
  return LIMIT_KEYS.map((key) => {
    const d = defaults[key];
    const override = settings.overrides?.[key];
    if (override !== undefined && !(Number.isFinite(override) && override > 0)) {
      throw new RangeError(`limit "${key}" must be a positive number, got ${override}`);
    }
    const scaled = d.value * factor;
    const value = override ?? scaled;
    const adjusted = override !== undefined || factor !== 1;
    const basis =
      override !== undefined
        ? `set for this tank (default ${formatFigure(d.value)} ${d.unit}: ${d.basis})`
        : factor !== 1
          ? `${Math.round(factor * 100)} % of the default for sensitive fish; default: ${d.basis}`
          : d.basis;
    return { key, label: LABELS[key], series: SERIES[key], value, unit: d.unit, basis, source: d.source, defaultValue: d.value, adjusted, fixedByKeeper: override !== undefined };
  });
}

/**
 * `tankLimits`' answer by key, with the free-ammonia limit also as TAN at the conditions (the
 * forecast summary's shape). Only the Limit fields are kept.
 */
export function limitRecord(applied: readonly AppliedLimit[], c: Pick<LimitConditions, 'ph' | 'temperatureC'>): TankLimits {
  const at = (key: LimitKey): Limit => {
    const l = applied.find((a) => a.key === key)!;
    return { value: l.value, unit: l.unit, basis: l.basis, source: l.source };
  };
  return { freeNh3: at('freeNh3'), freeNh3AsTan: freeNh3LimitAsTan(at('freeNh3'), c.ph, c.temperatureC), tanChronic: at('tanChronic'), tanAcute: at('tanAcute'), nitrite: at('nitrite') };
}

/** A figure in the engine's sentences (simulation/format-number.ts `formatFigure`). */
export const formatValue = formatFigure;
