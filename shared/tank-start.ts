/**
 * startEvidence(tank, startDate): where a forecast of a stored tank starts from, from what is
 * known about it, in this order (issue 14):
 * 1. the water: the latest test taken on the plan's start date or in the TEST_START_MAX_DAYS
 *    before it gives the day-0 total ammonia, nitrite and nitrate (a value the test left out
 *    comes from the start below); an older test is not used, and says so;
 * 2. the nitrifiers: an applied fit's capacities (while the tank's zones are the ones it was
 *    fitted on), else the keeper's account of the tank's past (settled, new, emptied, seeded),
 *    else the default (fish → settled at the present load; none → new).
 * It also notes what does not add up: a test too old to use, a settled tank whose test shows
 * ammonia or nitrite (judged as every test is, simulation/water-test.ts), a fit made for other
 * zones. Pure; the server and the live forecast in the browser use the same rule.
 */
import { judgeWaterTest } from '../simulation/water-test';
import type { Start, Zone } from '../simulation/scenario';
import type { TankHistory, TankFit } from './schemas/tank-history';
import type { StartReason, StartState, StartTest, StartWarning } from './schemas/start-state';

export type { StartReason, StartState, StartWarning } from './schemas/start-state';

/** A test this old at day 0 still describes the water (common practice: ammonia and nitrite move within days). */
export const TEST_START_MAX_DAYS = 3;
const DAY_MS = 86_400_000;

/** What the rule reads of a stored test (mg N/L). */
export interface StartReading {
  takenAt: string;
  tanMgN: number | null;
  no2MgN: number | null;
  no3MgN: number | null;
  ph?: number | null;
  temperatureC?: number | null;
}

export interface EvidenceTank {
  ph: number;
  temperatureC: number;
  livestock: readonly { count: number }[];
  /** newest first; any test at all means the tank has a history */
  readings: readonly (StartReading | null)[];
  history?: TankHistory | null;
  fit?: Pick<TankFit, 'fittedAt' | 'capacities'> | null;
}

export interface StartEvidence {
  start: Start;
  /** the day-0 water from the test (only the values it has) */
  initialWater: { tanMgN?: number; no2MgN?: number; no3MgN?: number };
  /** the wire summary (shared/schemas/start-state.ts) the start line is worded from */
  state: StartState;
}

const hasNitrogen = (r: StartReading) => r.tanMgN !== null || r.no2MgN !== null || r.no3MgN !== null;

/** Whole days from a date (YYYY-MM-DD, UTC) to another, positive when `later` is after `earlier`. */
function daysBetween(earlier: string, later: string): number {
  return Math.round((Date.parse(`${later}T00:00:00Z`) - Date.parse(`${earlier}T00:00:00Z`)) / DAY_MS);
}

/** The latest test up to the end of the start date, and whether it is recent enough to start from. */
export function startTest(readings: EvidenceTank['readings'], startDate: string): StartTest | null {
  const dayZero = Date.parse(`${startDate}T00:00:00Z`);
  let best: StartReading | null = null;
  for (const r of readings) {
    if (!r || !hasNitrogen(r)) continue;
    const t = Date.parse(r.takenAt);
    if (t >= dayZero + DAY_MS) continue; // after the start day: the plan's own history, not its start
    if (!best || t > Date.parse(best.takenAt)) best = r;
  }
  if (!best) return null;
  const daysBefore = Math.max(0, (dayZero - Date.parse(best.takenAt)) / DAY_MS);
  return { takenAt: best.takenAt, tanMgN: best.tanMgN, no2MgN: best.no2MgN, no3MgN: best.no3MgN, daysBefore, used: daysBefore <= TEST_START_MAX_DAYS };
}

/**
 * The default when nothing else is known: with fish the tank has been running and its
 * nitrifiers match its present load ("mature"); with no fish it is new. An empty tank with a
 * test history is still started new: nothing says what fed its biofilter.
 */
export function startFor(tank: Pick<EvidenceTank, 'livestock' | 'readings'>): { start: Start; startReason: StartReason } {
  const fish = tank.livestock.reduce((n, l) => n + l.count, 0);
  if (fish > 0) return { start: { kind: 'mature' }, startReason: 'mature-present-load' };
  return { start: { kind: 'new' }, startReason: tank.readings.length > 0 ? 'new-no-fish' : 'new-unseeded' };
}

