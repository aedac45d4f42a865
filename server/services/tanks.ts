import type { DataSource } from 'typeorm';
import { TANK_DETAIL_READING_LIMIT } from '../../shared/schemas/tank.js';
import { Livestock } from '../entities/livestock.js';
import { Plan } from '../entities/plan.js';
import { Reading } from '../entities/reading.js';
import { Tank } from '../entities/tank.js';

export interface TankSummaryRow {
  tank: Tank;
  fishCount: number;
  speciesCount: number;
  latestReading: Reading | null;
  activePlan: Plan | null;
}

export interface TankDetailRows {
  tank: Tank;
  livestock: Livestock[];
  readings: Reading[];
  plans: Plan[];
}

/** The keeper's own tanks by name, with the counts and latest items the home screen shows. */
export async function listOwnTanks(ds: DataSource, ownerId: string): Promise<TankSummaryRow[]> {
  const tanks = await ds.getRepository(Tank).find({ where: { ownerId }, order: { name: 'ASC', createdAt: 'ASC' } });
  if (tanks.length === 0) return [];
  const ids = tanks.map((t) => t.id);

  const counts: { tank_id: string; fish: string; species: string }[] = await ds.query(
    `SELECT tank_id, coalesce(sum(count), 0) AS fish,
            count(DISTINCT coalesce(species_id, 'custom:' || lower(custom_name))) AS species
       FROM livestock WHERE tank_id = ANY($1::uuid[]) GROUP BY tank_id`,
    [ids],
  );
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

  const countBy = new Map(counts.map((c) => [c.tank_id, c]));
  const latestBy = new Map(latest.map((r) => [r.tankId, r]));
  const activeBy = new Map(active.map((p) => [p.tankId, p]));
  return tanks.map((tank) => ({
    tank,
    fishCount: Number(countBy.get(tank.id)?.fish ?? 0),
    speciesCount: Number(countBy.get(tank.id)?.species ?? 0),
    latestReading: latestBy.get(tank.id) ?? null,
    activePlan: activeBy.get(tank.id) ?? null,
  }));
}

/** The tank with its livestock, newest readings and plans — only when `ownerId` owns it. */
export async function getOwnTank(ds: DataSource, ownerId: string, tankId: string): Promise<TankDetailRows | null> {
  const tank = await ds.getRepository(Tank).findOneBy({ id: tankId, ownerId });
  if (!tank) return null;
  const [livestock, readings, plans] = await Promise.all([
    ds.getRepository(Livestock).find({ where: { tankId }, order: { createdAt: 'ASC' } }),
    ds.getRepository(Reading).find({ where: { tankId }, order: { takenAt: 'DESC' }, take: TANK_DETAIL_READING_LIMIT }),
    ds.getRepository(Plan).find({ where: { tankId }, order: { startDate: 'DESC', createdAt: 'DESC' } }),
  ]);
  return { tank, livestock, readings, plans };
}
