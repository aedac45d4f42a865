import { Column, CreateDateColumn, Entity, PrimaryGeneratedColumn } from 'typeorm';

/**
 * One failed sign-in, kept in PostgreSQL (not in process memory) so every server process over
 * the same database sees the same count. Rows older than a day are pruned.
 */
@Entity({ name: 'sign_in_failures' })
export class SignInFailure {
  @PrimaryGeneratedColumn('uuid')
  id: string;

  /** The lower-cased e-mail tried, whether or not an account has it. */
  @Column({ type: 'varchar', length: 254 })
  email: string;

  @Column({ type: 'varchar', length: 64 })
  address: string;

  @CreateDateColumn({ type: 'timestamptz', name: 'created_at' })
  createdAt: Date;
}
