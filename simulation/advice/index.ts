/** The advice and calibration layer (issue 4): re-exports only. */
export { fastestSafeSchedule, splitCount, type AdditionAdvice, type AdditionBlocker, type AdditionRequest, type AdditionSuggestion, type Batch } from './addition-schedule';
export { supplementaryDosing, type RemovalAdvice, type RemovalRequest } from './removal-dosing';
export { rescueWaterChanges, type RescueAdvice, type RescueRequest, type WaterChange } from './rescue-water-changes';
export { calibrate, type CalibrationRequest, type CalibrationResult, type Reading } from './calibration';
export { capacityTestProtocol, estimateCapacityFromTest, READING_HOURS, type CapacityTestProtocol } from './capacity-test';
export { runEnsemble, sampleEnsemble, bandExplanation, type EnsembleBand, type EnsembleResult, type EnsembleSpec } from './ensemble';
export { tankLimits, LIMIT_KEYS, type AppliedLimit, type LimitKey, type LimitSettings } from './tank-limits';
export { judgeForecast, type ForecastVerdict } from './judge';
export * from './schemas';
