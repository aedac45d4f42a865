/**
 * Turns a scenario's events into ordered breakpoints (the ends of integration segments),
 * expanding repeated doses and adding the ends of medication and aeration loss. Checks what
 * the schema cannot: known species, removals that do not exceed the fish present, events
 * inside the horizon. Errors are ScenarioErrors naming the field.
 */
import { ScenarioError, type DoseAmount, type FishGroup, type Scenario, type ScenarioEvent } from './scenario';
import { fishMassG } from './bioload';
import { findSpecies, fishGroupName } from './catalogue';
import { ammoniaSolutionToMgNPerL, ammoniumChlorideToMgNPerL } from './dosing';
import type { Parameters } from './parameters';

export type TimelineAction =
  | { kind: 'event'; index: number; event: ScenarioEvent }
  /** One of the tank's routine water changes (scenario.tank.routineWaterChange); index −1. */
  | { kind: 'routine'; index: -1; event: Extract<ScenarioEvent, { type: 'water-change' }> }
  | { kind: 'end-medication'; index: number }
  | { kind: 'end-aeration-loss'; index: number };

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

interface Group {
  key: string;
  massG: number;
  count: number;
}

function groupKey(f: { species?: string; name?: string }): string {
  return f.species ?? f.name ?? '';
}

function massOf(f: FishGroup, path: string, b: number): number {
  if (f.species !== undefined && !findSpecies(f.species)) {
    throw new ScenarioError({ [`${path}.species`]: `"${f.species}" is not in the species list: pick a species from the list, or give the fish a name of your own and its length.` });
  }
  return fishMassG(f, b);
}

function removeFrom(groups: Group[], fish: { species?: string; name?: string }, count: number, path: string): void {
  const key = groupKey(fish);
  const available = groups.filter((g) => g.key === key).reduce((s, g) => s + g.count, 0);
  if (available < count) {
    throw new ScenarioError({ [`${path}.count`]: `Only ${available} ${fishGroupName(fish)} in the tank at that time; cannot take out ${count}.` });
  }
  let left = count;
  for (const g of groups) {
    if (g.key !== key || left === 0) continue;
    const take = Math.min(g.count, left);
    g.count -= take;
    left -= take;
  }
}

const totalMass = (groups: Group[]) => groups.reduce((s, g) => s + g.count * g.massG, 0);

export function buildTimeline(scenario: Scenario, horizonDays: number, p: Parameters): Timeline {
  const groups: Group[] = scenario.fish.map((f, i) => ({ key: groupKey(f), massG: massOf(f, `fish.${i}`, p.lengthWeightB), count: f.count }));
  const initialFishMassG = totalMass(groups);

  const raw: { time: number; order: number; action: TimelineAction }[] = [];
  scenario.events.forEach((event, index) => {
    if (event.day > horizonDays) {
      throw new ScenarioError({ [`events.${index}.day`]: `Day ${event.day} is after the forecast horizon (${horizonDays}).` });
    }
    if (event.type === 'ammonia-dose') {
      const every = event.repeatEveryDays;
      const times = every === undefined ? 1 : (event.repeatCount ?? Math.floor((horizonDays - event.day) / every) + 1);
      if (event.repeatCount !== undefined && every === undefined && event.repeatCount > 1) {
        throw new ScenarioError({ [`events.${index}.repeatEveryDays`]: 'A repeated dose needs the number of days between doses.' });
      }
      // Repeats past the horizon are outside the forecast and are dropped.
      for (let r = 0; r < times; r++) {
        const t = event.day + r * (every ?? 0);
        if (t > horizonDays + 1e-9) break;
        raw.push({ time: t, order: 2 * index + 1, action: { kind: 'event', index, event } });
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
      bp.fishMassG = totalMass(groups);
      continue;
    }
    const { event, index } = item.action;
    const path = `events.${index}`;
    if (event.type === 'add-fish' || (event.type === 'move-fish' && event.direction === 'in')) {
      groups.push({ key: groupKey(event.fish), massG: massOf(event.fish, `${path}.fish`, p.lengthWeightB), count: event.fish.count });
    } else if (event.type === 'move-fish') {
      massOf(event.fish, `${path}.fish`, p.lengthWeightB);
      removeFrom(groups, event.fish, event.fish.count, `${path}.fish`);
    } else if (event.type === 'remove-fish') {
      removeFrom(groups, event, event.count, path);
    }
    bp.fishMassG = totalMass(groups);
  }
  return { initialFishMassG, breakpoints };
}
