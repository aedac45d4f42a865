import { Column, CreateDateColumn, Entity, PrimaryGeneratedColumn } from 'typeorm';
import type { SharedItemType } from '../../shared/schemas/club.js';

/** One of a member's tanks or plans, shared with a club's mentors and organizers. */
@Entity({ name: 'club_shares' })
export class ClubShare {
  @PrimaryGeneratedColumn('uuid')
  id: string;

  @Column({ type: 'uuid', name: 'club_id' })
  clubId: string;

  @Column({ type: 'uuid', name: 'owner_id' })
  ownerId: string;

  @Column({ type: 'varchar', length: 8, name: 'item_type' })
  itemType: SharedItemType;

  @Column({ type: 'uuid', name: 'item_id' })
  itemId: string;

  @CreateDateColumn({ type: 'timestamptz', name: 'created_at' })
  createdAt: Date;
}
