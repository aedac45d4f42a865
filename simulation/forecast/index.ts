/** The forecast's public face: callers import from here (simulation/forecast). */
export { createForecastSession, forecast, forecastParsed, type Forecast, type ForecastSession } from './session';
export type { ForecastOptions } from './options';
export type { ForecastSeries, ZoneSeries } from './series';
export type { ForecastState } from './state';
export type { ForecastReading } from './reading';
export type { ForecastSummary } from './summary';
export type { NitrogenBalance } from './balance';
export { KIT_FIRST_STEP_MG_N, spareSentence, type SpareCapacity } from './spare-capacity';
