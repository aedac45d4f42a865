/**
 * tankScenario(tank, plan, options): the engine scenario (simulation/scenario.ts) of a
 * stored tank (shared/schemas/tank.ts) running a plan's events. Pure; used by the server
 * (plan forecasts, advice) and the app (live forecast while a draft changes).
 */
import { zonesFromDescription } from '../simulation/presets';
import { doseSpanDays } from '../simulation/timeline';
import { ScenarioError, type AerationLevel, type FishGroup, type ScenarioEvent, type ScenarioInput, type Start, type Zone } from '../simulation/scenario';
import { TANK_DEFAULTS, type LivestockItem, type RoutineWaterChange, type TankDetail, type TankSetup } from './schemas/tank';
import { startEvidence, startFor, type EvidenceTank, type StartReading, type StartReason, type StartState } from './tank-start';

export { startFor, type StartReason, type StartState } from './tank-start';

/** The parts of a stored tank a scenario needs. */
export type ScenarioTank = Pick<TankDetail, 'volumeL' | 'temperatureC' | 'ph' | 'khDkh' | 'tapWater' | 'setup' | 'livestock'> &
  Pick<EvidenceTank, 'history' | 'fit'> & {
    /** Newest first; the latest up to the start day may give the day-0 water (shared/tank-start.ts), and any test at all means the tank has a history. */
    readings: readonly (StartReading | null)[];
  };

export interface ScenarioPlan {
  name?: string;
  events: readonly ScenarioEvent[];
}

export interface TankScenarioOptions {
  /** How the tank starts, overriding the evidence; default from `startEvidence` (shared/tank-start.ts). */
  start?: Start;
  /**
   * The forecast's day 0 (YYYY-MM-DD: the plan's start date, or today). Without it the
   * tank's tests and fit are not used (its description and the default still are).
   */
  startDate?: string;
  /** 'description': the keeper's account or the default only, no test or fit (a fit's prior); default 'all'. */
  evidence?: 'all' | 'description';
  /** Forecast length; default from `defaultHorizonDays`. */
  horizonDays?: number;
}

export interface TankScenario {
  scenario: ScenarioInput;
  start: Start;
  /** Why this start state was chosen (for the plain-words line above a forecast). */
  startReason: StartReason;
  /** What the start came from, with its warnings (worded by shared/start-words.ts). */
  startState: StartState;
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
  const { zones, aeration } = zonesForSetup(tank);
  const evidence = options.start
    ? { start: options.start, initialWater: {}, state: { reason: 'given' as const, startDate: options.startDate ?? null, test: null, fittedAt: null, history: tank.history ?? null, warnings: [] } }
    : startEvidence(tank, zones, options.startDate ?? null, options.evidence ?? 'all');
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
    start: evidence.start,
    initialWater: evidence.initialWater,
    fish: fishFromLivestock(tank.livestock),
    feeding: { mode: 'body-mass' },
    events: plan.events.map((e) => JSON.parse(JSON.stringify(e)) as ScenarioEvent),
    horizonDays: options.horizonDays ?? defaultHorizonDays(plan.events),
  };
  return { scenario, start: evidence.start, startReason: evidence.state.reason, startState: evidence.state };
}
