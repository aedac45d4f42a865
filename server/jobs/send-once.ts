import type { DataSource } from 'typeorm';
import type { MailContent, Mailer } from '../mail/mailer.js';

/**
 * Sends an e-mail at most once per `key`. The key is inserted in a transaction that stays open
 * while the message is handed to SMTP: a second worker with the same key waits on the unique
 * index and then finds it taken; a failed send rolls the key back so a retry can send. (A crash
 * between SMTP acceptance and commit could still send twice; that window is milliseconds.)
 * Returns true when this call sent the message.
 */
export async function sendOnce(ds: DataSource, mailer: Mailer, key: string, userId: string, to: string, content: MailContent): Promise<boolean> {
  return ds.transaction(async (tx) => {
    const inserted: unknown[] = await tx.query(
      `INSERT INTO mail_sends (key, user_id) VALUES ($1, $2) ON CONFLICT (key) DO NOTHING RETURNING key`,
      [key, userId],
    );
    if (inserted.length === 0) return false;
    await mailer.send(to, content);
    return true;
  });
}
