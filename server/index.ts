import type { AddressInfo } from 'node:net';
import { createApp } from './app.js';
import { ConfigError, loadConfig } from './config.js';
import { consoleLogger } from './logger.js';
import { buildDeps } from './runtime.js';
import { describeTrustProxy } from './security/trust-proxy.js';
import { startJobs, type JobRunner } from './jobs/runner.js';
import { isLostJobCompletion } from './jobs/lost-completion.js';
import { startEnginePool } from './workers/engine-pool.js';

/** Longest wait for in-flight requests at shutdown before giving up. */
const SHUTDOWN_GRACE_MS = 15_000;

async function main(): Promise<void> {
  const logger = consoleLogger;
  const config = loadConfig();
  if (config.session.secretIsEphemeral) {
    logger.log('warn', 'config.ephemeral_session_secret', { note: 'SESSION_SECRET not set: sessions end when the server restarts' });
  }
  // Whose X-Forwarded-For decides the address every limit counts.
  logger.log('info', 'boot.trust_proxy', { trustProxy: config.trustProxy, meaning: describeTrustProxy(config.trustProxy) });
  if (config.trustProxy === true) logger.log('warn', 'config.trust_proxy_any', { note: 'TRUST_PROXY=true: any client can choose its address (refused in production)' });
  // A job whose end pg-boss could not record while the database was down runs again later;
  // anything else unhandled stays fatal (a restart is safer than an unknown state).
  process.on('unhandledRejection', (reason) => {
    if (isLostJobCompletion(reason)) {
      logger.log('warn', 'jobs.completion_lost', { error: String(reason) });
      return;
    }
    logger.log('error', 'process.unhandled_rejection', { error: String(reason) });
    process.exit(1);
  });
  const deps = buildDeps(config, logger);
  await deps.dataSource.initialize();
  if (await deps.dataSource.showMigrations()) {
    logger.log('error', 'boot.pending_migrations', { fix: 'run: npm run db:migrate' });
    await deps.dataSource.destroy();
    await deps.sessionPool.end();
    process.exit(1);
  }

  // Reminders and alerts run from the PostgreSQL-backed queue in every server process.
  let jobs: JobRunner | undefined;
  if (config.jobsEnabled) {
    jobs = await startJobs(deps);
    deps.jobs = jobs;
    logger.log('info', 'boot.jobs_started', {});
  }

  const app = createApp(deps);
  const server = app.listen(config.port, config.host);
  await new Promise<void>((resolve, reject) => server.once('listening', resolve).once('error', reject));
  const { port } = server.address() as AddressInfo;
  logger.log('info', 'boot.listening', { url: `http://${config.host}:${port}`, env: config.env, staticDir: config.staticDir });
  startEnginePool();

  let stopping = false;
  const shutdown = (signal: string) => {
    if (stopping) return;
    stopping = true;
    logger.log('info', 'shutdown.begin', { signal });
    const force = setTimeout(() => {
      logger.log('error', 'shutdown.timeout', { graceMs: SHUTDOWN_GRACE_MS });
      process.exit(1);
    }, SHUTDOWN_GRACE_MS);
    force.unref();
    // Stop accepting; in-flight requests finish, then idle keep-alive sockets are closed.
    server.close(async (err) => {
      try {
        await deps.background.drain();
        await jobs?.stop();
        app.sessionStore.close();
        await app.idempotency.close();
        await deps.sessionPool.end();
        await deps.dataSource.destroy();
        deps.mailer.close();
        logger.log('info', 'shutdown.done', { error: err ? String(err) : undefined });
        process.exit(0);
      } catch (closeErr) {
        logger.log('error', 'shutdown.failed', { error: String(closeErr) });
        process.exit(1);
      }
    });
    server.closeIdleConnections();
  };
  process.once('SIGTERM', () => shutdown('SIGTERM'));
  process.once('SIGINT', () => shutdown('SIGINT'));
}

main().catch((err: unknown) => {
  if (err instanceof ConfigError) {
    console.error(err.message);
  } else {
    console.error(`Shoalshift server failed to start: ${err instanceof Error ? err.message : String(err)}`);
  }
  process.exit(1);
});
