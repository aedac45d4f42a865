/**
 * Turns a scenario's events into ordered breakpoints (the ends of integration segments),
 * expanding repeated and split doses and adding the ends of medication, aeration loss and
 * continuous doses. Checks what
 * the schema cannot: known species, removals that do not exceed the fish present, events
 * inside the horizon. Errors are ScenarioErrors naming the field.
 */
import { ScenarioError, type AmmoniaDoseEvent, type DoseAmount, type FishGroup, type Scenario, type ScenarioEvent } from './scenario';
import { fishMassG } from './bioload';
import { findSpecies, fishGroupName } from './catalogue';
import { FishLedger, fishKey } from './fish-ledger';
import { absurdStockingMessage, stockingLevel } from './stocking';
import { ammoniaSolutionToMgNPerL, ammoniumChlorideToMgNPerL } from './dosing';
import type { Parameters } from './parameters';

export type TimelineAction =
  | { kind: 'event'; index: number; event: ScenarioEvent }
  /** One of the tank's routine water changes (scenario.tank.routineWaterChange); index −1. */
  | { kind: 'routine'; index: -1; event: Extract<ScenarioEvent, { type: 'water-change' }> }
  | { kind: 'end-medication'; index: number }
  | { kind: 'end-aeration-loss'; index: number }
  /** The end of a continuous dose's flow (it started with the dose's own 'event' action). */
  | { kind: 'end-dose-flow'; index: number };

export interface Breakpoint {
  time: number;
  actions: TimelineAction[];
  /** Total fish mass (g) after this breakpoint's actions. */
  fishMassG: number;
}

export interface Timeline {
  initialFishMassG: number;
  breakpoints: Breakpoint[];
}

/** Dose of one dosing event in mg N/L for the tank volume. */
export function doseMgNPerL(amount: DoseAmount, volumeL: number): number {
  switch (amount.unit) {
    case 'mgN-per-L':
      return amount.value;
    case 'ammonium-chloride-g':
      return ammoniumChlorideToMgNPerL(amount.grams, volumeL);
    case 'ammonia-solution-mL':
      return ammoniaSolutionToMgNPerL(amount.mL, { percentNH3: amount.percentNH3, densityGPerMl: amount.densityGPerMl }, volumeL);
  }
}

/** Days from a dose's start to its last part (split) or the end of its flow (continuous); 0 at once. */
export function doseSpanDays(event: Pick<AmmoniaDoseEvent, 'delivery' | 'timesPerDay'>): number {
  if (event.delivery === 'continuous') return 1;
  const n = event.timesPerDay ?? 1;
  return (n - 1) / n;
}

/** One pulse of a dose (`end` absent) or one stretch of its steady flow, in days. */
export interface DosePart {
  start: number;
  end?: number;
}

/**
 * The pulses or flow stretches of a dose within the horizon (repeats past it are dropped):
 * per repeat `timesPerDay` pulses 1/n day apart, or a flow over the repeat's day. Daily flows
 * touch end to start, so they are one stretch (no breakpoint between days).
 */
export function doseParts(event: AmmoniaDoseEvent, horizonDays: number): DosePart[] {
  const every = event.repeatEveryDays;
  const times = every === undefined ? 1 : (event.repeatCount ?? Math.floor((horizonDays - event.day) / every + 1e-9) + 1);
  const parts: DosePart[] = [];
  const within = (t: number) => t <= horizonDays + 1e-9;
  if (event.delivery === 'continuous') {
    if (every !== undefined && Math.abs(every - 1) < 1e-9) {
      if (within(event.day)) parts.push({ start: event.day, end: event.day + times });
      return parts;
    }
    for (let r = 0; r < times; r++) {
      const t = event.day + r * (every ?? 0);
      if (!within(t)) break;
      parts.push({ start: t, end: t + 1 });
    }
    return parts;
  }
  const n = event.timesPerDay ?? 1;
  for (let r = 0; r < times; r++) {
    for (let j = 0; j < n; j++) {
      const t = event.day + r * (every ?? 0) + j / n;
      if (!within(t)) return parts;
      parts.push({ start: t });
    }
  }
  return parts;
}

function massOf(f: FishGroup, path: string, b: number): number {
  if (f.species !== undefined && !findSpecies(f.species)) {
    throw new ScenarioError({ [`${path}.species`]: `"${f.species}" is not in the species list: pick a species from the list, or give the fish a name of your own and its length.` });
  }
  return fishMassG(f, b);
}

