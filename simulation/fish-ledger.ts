/**
 * The fish in a tank as events add and take them: groups keyed by species (or the keeper's
 * name for a custom fish), each with the mass of one animal. The timeline replays a scenario
 * through it; the stocking check replays a plan up to a day.
 */
import { fishMassG } from './bioload';
import type { FishGroup } from './scenario';

interface Group {
  key: string;
  massG: number;
  count: number;
}

/** The key a removal matches: the catalogue id, else the keeper's name. */
export function fishKey(f: { species?: string; name?: string }): string {
  return f.species ?? f.name ?? '';
}

export class FishLedger {
  private readonly groups: Group[] = [];

  constructor(private readonly lengthWeightB: number) {}

  /** Adds a group; `massG` is one animal's mass when the caller has already worked it out. */
  add(f: FishGroup, massG = fishMassG(f, this.lengthWeightB)): void {
    this.groups.push({ key: fishKey(f), massG, count: f.count });
  }

  /** How many animals with this key are in the tank. */
  available(key: string): number {
    return this.groups.filter((g) => g.key === key).reduce((s, g) => s + g.count, 0);
  }

  /** Takes up to `count` animals with this key out (oldest groups first); returns how many were taken. */
  remove(key: string, count: number): number {
    let left = count;
    for (const g of this.groups) {
      if (g.key !== key || left === 0) continue;
      const take = Math.min(g.count, left);
      g.count -= take;
      left -= take;
    }
    return count - left;
  }

  /** Total fish mass, g. */
  massG(): number {
    return this.groups.reduce((s, g) => s + g.count * g.massG, 0);
  }
}
