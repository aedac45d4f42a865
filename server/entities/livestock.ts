import { Column, CreateDateColumn, Entity, JoinColumn, ManyToOne, PrimaryGeneratedColumn, UpdateDateColumn, type Relation } from 'typeorm';
import { Tank } from './tank.js';

/** A group of animals in a tank: a catalogue species, or a custom name. */
@Entity({ name: 'livestock' })
export class Livestock {
  @PrimaryGeneratedColumn('uuid')
  id: string;

  @Column({ type: 'uuid', name: 'tank_id' })
  tankId: string;

  @ManyToOne(() => Tank, { onDelete: 'CASCADE' })
  @JoinColumn({ name: 'tank_id' })
  tank?: Relation<Tank>;

  @Column({ type: 'varchar', length: 64, name: 'species_id', nullable: true })
  speciesId: string | null;

  @Column({ type: 'varchar', length: 80, name: 'custom_name', nullable: true })
  customName: string | null;

  @Column({ type: 'integer' })
  count: number;

  @Column({ type: 'double precision', name: 'length_cm', nullable: true })
  lengthCm: number | null;

  @CreateDateColumn({ type: 'timestamptz', name: 'created_at' })
  createdAt: Date;

  @UpdateDateColumn({ type: 'timestamptz', name: 'updated_at' })
  updatedAt: Date;
}
