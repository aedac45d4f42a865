import 'reflect-metadata';
import { DataSource } from 'typeorm';
import { entities } from './entities/index.js';
import { migrations } from './migrations/index.js';
import type { Logger } from './logger.js';

/** The TypeORM data source. Schema changes happen only through migrations, never synchronize. */
export function createDataSource(databaseUrl: string, logger?: Logger): DataSource {
  return new DataSource({
    type: 'postgres',
    url: databaseUrl,
    entities,
    migrations,
    synchronize: false,
    migrationsRun: false,
    migrationsTransactionMode: 'each',
    applicationName: 'shoalshift',
    extra: { max: 10, connectionTimeoutMillis: 5_000 },
    // A pooled client that errors while idle (database restart, network drop) must not crash
    // the process: node-postgres throws if the pool has no 'error' listener.
    poolErrorHandler: (err: unknown) => logger?.log('warn', 'db.pool_error', { error: String(err) }),
  });
}

/** The rows of an `UPDATE … RETURNING`: TypeORM's postgres driver answers it with [rows, affectedCount]. */
export function returnedRows<T>(result: unknown[]): T[] {
  return (Array.isArray(result[0]) ? result[0] : result) as T[];
}
