import { Column, CreateDateColumn, Entity, JoinColumn, ManyToOne, PrimaryGeneratedColumn, UpdateDateColumn, type Relation } from 'typeorm';
import type { PlanEvent, PlanStatus } from '../../shared/schemas/tank.js';
import { Tank } from './tank.js';

/**
 * A change plan: a timeline of events (days counted from `startDate`). Its life is draft →
 * active (running, from `startedAt`) → done (`finishedAt`); the rules are in services/plans.ts.
 */
@Entity({ name: 'plans' })
export class Plan {
  @PrimaryGeneratedColumn('uuid')
  id: string;

  @Column({ type: 'uuid', name: 'tank_id' })
  tankId: string;

  @ManyToOne(() => Tank, { onDelete: 'CASCADE' })
  @JoinColumn({ name: 'tank_id' })
  tank?: Relation<Tank>;

  @Column({ type: 'varchar', length: 80 })
  name: string;

  /** Calendar date (YYYY-MM-DD); PostgreSQL `date` comes back as a string. */
  @Column({ type: 'date', name: 'start_date' })
  startDate: string;

  @Column({ type: 'varchar', length: 16, default: 'draft' })
  status: PlanStatus;

  /** When the keeper started it (day 0 is `startDate`); null while a draft. */
  @Column({ type: 'timestamptz', name: 'started_at', nullable: true })
  startedAt: Date | null;

  /** When the keeper marked it done; null until then. */
  @Column({ type: 'timestamptz', name: 'finished_at', nullable: true })
  finishedAt: Date | null;

  @Column({ type: 'jsonb', default: () => "'[]'::jsonb" })
  events: PlanEvent[];

  @CreateDateColumn({ type: 'timestamptz', name: 'created_at' })
  createdAt: Date;

  @UpdateDateColumn({ type: 'timestamptz', name: 'updated_at' })
  updatedAt: Date;
}