function removeFrom(ledger: FishLedger, f: { species?: string; name?: string; count: number }, path: string): void {
  const key = fishKey(f);
  const available = ledger.available(key);
  if (available < f.count) {
    throw new ScenarioError({ [`${path}.count`]: `Only ${available} ${fishGroupName(f)} in the tank at that time; cannot take out ${f.count}.` });
  }
  ledger.remove(key, f.count);
}

/** Refuses fish that could not fit in the water at all (simulation/stocking.ts). */
function checkFits(ledger: FishLedger, volumeL: number, path: string): void {
  if (stockingLevel(ledger.massG(), volumeL).level === 'absurd') throw new ScenarioError({ [path]: absurdStockingMessage(ledger.massG(), volumeL) });
}

export function buildTimeline(scenario: Scenario, horizonDays: number, p: Parameters): Timeline {
  const ledger = new FishLedger(p.lengthWeightB);
  const V = scenario.tank.volumeL;
  scenario.fish.forEach((f, i) => ledger.add(f, massOf(f, `fish.${i}`, p.lengthWeightB)));
  if (scenario.fish.length > 0) checkFits(ledger, V, 'fish');
  const initialFishMassG = ledger.massG();

  const raw: { time: number; order: number; action: TimelineAction }[] = [];
  scenario.events.forEach((event, index) => {
    if (event.day > horizonDays) {
      throw new ScenarioError({ [`events.${index}.day`]: `Day ${event.day} is after the forecast horizon (${horizonDays}).` });
    }
    if (event.type === 'ammonia-dose') {
      if (event.repeatCount !== undefined && event.repeatEveryDays === undefined && event.repeatCount > 1) {
        throw new ScenarioError({ [`events.${index}.repeatEveryDays`]: 'A repeated dose needs the number of days between doses.' });
      }
      // Pulses and flow starts are the dose's own 'event' actions; events.ts gives each its share.
      for (const part of doseParts(event, horizonDays)) {
        raw.push({ time: part.start, order: 2 * index + 1, action: { kind: 'event', index, event } });
        if (part.end !== undefined && part.end <= horizonDays + 1e-9) raw.push({ time: part.end, order: 0, action: { kind: 'end-dose-flow', index } });
      }
      return;
    }
    raw.push({ time: event.day, order: 2 * index + 1, action: { kind: 'event', index, event } });
    if (event.type === 'medication' || event.type === 'aeration-loss') {
      const end = event.day + event.durationDays;
      const kind = event.type === 'medication' ? 'end-medication' : 'end-aeration-loss';
      // Ends sort before starts at the same time (order 2i < 2j+1 for any j).
      if (end <= horizonDays) raw.push({ time: end, order: 0, action: { kind, index } });
    }
  });
  // Routine water changes come after the same day's timeline events (order above every 2i+1).
  const routine = scenario.tank.routineWaterChange;
  if (routine) {
    for (let k = 1; k * routine.everyDays <= horizonDays + 1e-9; k++) {
      const t = k * routine.everyDays;
      raw.push({ time: t, order: Number.MAX_SAFE_INTEGER, action: { kind: 'routine', index: -1, event: { type: 'water-change', day: t, percent: routine.percent } } });
    }
  }
  raw.sort((a, b) => a.time - b.time || a.order - b.order);

  const breakpoints: Breakpoint[] = [];
  for (const item of raw) {
    let bp = breakpoints[breakpoints.length - 1];
    if (!bp || item.time - bp.time > 1e-9) {
      bp = { time: item.time, actions: [], fishMassG: 0 };
      breakpoints.push(bp);
    }
    bp.actions.push(item.action);
    if (item.action.kind !== 'event') {
      bp.fishMassG = ledger.massG();
      continue;
    }
    const { event, index } = item.action;
    const path = `events.${index}`;
    if (event.type === 'add-fish' || (event.type === 'move-fish' && event.direction === 'in')) {
      event.fish.forEach((f, g) => ledger.add(f, massOf(f, `${path}.fish.${g}`, p.lengthWeightB)));
      checkFits(ledger, V, `${path}.fish`);
    } else if (event.type === 'move-fish') {
      event.fish.forEach((f, g) => {
        massOf(f, `${path}.fish.${g}`, p.lengthWeightB);
        removeFrom(ledger, f, `${path}.fish.${g}`);
      });
    } else if (event.type === 'remove-fish') {
      event.fish.forEach((f, g) => removeFrom(ledger, f, `${path}.fish.${g}`));
    }
    bp.fishMassG = ledger.massG();
  }
  return { initialFishMassG, breakpoints };
}
