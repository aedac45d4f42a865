import type { DataSource, EntityManager } from 'typeorm';

/** Ends every session of a user server-side (password reset, account changes). ASVS 7.4.3. */
export async function endAllSessionsOf(db: DataSource | EntityManager, userId: string): Promise<void> {
  await db.query(`DELETE FROM "session" WHERE ("sess" ->> 'userId') = $1`, [userId]);
}
