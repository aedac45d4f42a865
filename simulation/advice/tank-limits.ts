/**
 * The limits a forecast is judged against, for one tank: the engine's defaults
 * (../limits: free ammonia, EPA 2013 chronic and acute TAN at the tank's pH and temperature,
 * nitrite on culture practice or on chloride) with the keeper's adjustments for sensitive
 * species. Each limit keeps its source and says when the keeper changed it.
 */
import { defaultLimits, type Limit, type LimitChoices } from '../limits';

/** The limits advice checks, in the order they are reported. */
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
 * The tank's limits. Nitrite follows the chloride basis when the tank's chloride is known,
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
        ? `set for this tank (default ${formatValue(d.value)} ${d.unit}: ${d.basis})`
        : factor !== 1
          ? `${Math.round(factor * 100)} % of the default for sensitive fish; default: ${d.basis}`
          : d.basis;
    return { key, label: LABELS[key], series: SERIES[key], value, unit: d.unit, basis, source: d.source, defaultValue: d.value, adjusted, fixedByKeeper: override !== undefined };
  });
}

/** Three significant digits, as the forecast reports. */
export function formatValue(x: number): string {
  return Number(x.toPrecision(3)).toString();
}
