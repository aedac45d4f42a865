/**
 * tankScenario(tank, plan, options): the engine scenario (simulation/scenario.ts) of a
 * stored tank (shared/schemas/tank.ts) running a plan's events. Pure; used by the server
 * (plan forecasts, advice) and the app (live forecast while a draft changes).
 */
import { zonesFromDescription } from '../simulation/presets';
import { doseSpanDays } from '../simulation/timeline';
import { ScenarioError, type AerationLevel, type FishGroup, type ScenarioEvent, type ScenarioInput, type Start, type Zone } from '../simulation/scenario';
import { TANK_DEFAULTS, type LivestockItem, type RoutineWaterChange, type TankDetail, type TankSetup } from './schemas/tank';

/** The parts of a stored tank a scenario needs. */
export type ScenarioTank = Pick<TankDetail, 'volumeL' | 'temperatureC' | 'ph' | 'khDkh' | 'tapWater' | 'setup' | 'livestock'> & {
  /** Only the count matters: any logged test means the tank has a history. */
  readings: readonly unknown[];
};

export interface ScenarioPlan {
  name?: string;
  events: readonly ScenarioEvent[];
}

export interface TankScenarioOptions {
  /** How the tank starts; default from `startFor` (fish → mature at present load, else new). */
  start?: Start;
  /** Forecast length; default from `defaultHorizonDays`. */
  horizonDays?: number;
}

export type StartReason = 'given' | 'mature-present-load' | 'new-unseeded' | 'new-no-fish';

export interface TankScenario {
  scenario: ScenarioInput;
  start: Start;
  /** Why this start state was chosen (for the plain-words line above a forecast). */
  startReason: StartReason;
}

/** Days of forecast after the last event, so its spike and recovery fit (common practice: 3 weeks). */
export const DAYS_AFTER_LAST_EVENT = 21;
/** Shortest and longest default horizons, days. */
export const MIN_HORIZON_DAYS = 30;
export const MAX_HORIZON_DAYS = 365;

/** Day of an event's last action (repeating, split and continuous doses end later than they start). */
export function lastActionDay(event: ScenarioEvent): number {
  if (event.type === 'ammonia-dose') {
    const repeats = event.repeatEveryDays !== undefined ? (event.repeatCount ?? 1) : 1;
    return event.day + (event.repeatEveryDays ?? 0) * (repeats - 1) + doseSpanDays(event);
  }
  if (event.type === 'medication' || event.type === 'aeration-loss') return event.day + event.durationDays;
  return event.day;
}

/** Horizon covering every event plus three weeks, within [30, 365] days. */
export function defaultHorizonDays(events: readonly ScenarioEvent[]): number {
  const last = events.reduce((m, e) => Math.max(m, lastActionDay(e)), 0);
  return Math.min(MAX_HORIZON_DAYS, Math.max(MIN_HORIZON_DAYS, Math.ceil(last) + DAYS_AFTER_LAST_EVENT));
}

/**
 * The start state of a stored tank: with fish it has been running and its nitrifiers match
 * its present load ("mature"); with no fish it is new and unseeded. An empty tank with a test
 * history is still started new: nothing says what fed its biofilter (the keeper can calibrate
 * or pass an explicit start).
 */
export function startFor(tank: Pick<ScenarioTank, 'livestock' | 'readings'>): { start: Start; startReason: StartReason } {
  const fish = tank.livestock.reduce((n, l) => n + l.count, 0);
  if (fish > 0) return { start: { kind: 'mature' }, startReason: 'mature-present-load' };
  return { start: { kind: 'new' }, startReason: tank.readings.length > 0 ? 'new-no-fish' : 'new-unseeded' };
}

