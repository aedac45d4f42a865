/**
 * pg-boss 10 records a job's end (`Manager.complete` / `Manager.fail`) without awaiting it, so
 * when PostgreSQL is down at that moment the rejection is unhandled and, by Node's default,
 * ends the process — during exactly the outage the server must ride out (hardening F1). Such a
 * loss is harmless: the job stays active, expires and runs again, and every send it makes goes
 * through a send-once key (server/jobs/send-once.ts). This tells that one case apart, so the
 * process-level handler can log it and keep every other unhandled rejection fatal.
 */
const PG_BOSS_MANAGER = /pg-boss[\\/]src[\\/]manager\.js/;
const COMPLETION_FRAME = /\bManager\.(complete|fail)\b/;

export function isLostJobCompletion(reason: unknown): boolean {
  if (!(reason instanceof Error) || typeof reason.stack !== 'string') return false;
  return PG_BOSS_MANAGER.test(reason.stack) && COMPLETION_FRAME.test(reason.stack);
}
