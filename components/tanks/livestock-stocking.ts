/**
 * The crowding warning on the livestock form (pure): the tank's fish now plus the group being
 * added, judged by `stockingWarning` (simulation/stocking.ts).
 */
import type { LivestockItem } from '@/shared/schemas/tank';
import { fishFromLivestock } from '@/shared/tank-scenario';
import type { FishGroup } from '@/simulation/scenario';
import { groupsMassG, stockingWarning } from '@/simulation/stocking';

/** The tank's fish as engine groups; an animal without the size its mass needs is left out (the tank page asks for it). */
export function livestockFish(livestock: readonly LivestockItem[]): FishGroup[] {
  return livestock.flatMap((l) => {
    try {
      return fishFromLivestock([l]);
    } catch {
      return [];
    }
  });
}

/** The warning for adding `adding` to the tank's fish, or null. */
export function livestockStocking(volumeL: number, volumeText: string, livestock: readonly LivestockItem[], adding: FishGroup | null): string | null {
  if (!adding) return null;
  return stockingWarning(groupsMassG([...livestockFish(livestock), adding]), volumeL, volumeText);
}