/** The nitrifiers as the keeper describes the tank's past. */
function describedStart(history: TankHistory, startDate: string | null): { start: Start; reason: StartReason } {
  switch (history.kind) {
    case 'settled':
      return { start: { kind: 'mature' }, reason: 'described-settled' };
    case 'new':
      return { start: { kind: 'new' }, reason: 'described-new' };
    case 'seeded':
      return { start: { kind: 'seeded', share: history.sharePercent / 100 }, reason: 'described-seeded' };
    case 'emptied': {
      // Without a day 0 (a check of the events only) the filter is taken as it was on its last mature day.
      const starvedDays = startDate === null ? 0 : Math.max(0, daysBetween(history.matureUntil, startDate));
      const formerFish = history.formerFish.map((f) => ({ species: f.speciesId, count: f.count }));
      // Fish back in at day 0 (a restock) leave the starved days as they were: the filter had none then.
      return { start: { kind: 'starved', formerFish, starvedDays }, reason: 'described-emptied' };
    }
  }
}

/** A settled tank reads no ammonia or nitrite on a kit: a test at or above half a limit says otherwise. */
function contradictsSettled(test: StartReading, tank: EvidenceTank): boolean {
  const judged = judgeWaterTest({ tanMgN: test.tanMgN, no2MgN: test.no2MgN, ph: test.ph ?? null, temperatureC: test.temperatureC ?? null }, tank).judged;
  return judged.some((j) => j.level !== 'ok');
}

/**
 * The start of a forecast of `tank` whose day 0 is `startDate` (YYYY-MM-DD): see the file
 * comment for the order. `zones` are the tank's zones now (a fit on other zones is not used).
 * With `use` 'description' (or no start date) no test or fit is read: the keeper's account or
 * the default alone, as the prior a new fit starts from.
 */
export function startEvidence(tank: EvidenceTank, zones: readonly Pick<Zone, 'id'>[], startDate: string | null, use: 'all' | 'description' = 'all'): StartEvidence {
  const warnings: StartWarning[] = [];
  const evidence = use === 'all' && startDate !== null;
  const test = evidence ? startTest(tank.readings, startDate) : null;

  let chosen: { start: Start; reason: StartReason };
  let fitUsed: string | null = null;
  const ids = new Set(zones.map((z) => z.id));
  const fit = evidence ? (tank.fit ?? null) : null;
  // The fitted zones must be the tank's zones now: a zone left out of an explicit start would hold no nitrifiers at all.
  const fitted = new Set(fit?.capacities.map((c) => c.zoneId) ?? []);
  if (fit && fitted.size === ids.size && [...ids].every((id) => fitted.has(id))) {
    chosen = { start: { kind: 'explicit', capacities: fit.capacities.map((c) => ({ zoneId: c.zoneId, aoMgNPerDay: c.aoMgNPerDay, noMgNPerDay: c.noMgNPerDay })) }, reason: 'fitted' };
    fitUsed = fit.fittedAt;
  } else {
    if (fit) warnings.push({ kind: 'fit-other-zones', fittedAt: fit.fittedAt });
    if (tank.history) chosen = describedStart(tank.history, startDate);
    else {
      const byDefault = startFor(tank);
      chosen = { start: byDefault.start, reason: byDefault.startReason };
    }
  }

  const initialWater: StartEvidence['initialWater'] = {};
  if (test?.used) {
    if (test.tanMgN !== null) initialWater.tanMgN = test.tanMgN;
    if (test.no2MgN !== null) initialWater.no2MgN = test.no2MgN;
    if (test.no3MgN !== null) initialWater.no3MgN = test.no3MgN;
  } else if (test) {
    warnings.push({ kind: 'test-old', takenAt: test.takenAt, daysBefore: Math.round(test.daysBefore) });
  }
  const settled = chosen.reason === 'mature-present-load' || chosen.reason === 'described-settled';
  const latest = tank.readings.find((r): r is StartReading => r !== null && hasNitrogen(r) && r.takenAt === test?.takenAt);
  if (test?.used && latest && settled && contradictsSettled(latest, tank)) {
    warnings.push({ kind: 'test-contradicts-settled', takenAt: test.takenAt, tanMgN: test.tanMgN, no2MgN: test.no2MgN });
  }
  return {
    start: chosen.start,
    initialWater,
    state: {
      reason: chosen.reason,
      startDate,
      test,
      fittedAt: fitUsed,
      history: tank.history ?? null,
      warnings,
    },
  };
}
