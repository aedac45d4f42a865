import { Column, Entity, JoinColumn, ManyToOne, PrimaryGeneratedColumn, type Relation } from 'typeorm';
import type { TankFit as TankFitShape } from '../../shared/schemas/tank-history.js';
import { Tank } from './tank.js';

/**
 * A fit of the model to a tank's tests (server/services/tank-fits.ts): per tank at most one
 * offered (the latest run, `appliedAt` null) and one applied (what forecasts start from).
 */
@Entity({ name: 'tank_fits' })
export class TankFit {
  @PrimaryGeneratedColumn('uuid')
  id: string;

  @Column({ type: 'uuid', name: 'tank_id' })
  tankId: string;

  @ManyToOne(() => Tank, { onDelete: 'CASCADE' })
  @JoinColumn({ name: 'tank_id' })
  tank?: Relation<Tank>;

  @Column({ type: 'timestamptz', name: 'fitted_at' })
  fittedAt: Date;

  @Column({ type: 'timestamptz', name: 'applied_at', nullable: true })
  appliedAt: Date | null;

  @Column({ type: 'timestamptz', name: 'last_reading_at' })
  lastReadingAt: Date;

  @Column({ type: 'integer', name: 'readings_used' })
  readingsUsed: number;

  @Column({ type: 'varchar', length: 8 })
  verdict: TankFitShape['verdict'];

  /** per zone, mg N/day at the tank temperature, at the last test used */
  @Column({ type: 'jsonb' })
  capacities: TankFitShape['capacities'];
}
