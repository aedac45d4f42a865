import type { Router } from 'express';
import type { Pool } from 'pg';
import type { DataSource } from 'typeorm';
import type { BackgroundTasks } from './background.js';
import type { Config } from './config.js';
import type { Logger } from './logger.js';
import type { JobQueue } from './jobs/job-queue.js';
import type { Mailer } from './mail/mailer.js';

/** Everything the app needs from outside; built by index.ts, or by the API tests. */
export interface AppDeps {
  config: Config;
  dataSource: DataSource;
  /** The pool the session store uses (its own, so closing it is explicit at shutdown). */
  sessionPool: Pool;
  mailer: Mailer;
  logger: Logger;
  background: BackgroundTasks;
  /** Mounted under /api before the 404 handler (tests use it for a route that throws). */
  extraApiRoutes?: Router;
  /** The PostgreSQL-backed job queue (pg-boss); absent when jobs are off (JOBS=off, most API tests). */
  jobs?: JobQueue;
}
