/**
 * The limits a forecast is judged against, for one tank. They are made in ../limits (one
 * source of truth, shared with the engine's callers); re-exported here for the advice layer.
 */
export {
  formatValue,
  LIMIT_KEYS,
  tankLimits,
  type AppliedLimit,
  type LimitConditionsInput,
  type LimitedSeries,
  type LimitKey,
  type LimitSettings,
} from '../limits';
