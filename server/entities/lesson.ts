import { Column, CreateDateColumn, Entity, PrimaryGeneratedColumn, UpdateDateColumn } from 'typeorm';
import type { LessonKind, LessonStep } from '../../shared/schemas/lesson.js';
import type { Scenario } from '../../simulation/scenario.js';

/** A teaching scenario of a club: one or two scenarios and a short narrative in steps. */
@Entity({ name: 'lessons' })
export class Lesson {
  @PrimaryGeneratedColumn('uuid')
  id: string;

  @Column({ type: 'uuid', name: 'club_id' })
  clubId: string;

  @Column({ type: 'uuid', name: 'author_id', nullable: true })
  authorId: string | null;

  @Column({ type: 'varchar', length: 120 })
  title: string;

  @Column({ type: 'varchar', length: 400, default: '' })
  summary: string;

  @Column({ type: 'varchar', length: 8 })
  kind: LessonKind;

  @Column({ type: 'jsonb' })
  scenario: Scenario;

  @Column({ type: 'jsonb', name: 'staged_scenario', nullable: true })
  stagedScenario: Scenario | null;

  @Column({ type: 'jsonb' })
  steps: LessonStep[];

  @CreateDateColumn({ type: 'timestamptz', name: 'created_at' })
  createdAt: Date;

  @UpdateDateColumn({ type: 'timestamptz', name: 'updated_at' })
  updatedAt: Date;
}
