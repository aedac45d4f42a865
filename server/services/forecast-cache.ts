import { createHash } from 'node:crypto';
import type { DataSource } from 'typeorm';
import { PARAMETERS } from '../../simulation/parameters.js';

/**
 * The PostgreSQL forecast cache (migration 1796180000500). Shared by every server process,
 * safe to lose. Keys are sha256 of canonical JSON, so equal inputs in any key order hit.
 */

/** Bump when the engine's equations or the forecast's shape change without a parameter change. */
export const ENGINE_REVISION = 1;
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

/** The engine version: its revision and a hash of the whole parameter table (defaults and ranges). */
export const ENGINE_VERSION = `r${ENGINE_REVISION}-${sha256(canonicalJson(PARAMETERS)).slice(0, 16)}`;

export function inputHash(kind: string, inputs: unknown): string {
  return sha256(canonicalJson({ kind, engineVersion: ENGINE_VERSION, inputs }));
}

export interface CachedResult<T> {
  result: T;
  createdAt: Date;
}

export async function readCache<T>(ds: DataSource, hash: string): Promise<CachedResult<T> | null> {
  const rows: { result: T; created_at: Date }[] = await ds.query(
    // A CTE so the statement is a SELECT: TypeORM answers [rows, count] for a bare UPDATE.
    `WITH hit AS (UPDATE forecast_cache SET last_used_at = now() WHERE input_hash = $1 RETURNING result, created_at) SELECT * FROM hit`,
    [hash],
  );
  return rows[0] ? { result: rows[0].result, createdAt: rows[0].created_at } : null;
}

export async function writeCache(ds: DataSource, hash: string, result: unknown, computeMs: number): Promise<Date> {
  const rows: { created_at: Date }[] = await ds.query(
    `INSERT INTO forecast_cache (input_hash, engine_version, result, compute_ms) VALUES ($1, $2, $3::jsonb, $4)
       ON CONFLICT (input_hash) DO UPDATE SET last_used_at = now()
       RETURNING created_at`,
    [hash, ENGINE_VERSION, JSON.stringify(result), computeMs],
  );
  await ds.query(`DELETE FROM forecast_cache WHERE last_used_at < now() - make_interval(days => $1)`, [CACHE_KEEP_DAYS]);
  return rows[0].created_at;
}
