import type { DataSource } from 'typeorm';
import { independentQueries, type Db } from '../data-source.js';
import { TANK_DEFAULTS, TANK_DETAIL_READING_LIMIT, defaultSetup, type TankCreateInput, type TankPatchInput } from '../../shared/schemas/tank.js';
import { Livestock } from '../entities/livestock.js';
import { Plan } from '../entities/plan.js';
import { Reading } from '../entities/reading.js';
import { Tank } from '../entities/tank.js';
import type { TankFit } from '../entities/tank-fit.js';
import { appliedFit } from './tank-fits.js';
import { findSpecies } from '../../simulation/catalogue.js';
import { stockCounts } from '../../shared/stock-counts.js';

export interface TankSummaryRow {
  tank: Tank;
  fishCount: number;
  invertebrateCount: number;
  speciesCount: number;
  latestReading: Reading | null;
  activePlan: Plan | null;
}

export interface TankDetailRows {
  tank: Tank;
  livestock: Livestock[];
  readings: Reading[];
  plans: Plan[];
  /** the applied fit (absent where a view does not show it, e.g. a shared tank) */
  fit?: TankFit | null;
}

/** The keeper's own tanks by name, with the counts and latest items the home screen shows. */
export async function listOwnTanks(ds: DataSource, ownerId: string): Promise<TankSummaryRow[]> {
  const tanks = await ds.getRepository(Tank).find({ where: { ownerId }, order: { name: 'ASC', createdAt: 'ASC' } });
  if (tanks.length === 0) return [];
  const ids = tanks.map((t) => t.id);

  // Per kind of animal (shared/stock-counts.ts `stockKind`), so catalogue shrimp and snails are told apart from fish (the catalogue
  // lives in the engine, not the database).
  const groups: { tank_id: string; kind: string; animals: string }[] = await ds.query(
    `SELECT tank_id, coalesce(species_id, 'custom:' || lower(custom_name)) AS kind, sum(count) AS animals
       FROM livestock WHERE tank_id = ANY($1::uuid[]) GROUP BY tank_id, kind`,
    [ids],
  );
  const groupsBy = new Map<string, { kind: string; animals: number }[]>();
  for (const g of groups) groupsBy.set(g.tank_id, [...(groupsBy.get(g.tank_id) ?? []), { kind: g.kind, animals: Number(g.animals) }]);
  const counts = new Map([...groupsBy].map(([tankId, kinds]) => [tankId, stockCounts(kinds)]));
  const latest = await ds
    .getRepository(Reading)
    .createQueryBuilder('r')
    .distinctOn(['r.tank_id'])
    .where('r.tank_id IN (:...ids)', { ids })
    .orderBy('r.tank_id')
    .addOrderBy('r.taken_at', 'DESC')
    .getMany();
  const active = await ds
    .getRepository(Plan)
    .createQueryBuilder('p')
    .distinctOn(['p.tank_id'])
    .where('p.tank_id IN (:...ids)', { ids })
    .andWhere(`p.status = 'active'`)
    .orderBy('p.tank_id')
    .addOrderBy('p.start_date', 'DESC')
    .getMany();

  const latestBy = new Map(latest.map((r) => [r.tankId, r]));
  const activeBy = new Map(active.map((p) => [p.tankId, p]));
  return tanks.map((tank) => ({
    tank,
    fishCount: counts.get(tank.id)?.fish ?? 0,
    invertebrateCount: counts.get(tank.id)?.invertebrates ?? 0,
    speciesCount: counts.get(tank.id)?.species ?? 0,
    latestReading: latestBy.get(tank.id) ?? null,
    activePlan: activeBy.get(tank.id) ?? null,
  }));
}

/** The tank with its livestock, newest readings and plans — only when `ownerId` owns it. */
export async function getOwnTank(ds: Db, ownerId: string, tankId: string): Promise<TankDetailRows | null> {
  const tank = await ds.getRepository(Tank).findOneBy({ id: tankId, ownerId });
  if (!tank) return null;
  const [livestock, readings, plans, fit] = await independentQueries(
    ds,
    () => ds.getRepository(Livestock).find({ where: { tankId }, order: { createdAt: 'ASC' } }),
    () => ds.getRepository(Reading).find({ where: { tankId }, order: { takenAt: 'DESC' }, take: TANK_DETAIL_READING_LIMIT }),
    () => ds.getRepository(Plan).find({ where: { tankId }, order: { startDate: 'DESC', createdAt: 'DESC' } }),
    () => appliedFit(ds, tankId),
  );
  return { tank, livestock, readings, plans, fit };
}

/** Creates a tank for `ownerId`; anything not given takes the newcomer defaults (TANK_DEFAULTS). */
export async function createOwnTank(ds: Db, ownerId: string, input: TankCreateInput): Promise<Tank> {
  const repo = ds.getRepository(Tank);
  return repo.save(
    repo.create({
      ownerId,
      name: input.name,
      volumeL: input.volumeL,
      temperatureC: input.temperatureC ?? TANK_DEFAULTS.temperatureC,
      ph: input.ph ?? TANK_DEFAULTS.ph,
      khDkh: input.khDkh ?? null,
      tapTanMgN: input.tapWater?.tanMgN ?? 0,
      tapNo2MgN: input.tapWater?.no2MgN ?? 0,
      tapNo3MgN: input.tapWater?.no3MgN ?? 0,
      setup: input.setup ?? defaultSetup(input.volumeL, input.filterKind),
      notes: input.notes ?? '',
      history: input.history ?? null,
    }),
  );
}

/** Applies a patch to the owner's tank; null when the tank is not theirs. One UPDATE, so nothing is half-saved. */
export async function updateOwnTank(ds: DataSource, ownerId: string, tankId: string, patch: TankPatchInput): Promise<Tank | null> {
  const repo = ds.getRepository(Tank);
  const tank = await repo.findOneBy({ id: tankId, ownerId });
  if (!tank) return null;
  if (patch.name !== undefined) tank.name = patch.name;
  if (patch.volumeL !== undefined) tank.volumeL = patch.volumeL;
  if (patch.temperatureC !== undefined) tank.temperatureC = patch.temperatureC;
  if (patch.ph !== undefined) tank.ph = patch.ph;
  if (patch.khDkh !== undefined) tank.khDkh = patch.khDkh;
  if (patch.tapWater !== undefined) {
    tank.tapTanMgN = patch.tapWater.tanMgN;
    tank.tapNo2MgN = patch.tapWater.no2MgN;
    tank.tapNo3MgN = patch.tapWater.no3MgN;
  }
  if (patch.setup !== undefined) tank.setup = patch.setup;
  if (patch.notes !== undefined) tank.notes = patch.notes;
  if (patch.history !== undefined) tank.history = patch.history;
  return repo.save(tank);
}

/** Deletes the owner's tank (livestock, readings and plans go with it: ON DELETE CASCADE). */
export async function deleteOwnTank(ds: DataSource, ownerId: string, tankId: string): Promise<boolean> {
  const result = await ds.getRepository(Tank).delete({ id: tankId, ownerId });
  return (result.affected ?? 0) > 0;
}

/** The tank itself when `ownerId` owns it (for routes nested under a tank). */
export async function findOwnTank(ds: DataSource, ownerId: string, tankId: string): Promise<Tank | null> {
  return ds.getRepository(Tank).findOneBy({ id: tankId, ownerId });
}
