import { Column, CreateDateColumn, Entity, JoinColumn, ManyToOne, PrimaryGeneratedColumn, UpdateDateColumn, type Relation } from 'typeorm';
import type { TankSetup } from '../../shared/schemas/tank.js';
import type { TankHistory } from '../../shared/schemas/tank-history.js';
import { User } from './user.js';

/** A keeper's tank. Tap-water nitrogen is stored as mg N per litre. */
@Entity({ name: 'tanks' })
export class Tank {
  @PrimaryGeneratedColumn('uuid')
  id: string;

  @Column({ type: 'uuid', name: 'owner_id' })
  ownerId: string;

  @ManyToOne(() => User, { onDelete: 'CASCADE' })
  @JoinColumn({ name: 'owner_id' })
  owner?: Relation<User>;

  @Column({ type: 'varchar', length: 80 })
  name: string;

  @Column({ type: 'double precision', name: 'volume_l' })
  volumeL: number;

  @Column({ type: 'double precision', name: 'temperature_c' })
  temperatureC: number;

  @Column({ type: 'double precision' })
  ph: number;

  @Column({ type: 'double precision', name: 'kh_dkh', nullable: true })
  khDkh: number | null;

  @Column({ type: 'double precision', name: 'tap_tan_mg_n', default: 0 })
  tapTanMgN: number;

  @Column({ type: 'double precision', name: 'tap_no2_mg_n', default: 0 })
  tapNo2MgN: number;

  @Column({ type: 'double precision', name: 'tap_no3_mg_n', default: 0 })
  tapNo3MgN: number;

  @Column({ type: 'jsonb', default: () => "'{}'::jsonb" })
  setup: TankSetup;

  @Column({ type: 'text', default: '' })
  notes: string;

  /** The keeper's account of the tank's past (shared/schemas/tank-history.ts); null: not given. */
  @Column({ type: 'jsonb', nullable: true })
  history: TankHistory | null;

  @CreateDateColumn({ type: 'timestamptz', name: 'created_at' })
  createdAt: Date;

  @UpdateDateColumn({ type: 'timestamptz', name: 'updated_at' })
  updatedAt: Date;
}
