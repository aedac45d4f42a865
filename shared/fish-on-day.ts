/**
 * fishOnDay(startCount, events, day): how many animals a plan has in the tank on a day — those
 * at the start, with its additions and moves in, less its rehomings and moves out up to that
 * day. Pure; the dose form (its fish-present caution) and the plan's cautions both use it.
 */
import type { ScenarioEvent } from '../simulation/scenario';

export function fishOnDay(startCount: number, events: readonly ScenarioEvent[], day: number): number {
  let n = startCount;
  for (const e of events) {
    if (e.day > day) continue;
    const count = e.type === 'add-fish' || e.type === 'move-fish' || e.type === 'remove-fish' ? e.fish.reduce((sum, g) => sum + g.count, 0) : 0;
    if (e.type === 'add-fish') n += count;
    else if (e.type === 'move-fish') n += e.direction === 'in' ? count : -count;
    else if (e.type === 'remove-fish') n -= count;
  }
  return Math.max(0, n);
}

/** Whether any ammonia dose of the plan falls on a day with animals in the tank. */
export function dosesWithFish(startCount: number, events: readonly ScenarioEvent[]): boolean {
  return events.some((e) => e.type === 'ammonia-dose' && fishOnDay(startCount, events, e.day) > 0);
}
