import { CreateDateColumn, Entity, PrimaryColumn } from 'typeorm';

/** A keeper who followed the unsubscribe link of a reminder: no more test-day reminders. */
@Entity({ name: 'reminder_opt_outs' })
export class ReminderOptOut {
  @PrimaryColumn({ type: 'uuid', name: 'user_id' })
  userId: string;

  @CreateDateColumn({ type: 'timestamptz', name: 'created_at' })
  createdAt: Date;
}