/** Fish present at day 0; a custom animal without a length has no load estimate, so it is refused by name. */
export function fishFromLivestock(livestock: readonly LivestockItem[]): FishGroup[] {
  const errors: Record<string, string> = {};
  const fish: FishGroup[] = [];
  livestock.forEach((l, i) => {
    if (l.count < 1) return;
    if (l.speciesId) {
      fish.push({ species: l.speciesId, count: l.count, ...(l.customName ? { name: l.customName } : {}), ...(l.lengthCm ? { lengthCm: l.lengthCm } : {}) });
    } else if (l.lengthCm && l.customName) {
      fish.push({ name: l.customName, count: l.count, lengthCm: l.lengthCm });
    } else {
      errors[`livestock.${i}.lengthCm`] = `Give the length of "${l.customName ?? 'this animal'}" so its load can be estimated.`;
    }
  });
  if (Object.keys(errors).length > 0) throw new ScenarioError(errors);
  return fish;
}

/** Zones and aeration from the tank's setup: explicit zones win; otherwise the description. */
export function zonesForSetup(tank: Pick<ScenarioTank, 'volumeL' | 'setup'>): { zones: Zone[]; aeration: AerationLevel } {
  const setup = tank.setup;
  const substrate = setup.substrate ?? 'bare';
  const hardscape = setup.hardscape ?? 'none';
  if (setup.zones && setup.zones.length > 0) return { zones: setup.zones, aeration: setup.aeration ?? 'surface-agitation' };
  if (setup.filter) {
    const built = zonesFromDescription({ volumeL: tank.volumeL, filter: setup.filter, substrate, hardscape });
    return { zones: built.zones, aeration: setup.aeration ?? built.aeration };
  }
  // No filter: the same description without its filter zone (glass, hardscape, substrate only).
  const built = zonesFromDescription({ volumeL: tank.volumeL, filter: { kind: 'sponge', mediaVolumeL: 1 }, substrate, hardscape });
  return { zones: built.zones.filter((z) => z.kind !== 'filter'), aeration: setup.aeration ?? 'gentle' };
}

/** The tank's usual water change, or the common weekly 25 % when the keeper has not said. */
export function routineWaterChangeOf(setup: TankSetup): RoutineWaterChange {
  return setup.routineWaterChange ?? TANK_DEFAULTS.routineWaterChange;
}

/** The scenario's routine water change (none when the keeper does none). */
export function routineWaterChangeFor(setup: TankSetup): { routineWaterChange?: { percent: number; everyDays: number } } {
  const { percent, everyDays } = routineWaterChangeOf(setup);
  return percent > 0 ? { routineWaterChange: { percent, everyDays } } : {};
}

/** The scenario of `tank` running `plan` (or no events), with its start state and why. */
export function tankScenario(tank: ScenarioTank, plan: ScenarioPlan = { events: [] }, options: TankScenarioOptions = {}): TankScenario {
  if (!(tank.volumeL > 0)) throw new ScenarioError({ volumeL: 'Volume must be above 0 L.' });
  const chosen = options.start ? { start: options.start, startReason: 'given' as const } : startFor(tank);
  const { zones, aeration } = zonesForSetup(tank);
  const scenario: ScenarioInput = {
    ...(plan.name ? { name: plan.name } : {}),
    tank: {
      volumeL: tank.volumeL,
      temperatureC: tank.temperatureC,
      ph: tank.ph,
      ...(tank.khDkh !== null && tank.khDkh > 0 ? { khDegrees: tank.khDkh } : {}),
      tapWater: { tanMgN: tank.tapWater.tanMgN, no2MgN: tank.tapWater.no2MgN, no3MgN: tank.tapWater.no3MgN },
      zones,
      aeration,
      lightHoursPerDay: tank.setup.lightHoursPerDay ?? 8,
      plants: tank.setup.plants ?? 'none',
      ...routineWaterChangeFor(tank.setup),
    },
    start: chosen.start,
    fish: fishFromLivestock(tank.livestock),
    feeding: { mode: 'body-mass' },
    events: plan.events.map((e) => JSON.parse(JSON.stringify(e)) as ScenarioEvent),
    horizonDays: options.horizonDays ?? defaultHorizonDays(plan.events),
  };
  return { scenario, start: chosen.start, startReason: chosen.startReason };
}
