import type PgBoss from 'pg-boss';

/**
 * What routes need from the queue: enqueue a job. Its own module so that server/deps.ts (which
 * the job handlers import) does not import the runner that imports those handlers.
 */
export interface JobQueue {
  send(name: string, data: object, options?: PgBoss.SendOptions): Promise<string | null>;
}
