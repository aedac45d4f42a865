import { Column, Entity, JoinColumn, OneToOne, PrimaryColumn, UpdateDateColumn, type Relation } from 'typeorm';
import type { NitrogenBasis, TemperatureUnit, VolumeUnit } from '../../shared/schemas/preferences.js';
import { User } from './user.js';

/** A person's display units and reminder choice; no row means the defaults. */
@Entity({ name: 'user_preferences' })
export class UserPreferences {
  @PrimaryColumn({ type: 'uuid', name: 'user_id' })
  userId: string;

  @OneToOne(() => User, { onDelete: 'CASCADE' })
  @JoinColumn({ name: 'user_id' })
  user?: Relation<User>;

  @Column({ type: 'varchar', length: 8, name: 'volume_unit' })
  volumeUnit: VolumeUnit;

  @Column({ type: 'varchar', length: 8, name: 'temperature_unit' })
  temperatureUnit: TemperatureUnit;

  @Column({ type: 'varchar', length: 8, name: 'nitrogen_basis' })
  nitrogenBasis: NitrogenBasis;

  @Column({ type: 'boolean' })
  reminders: boolean;

  @UpdateDateColumn({ type: 'timestamptz', name: 'updated_at' })
  updatedAt: Date;
}
