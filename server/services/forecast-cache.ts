import { createHash } from 'node:crypto';
import { LRUCache } from 'lru-cache';
import type { DataSource } from 'typeorm';
import { ENGINE_VERSION } from './engine-version.js';

/**
 * The PostgreSQL forecast cache (migration 1796180000500). Shared by every server process,
 * safe to lose. Keys are sha256 of canonical JSON, so equal inputs in any key order hit.
 *
 * In front of it, each process keeps its most recent results in memory. A key names its
 * inputs and the engine version (a hash of the engine's sources, engine-version.ts), so a kept
 * result cannot outlive a change of its inputs or of the engine: losing it (a restart, another
 * process) only costs one database read, which is what scaling out allows.
 */

/** Rows unused this long are removed when a new row is written. */
export const CACHE_KEEP_DAYS = 30;

/** JSON with object keys sorted, so the hash does not depend on key order. */
export function canonicalJson(value: unknown): string {
  if (Array.isArray(value)) return `[${value.map(canonicalJson).join(',')}]`;
  if (value && typeof value === 'object') {
    const entries = Object.entries(value as Record<string, unknown>)
      .filter(([, v]) => v !== undefined)
      .sort(([a], [b]) => (a < b ? -1 : a > b ? 1 : 0));
    return `{${entries.map(([k, v]) => `${JSON.stringify(k)}:${canonicalJson(v)}`).join(',')}}`;
  }
  return JSON.stringify(value ?? null);
}

export const sha256 = (text: string) => createHash('sha256').update(text).digest('hex');

export function inputHash(kind: string, inputs: unknown): string {
  return sha256(canonicalJson({ kind, engineVersion: ENGINE_VERSION, inputs }));
}

export interface CachedResult<T> {
  result: T;
  createdAt: Date;
}

/** Bounded by size: a 60-day forecast with its band is some tens of kilobytes of JSON. */
const MEMO_BYTES = 32 * 1024 * 1024;
const memo = new LRUCache<string, CachedResult<unknown> & { bytes: number }>({
  maxSize: MEMO_BYTES,
  sizeCalculation: (entry) => Math.max(1, entry.bytes),
});

/** Tests that empty the table also empty this process's copy. */
export function forgetRememberedResults(): void {
  memo.clear();
}

function remember(hash: string, entry: CachedResult<unknown>, bytes: number): void {
  memo.set(hash, { ...entry, bytes });
}

/**
 * A cached result, from this process's memory or the table. The row's `last_used_at` (which
 * decides pruning after CACHE_KEEP_DAYS) is moved at most once a day, off the answer's path:
 * touching it on every hit made concurrent readers of one plan queue on its row lock.
 */
export async function readCache<T>(ds: DataSource, hash: string): Promise<CachedResult<T> | null> {
  const kept = memo.get(hash);
  if (kept) return { result: kept.result as T, createdAt: kept.createdAt };
  const rows: { result: T; created_at: Date; stale: boolean; bytes: number }[] = await ds.query(
    `SELECT result, created_at, last_used_at < now() - interval '1 day' AS stale, pg_column_size(result) AS bytes
       FROM forecast_cache WHERE input_hash = $1`,
    [hash],
  );
  const row = rows[0];
  if (!row) return null;
  if (row.stale) {
    ds.query(`UPDATE forecast_cache SET last_used_at = now() WHERE input_hash = $1`, [hash]).catch(() => {
      // Only the pruning date is lost; the next read tries again.
    });
  }
  const hit = { result: row.result, createdAt: row.created_at };
  remember(hash, hit, Number(row.bytes) * 2);
  return hit;
}

export async function writeCache(ds: DataSource, hash: string, result: unknown, computeMs: number): Promise<Date> {
  const json = JSON.stringify(result);
  const rows: { created_at: Date }[] = await ds.query(
    `INSERT INTO forecast_cache (input_hash, engine_version, result, compute_ms) VALUES ($1, $2, $3::jsonb, $4)
       ON CONFLICT (input_hash) DO UPDATE SET last_used_at = now()
       RETURNING created_at`,
    [hash, ENGINE_VERSION, json, computeMs],
  );
  await ds.query(`DELETE FROM forecast_cache WHERE last_used_at < now() - make_interval(days => $1)`, [CACHE_KEEP_DAYS]);
  remember(hash, { result, createdAt: rows[0].created_at }, json.length * 2);
  return rows[0].created_at;
}
