import { Pool } from 'pg';
import { BackgroundTasks } from './background.js';
import type { Config } from './config.js';
import { createDataSource } from './data-source.js';
import type { AppDeps } from './deps.js';
import type { Logger } from './logger.js';
import { createMailer } from './mail/mailer.js';

/** Builds the app's dependencies from configuration (data source not yet initialised). */
export function buildDeps(config: Config, logger: Logger): AppDeps {
  const sessionPool = new Pool({
    connectionString: config.databaseUrl,
    max: 5,
    connectionTimeoutMillis: 5_000,
    application_name: 'shoalshift-sessions',
    ...(config.dbStatementTimeoutMs ? { statement_timeout: config.dbStatementTimeoutMs } : {}),
  });
  // node-postgres throws from an idle client's error (database restart, dropped connection)
  // unless the pool has a listener; log it and let the pool replace the client.
  sessionPool.on('error', (err) => logger.log('warn', 'db.session_pool_error', { error: String(err) }));
  return {
    config,
    dataSource: createDataSource(config.databaseUrl, logger, { statementTimeoutMs: config.dbStatementTimeoutMs }),
    sessionPool,
    mailer: createMailer(config.smtp),
    logger,
    background: new BackgroundTasks(logger),
  };
}
