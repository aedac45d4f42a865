/**
 * Saved states of a run: the water and nitrifiers at one day, just before that day's events,
 * with the conditions earlier events set — enough to continue the forecast from there. A
 * state remembers which scenario prefix made it, and a continued run refuses another one.
 */
import type { Feeding } from '../bioload';
import type { ParameterOverrides } from '../parameters';
import { ScenarioError, type Scenario } from '../scenario';
import type { RunConditions } from './conditions';

/**
 * The water and nitrifiers at one day, just before that day's events, with the conditions
 * earlier events set — enough to continue the forecast from there (`options.from`).
 */
export interface ForecastState {
  day: number;
  /** model state vector (model.ts: TAN, NO2, NO3, ORG, KH, plant uptake, reference capacities) */
  y: readonly number[];
  temperatureC: number;
  feeding: Feeding;
  fishMassG: number;
  /** active medications and aeration losses: [position among the events before `day`, multiplier] */
  medications: readonly (readonly [number, number])[];
  aerationLosses: readonly (readonly [number, number])[];
  /** continuous doses flowing: [position among the events before `day`, mg N/(L·d)] */
  doseFlows: readonly (readonly [number, number])[];
  /** last accepted solver step, days (a continued run starts with it, as an uninterrupted one would) */
  stepHint: number | null;
  /** identifies the scenario prefix, parameters and feeding multiplier that produced the state */
  key: string;
}

/** What a state depends on, besides the day: the parameters and the feeding multiplier. */
export interface StateOrigin {
  scenario: Scenario;
  parameters: ParameterOverrides | undefined;
  feedingMultiplier: number;
}

/** JSON of what a state depends on before `day` (see ForecastState.key). */
function prefixKey(origin: StateOrigin, day: number): string {
  const { scenario } = origin;
  const prefix = scenario.events.filter((e) => e.day < day - 1e-9);
  return JSON.stringify([scenario.tank, scenario.start, scenario.initialWater, scenario.fish, scenario.feeding, origin.parameters ?? null, origin.feedingMultiplier, prefix]);
}

/** Indices (into scenario.events) of the events before `day`, in array order. */
function prefixIndices(scenario: Scenario, day: number): number[] {
  const out: number[] = [];
  scenario.events.forEach((e, i) => {
    if (e.day < day - 1e-9) out.push(i);
  });
  return out;
}

const refuse = (message: string) => new ScenarioError({ 'options.from': message });

/** Refuses a state that cannot continue this run (after the horizon, other zones, another scenario prefix). */
export function checkSavedState(from: ForecastState, origin: StateOrigin, stateSize: number, horizon: number): void {
  const t0 = from.day;
  if (!(Number.isFinite(t0) && t0 >= 0 && t0 < horizon)) throw refuse('The saved state must lie before the horizon.');
  if (from.y.length !== stateSize) throw refuse('The saved state belongs to a tank with other zones.');
  if (from.key !== prefixKey(origin, t0)) {
    throw refuse('The saved state belongs to another scenario (tank, start, fish, feeding, parameters or events before its day differ).');
  }
}

/** The active medications, aeration losses and continuous doses of a saved state, by event index. */
export function restoredEffects(from: ForecastState, scenario: Scenario): Pick<RunConditions, 'medications' | 'aerationLosses' | 'doseFlows'> {
  const idx = prefixIndices(scenario, from.day);
  const byIndex = (entries: ForecastState['medications']) => new Map(entries.map(([pos, v]) => [idx[pos], v] as const));
  return { medications: byIndex(from.medications), aerationLosses: byIndex(from.aerationLosses), doseFlows: byIndex(from.doseFlows) };
}

/** Takes states of one run; the key only changes when another event falls before the day, so it is reused between those. */
export function createSnapshotter(origin: StateOrigin): (day: number, y: readonly number[], conditions: RunConditions, stepHint: number | null) => ForecastState {
  let lastKey: { count: number; last: number; key: string } | null = null;
  return (day, y, conditions, stepHint) => {
    const idx = prefixIndices(origin.scenario, day);
    const pos = new Map(idx.map((i, j) => [i, j] as const));
    const lastIdx = idx.length ? idx[idx.length - 1] : -1;
    if (!lastKey || lastKey.count !== idx.length || lastKey.last !== lastIdx) {
      lastKey = { count: idx.length, last: lastIdx, key: prefixKey(origin, day) };
    }
    return {
      day,
      y: y.slice(),
      temperatureC: conditions.temperatureC,
      feeding: conditions.feeding,
      fishMassG: conditions.fishMassG,
      medications: [...conditions.medications].map(([i, m]) => [pos.get(i) as number, m] as const),
      aerationLosses: [...conditions.aerationLosses].map(([i, a]) => [pos.get(i) as number, a] as const),
      doseFlows: [...conditions.doseFlows].map(([i, r]) => [pos.get(i) as number, r] as const),
      stepHint,
      key: lastKey.key,
    };
  };
}
