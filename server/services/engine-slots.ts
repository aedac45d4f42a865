import { randomUUID } from 'node:crypto';
import type { DataSource } from 'typeorm';

/**
 * The per-account cap on heavy engine requests (issue 11), held in PostgreSQL (`engine_slots`)
 * so it is one cap over every server process, not one per process. A claim takes the account's
 * advisory transaction lock, so two claims racing in different processes are counted in turn;
 * each slot is a lease that a crashed process's rows outlive only until it expires.
 */

export type SlotClaim = { holder: string } | { retryAfter: number };

/** Seconds a refused caller is told to wait: heavy requests mostly finish within a few seconds. */
export const SLOT_RETRY_AFTER_SECONDS = 5;

/** Claims one of `limit` slots for the account for at most `leaseMs`, or says how long to wait. */
export async function claimEngineSlot(ds: DataSource, userId: string, limit: number, leaseMs: number): Promise<SlotClaim> {
  return ds.transaction(async (m) => {
    await m.query(`SELECT pg_advisory_xact_lock(hashtextextended('engine-slots:' || $1, 0))`, [userId]);
    const rows = (await m.query(
      `SELECT slot, ceil(extract(epoch FROM expires_at - now())) AS left_seconds FROM "engine_slots" WHERE user_id = $1 AND expires_at > now()`,
      [userId],
    )) as { slot: number; left_seconds: string }[];
    const taken = new Set(rows.map((r) => Number(r.slot)));
    let free = -1;
    for (let s = 0; s < limit && free < 0; s++) if (!taken.has(s)) free = s;
    if (free < 0) {
      const soonest = Math.min(...rows.map((r) => Number(r.left_seconds)));
      return { retryAfter: Math.max(1, Math.min(SLOT_RETRY_AFTER_SECONDS, soonest)) };
    }
    const holder = randomUUID();
    // An expired lease on the same slot is taken over.
    await m.query(
      `INSERT INTO "engine_slots" (user_id, slot, holder, expires_at) VALUES ($1, $2, $3, now() + make_interval(secs => $4))
       ON CONFLICT (user_id, slot) DO UPDATE SET holder = excluded.holder, expires_at = excluded.expires_at`,
      [userId, free, holder, leaseMs / 1000],
    );
    return { holder };
  });
}

/** Gives the slot back (only the holder's own row: a lease taken over after expiry stays). */
export async function releaseEngineSlot(ds: DataSource, userId: string, holder: string): Promise<void> {
  await ds.query(`DELETE FROM "engine_slots" WHERE user_id = $1 AND holder = $2`, [userId, holder]);
}
