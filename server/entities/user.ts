import { Column, CreateDateColumn, Entity, PrimaryGeneratedColumn, UpdateDateColumn } from 'typeorm';
import type { SiteRole } from '../../shared/schemas/auth.js';

@Entity({ name: 'users' })
export class User {
  @PrimaryGeneratedColumn('uuid')
  id: string;

  /** Stored lower-cased; the unique index is on this column. */
  @Column({ type: 'varchar', length: 254 })
  email: string;

  @Column({ type: 'varchar', length: 80, name: 'display_name' })
  displayName: string;

  @Column({ type: 'varchar', length: 100, name: 'password_hash' })
  passwordHash: string;

  @Column({ type: 'varchar', length: 16, default: 'user' })
  role: SiteRole;

  /** Sessions that began before this moment are refused. */
  @Column({ type: 'timestamptz', name: 'password_changed_at' })
  passwordChangedAt: Date;

  @CreateDateColumn({ type: 'timestamptz', name: 'created_at' })
  createdAt: Date;

  @UpdateDateColumn({ type: 'timestamptz', name: 'updated_at' })
  updatedAt: Date;
}
