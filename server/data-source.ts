import 'reflect-metadata';
import { DataSource } from 'typeorm';
import { entities } from './entities/index.js';
import { migrations } from './migrations/index.js';
import type { Logger } from './logger.js';

export interface DataSourceOptions {
  /**
   * PostgreSQL `statement_timeout` for every pooled connection, in ms (0 or absent = none). The
   * app passes DB_STATEMENT_TIMEOUT_MS; migrations and the seed run without one (an index
   * build may take longer).
   */
  statementTimeoutMs?: number;
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
    applicationName: 'shoalshift',
    extra: {
      max: 10,
      connectionTimeoutMillis: 5_000,
      ...(options.statementTimeoutMs ? { statement_timeout: options.statementTimeoutMs } : {}),
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
