import type { DataSource } from 'typeorm';
import type { Db } from '../data-source.js';
import type { LivestockCreateInput, LivestockPatchInput } from '../../shared/schemas/tank.js';
import { findSpecies } from '../../simulation/catalogue.js';
import { Livestock } from '../entities/livestock.js';
import { validationFailed } from '../errors.js';

/** Adds animals to a tank the caller has already checked they own. */
export async function addLivestock(ds: Db, tankId: string, input: LivestockCreateInput): Promise<Livestock> {
  if (input.speciesId !== undefined && !findSpecies(input.speciesId)) {
    throw validationFailed({ speciesId: 'This species is not in the catalogue. Choose one from the list, or add a custom fish.' });
  }
  const repo = ds.getRepository(Livestock);
  return repo.save(
    repo.create({
      tankId,
      speciesId: input.speciesId ?? null,
      customName: input.customName ?? null,
      count: input.count,
      lengthCm: input.lengthCm ?? null,
    }),
  );
}

/** A livestock row only when it sits in a tank `ownerId` owns. */
export async function findOwnLivestock(ds: DataSource, ownerId: string, tankId: string, livestockId: string): Promise<Livestock | null> {
  return ds
    .getRepository(Livestock)
    .createQueryBuilder('l')
    .innerJoin('l.tank', 't')
    .where('l.id = :livestockId AND l.tank_id = :tankId AND t.owner_id = :ownerId', { livestockId, tankId, ownerId })
    .getOne();
}

export async function updateLivestock(ds: DataSource, item: Livestock, patch: LivestockPatchInput): Promise<Livestock> {
  if (patch.count !== undefined) item.count = patch.count;
  if (patch.lengthCm !== undefined) item.lengthCm = patch.lengthCm;
  return ds.getRepository(Livestock).save(item);
}

export async function removeLivestock(ds: DataSource, item: Livestock): Promise<void> {
  await ds.getRepository(Livestock).delete({ id: item.id });
}
