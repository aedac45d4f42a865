import { Column, CreateDateColumn, Entity, PrimaryGeneratedColumn } from 'typeorm';
import type { ShareableType } from '../../shared/schemas/share.js';

/** A read-only link to a plan or lesson. Only the SHA-256 of the 256-bit token is stored. */
@Entity({ name: 'share_links' })
export class ShareLink {
  @PrimaryGeneratedColumn('uuid')
  id: string;

  @Column({ type: 'char', length: 64, name: 'token_hash' })
  tokenHash: string;

  @Column({ type: 'varchar', length: 8, name: 'item_type' })
  itemType: ShareableType;

  @Column({ type: 'uuid', name: 'item_id' })
  itemId: string;

  @Column({ type: 'uuid', name: 'created_by' })
  createdBy: string;

  /** Every link expires (30 days unless its maker chose otherwise, at most a year). */
  @Column({ type: 'timestamptz', name: 'expires_at' })
  expiresAt: Date;

  @Column({ type: 'timestamptz', name: 'revoked_at', nullable: true })
  revokedAt: Date | null;

  @CreateDateColumn({ type: 'timestamptz', name: 'created_at' })
  createdAt: Date;
}
