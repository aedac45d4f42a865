import 'reflect-metadata';
import { DataSource, type EntityManager } from 'typeorm';
import { entities } from './entities/index.js';
import { migrations } from './migrations/index.js';
import type { Logger } from './logger.js';

/**
 * What services read and write through: the app's data source, or a transaction's entity
 * manager (an Idempotency-Key's transaction: server/middleware/request-db.ts). Both have
 * `getRepository`, `query` and `transaction` (nested in a transaction, a savepoint).
 */
export type Db = DataSource | EntityManager;

export interface DataSourceOptions {
  /**
   * PostgreSQL `statement_timeout` for every pooled connection, in ms (0 or absent = none). The
   * app passes DB_STATEMENT_TIMEOUT_MS; migrations and the seed run without one (an index
   * build may take longer).
   */
  statementTimeoutMs?: number;
  /** Shown in pg_stat_activity. */
  applicationName?: string;
  /** Extra pg pool settings (size, idle timeout). */
  pool?: { max?: number; idleTimeoutMillis?: number; allowExitOnIdle?: boolean };
}

/** The TypeORM data source. Schema changes happen only through migrations, never synchronize. */
export function createDataSource(databaseUrl: string, logger?: Logger, options: DataSourceOptions = {}): DataSource {
  return new DataSource({
    type: 'postgres',
    url: databaseUrl,
    entities,
    migrations,
    synchronize: false,
    migrationsRun: false,
    migrationsTransactionMode: 'each',
    applicationName: options.applicationName ?? 'shoalshift',
    extra: {
      max: 10,
      connectionTimeoutMillis: 5_000,
      ...(options.statementTimeoutMs ? { statement_timeout: options.statementTimeoutMs } : {}),
      ...options.pool,
    },
    // A pooled client that errors while idle (database restart, network drop) must not crash
    // the process: node-postgres throws if the pool has no 'error' listener.
    poolErrorHandler: (err: unknown) => logger?.log('warn', 'db.pool_error', { error: String(err) }),
  });
}

/** The rows of an `UPDATE … RETURNING`: TypeORM's postgres driver answers it with [rows, affectedCount]. */
export function returnedRows<T>(result: unknown[]): T[] {
  return (Array.isArray(result[0]) ? result[0] : result) as T[];
}

/** A unique index refused the row (PostgreSQL 23505); with `constraint`, only that index. */
export function isUniqueViolation(err: unknown, constraint?: string): boolean {
  if (typeof err !== 'object' || err === null || (err as { code?: unknown }).code !== '23505') return false;
  return constraint === undefined || (err as { constraint?: unknown }).constraint === constraint;
}

/**
 * Runs independent queries: side by side on a pool, one after another on a transaction's single
 * connection (a pg client runs one query at a time; overlapping ones are deprecated in pg 8).
 */
export async function independentQueries<T extends readonly (() => Promise<unknown>)[]>(
  db: Db,
  ...queries: T
): Promise<{ -readonly [K in keyof T]: Awaited<ReturnType<T[K]>> }> {
  type Out = { -readonly [K in keyof T]: Awaited<ReturnType<T[K]>> };
  if (!('queryRunner' in db && db.queryRunner)) return (await Promise.all(queries.map((q) => q()))) as Out;
  const out: unknown[] = [];
  for (const q of queries) out.push(await q());
  return out as Out;
}
