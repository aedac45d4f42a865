import type { DataSource } from 'typeorm';
import { IsNull, Not } from 'typeorm';
import type { Db } from '../data-source.js';
import { TankFit } from '../entities/tank-fit.js';
import type { Tank } from '../entities/tank.js';
import { notFound } from '../errors.js';

/**
 * A tank's fits to its own tests, in PostgreSQL: a fit run is kept as the tank's offered fit
 * (replacing the one before); applying it makes it the tank's applied fit (replacing the one
 * before), which every later forecast starts from (shared/tank-start.ts). Partial unique
 * indexes keep one of each per tank.
 */

export interface FitToKeep {
  lastReadingAt: Date;
  readingsUsed: number;
  verdict: TankFit['verdict'];
  capacities: TankFit['capacities'];
}

/** Keeps a fit just run as the tank's offered one. */
export async function keepOfferedFit(db: Db, tank: Tank, fit: FitToKeep, now = new Date()): Promise<TankFit> {
  return db.transaction(async (m) => {
    const repo = m.getRepository(TankFit);
    await repo.delete({ tankId: tank.id, appliedAt: IsNull() });
    return repo.save(repo.create({ tankId: tank.id, fittedAt: now, appliedAt: null, ...fit }));
  });
}

/** The applied fit of a tank, if any. */
export function appliedFit(db: Db, tankId: string): Promise<TankFit | null> {
  return db.getRepository(TankFit).findOneBy({ tankId, appliedAt: Not(IsNull()) });
}

/** Applies the tank's offered fit `fitId` (replacing any applied one); 404 when it is not this tank's offered fit. */
export async function applyFit(db: Db, tank: Tank, fitId: string, now = new Date()): Promise<TankFit> {
  return db.transaction(async (m) => {
    const repo = m.getRepository(TankFit);
    const offered = await repo.findOne({ where: { id: fitId, tankId: tank.id, appliedAt: IsNull() }, lock: { mode: 'pessimistic_write' } });
    if (!offered) throw notFound('No such fit to apply on this tank: run the fit again.');
    await repo.delete({ tankId: tank.id, appliedAt: Not(IsNull()) });
    offered.appliedAt = now;
    return repo.save(offered);
  });
}

/** Stops using the applied fit; forecasts start from the tests and the description again. */
export async function clearAppliedFit(ds: DataSource, tank: Tank): Promise<boolean> {
  const result = await ds.getRepository(TankFit).delete({ tankId: tank.id, appliedAt: Not(IsNull()) });
  return (result.affected ?? 0) > 0;
}
