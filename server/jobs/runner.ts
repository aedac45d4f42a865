import PgBoss from 'pg-boss';
import { configureEnginePool } from '../workers/engine-pool.js';
import type { AppDeps } from '../deps.js';
import type { JobQueue } from './job-queue.js';
import { IMPORT_CHECK_QUEUE, READING_CHECK_QUEUE, checkImportedReadings, checkReading, type ImportCheckJob } from './alerts.js';
import { REMINDER_SCAN_QUEUE, REMINDER_SEND_QUEUE, dueReminders, sendReminder, utcDate, type ReminderJob } from './reminders.js';

export interface JobRunner extends JobQueue {
  boss: PgBoss;
  stop(): Promise<void>;
}

/** Throttle slot of a reminder's send job (pg-boss allows at most its archive interval, 12 h). */
export const REMINDER_THROTTLE_SECONDS = 6 * 3600;

/** Daily reminder scan, 07:00 UTC. pg-boss's cron lock makes one process send it per slot. */
export const REMINDER_SCAN_CRON = '0 7 * * *';

export interface JobRunnerOptions {
  /** How often idle workers poll, seconds (pg-boss minimum 0.5). */
  pollingIntervalSeconds?: number;
  /** Install the daily cron schedule (off in tests that drive the scan themselves). */
  schedule?: boolean;
}

/**
 * Starts pg-boss on the app's database (schema `pgboss`, created on first start) and the
 * workers for reminders and reading alerts. Every server process runs the same workers; a job
 * is fetched by one of them (SKIP LOCKED), and each e-mail is also guarded by a unique key.
 */
export async function startJobs(deps: Pick<AppDeps, 'config' | 'dataSource' | 'mailer' | 'logger'>, options: JobRunnerOptions = {}): Promise<JobRunner> {
  const { config, logger } = deps;
  // The alert job's forecasts run on this process's engine pool, under the same limits.
  configureEnginePool(config.engine);
  const boss = new PgBoss({ connectionString: config.databaseUrl, max: 3, application_name: 'shoalshift-jobs', schedule: options.schedule ?? true });
  boss.on('error', (err) => logger.log('error', 'jobs.error', { error: String(err) }));
  await boss.start();
  for (const name of [REMINDER_SCAN_QUEUE, REMINDER_SEND_QUEUE, READING_CHECK_QUEUE, IMPORT_CHECK_QUEUE]) {
    // createQueue is idempotent in pg-boss 10; retries with backoff cover a brief SMTP outage.
    await boss.createQueue(name, { name, retryLimit: 5, retryDelay: 30, retryBackoff: true });
  }
  const polling = { pollingIntervalSeconds: options.pollingIntervalSeconds ?? 2 };
  /** Logs a failed job (pg-boss keeps the error in the job row and retries it) and rethrows. */
  const logged =
    <T>(queue: string, handler: (jobs: PgBoss.Job<T>[]) => Promise<void>) =>
    async (jobs: PgBoss.Job<T>[]) => {
      try {
        await handler(jobs);
      } catch (err) {
        logger.log('error', 'jobs.failed', { queue, jobIds: jobs.map((j) => j.id).join(','), error: String(err) });
        throw err;
      }
    };

  await boss.work<{ date?: string }>(REMINDER_SCAN_QUEUE, polling, logged(REMINDER_SCAN_QUEUE, async (jobs) => {
    for (const job of jobs) {
      const date = job.data?.date ?? utcDate();
      const due = await dueReminders(deps.dataSource, date);
      // One send job per plan and date: pg-boss throttles a key to one job per slot (6 h; it
      // refuses slots longer than its 12 h archive interval), so a second scan usually queues
      // nothing; the mail_sends key covers the rest (slot edges, retries).
      for (const r of due) await boss.send(REMINDER_SEND_QUEUE, r, { singletonKey: `reminder:${r.planId}:${r.date}`, singletonSeconds: REMINDER_THROTTLE_SECONDS });
      logger.log('info', 'jobs.reminder_scan', { date, due: due.length });
    }
  }));
  await boss.work<ReminderJob>(
    REMINDER_SEND_QUEUE,
    polling,
    logged(REMINDER_SEND_QUEUE, async (jobs) => {
      for (const job of jobs) await sendReminder(deps, job.data);
    }),
  );
  await boss.work<{ readingId: string }>(
    READING_CHECK_QUEUE,
    polling,
    logged(READING_CHECK_QUEUE, async (jobs) => {
      for (const job of jobs) await checkReading(deps, job.data.readingId);
    }),
  );
  await boss.work<ImportCheckJob>(
    IMPORT_CHECK_QUEUE,
    polling,
    logged(IMPORT_CHECK_QUEUE, async (jobs) => {
      for (const job of jobs) await checkImportedReadings(deps, job.data);
    }),
  );
  if (options.schedule ?? true) await boss.schedule(REMINDER_SCAN_QUEUE, REMINDER_SCAN_CRON, {}, { tz: 'UTC' });

  return {
    boss,
    send: (name, data, opts) => boss.send(name, data, opts ?? {}),
    stop: () => boss.stop({ graceful: true, wait: true, timeout: 10_000 }),
  };
}
