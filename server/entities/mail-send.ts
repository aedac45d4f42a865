import { Column, CreateDateColumn, Entity, PrimaryColumn } from 'typeorm';

/**
 * One e-mail the job runner sent, under a unique key such as `reminder:<planId>:<date>`: the
 * primary key makes a retried or duplicated job skip a message already sent.
 */
@Entity({ name: 'mail_sends' })
export class MailSend {
  @PrimaryColumn({ type: 'varchar', length: 200 })
  key: string;

  @Column({ type: 'uuid', name: 'user_id' })
  userId: string;

  @CreateDateColumn({ type: 'timestamptz', name: 'sent_at' })
  sentAt: Date;
}
