import type { LivestockItem } from '../../shared/schemas/tank.js';
import type { Livestock } from '../entities/livestock.js';

/** Animals in a tank as the API shows them. */
export function presentLivestock(l: Livestock): LivestockItem {
  return { id: l.id, speciesId: l.speciesId, customName: l.customName, count: l.count, lengthCm: l.lengthCm };
}
