import { Column, CreateDateColumn, Entity, JoinColumn, ManyToOne, PrimaryGeneratedColumn, UpdateDateColumn, type Relation } from 'typeorm';
import type { ReadingBasis } from '../../shared/schemas/tank.js';
import { Tank } from './tank.js';

/**
 * One water test. Nitrogen values are always stored as mg N/L whatever the kit reported;
 * `basis` records what the kit showed, so the app can display it the same way.
 */
@Entity({ name: 'readings' })
export class Reading {
  @PrimaryGeneratedColumn('uuid')
  id: string;

  @Column({ type: 'uuid', name: 'tank_id' })
  tankId: string;

  @ManyToOne(() => Tank, { onDelete: 'CASCADE' })
  @JoinColumn({ name: 'tank_id' })
  tank?: Relation<Tank>;

  @Column({ type: 'timestamptz', name: 'taken_at' })
  takenAt: Date;

  @Column({ type: 'double precision', name: 'tan_mg_n', nullable: true })
  tanMgN: number | null;

  @Column({ type: 'double precision', name: 'no2_mg_n', nullable: true })
  no2MgN: number | null;

  @Column({ type: 'double precision', name: 'no3_mg_n', nullable: true })
  no3MgN: number | null;

  @Column({ type: 'double precision', nullable: true })
  ph: number | null;

  @Column({ type: 'double precision', name: 'temperature_c', nullable: true })
  temperatureC: number | null;

  @Column({ type: 'double precision', name: 'kh_dkh', nullable: true })
  khDkh: number | null;

  @Column({ type: 'varchar', length: 8, default: 'N' })
  basis: ReadingBasis;

  @Column({ type: 'varchar', length: 200, default: '' })
  note: string;

  @CreateDateColumn({ type: 'timestamptz', name: 'created_at' })
  createdAt: Date;

  @UpdateDateColumn({ type: 'timestamptz', name: 'updated_at' })
  updatedAt: Date;
}
