import type { Request } from 'express';
import type { DataSource, EntityManager } from 'typeorm';
import type { Db } from '../data-source.js';

/**
 * The open transaction of a request that carries an `Idempotency-Key` (opened by
 * server/middleware/idempotency.ts). The key row, the route's writes and the stored answer
 * commit together, so a retry sees either all of them or none.
 */
export interface KeyedTransaction {
  manager: EntityManager;
  /** Side effects (e-mail, job enqueue) held until COMMIT succeeded; dropped on rollback. */
  afterCommit: (() => unknown)[];
  /** The answer to keep for replays when the one sent carries a secret. */
  storedBody?: { body: unknown };
}

const open = new WeakMap<Request, KeyedTransaction>();

export function bindKeyedTransaction(req: Request, tx: KeyedTransaction): void {
  open.set(req, tx);
}

/**
 * What a write route reads and writes through: the key's transaction when the request carries
 * an `Idempotency-Key`, else the app's data source. Every write of a POST route goes through
 * it, and so does every read that must see those writes (they are not committed yet).
 */
export function requestDb(req: Request, ds: DataSource): Db {
  return open.get(req)?.manager ?? ds;
}

/**
 * Runs `task` once the request's writes are committed: at once without a key (each write
 * committed as it ran), after COMMIT with one (so a rolled-back attempt sends nothing, and a
 * retry that replays the answer sends nothing again). At most once per key: a crash between
 * COMMIT and the task loses the task rather than repeating it.
 */
export async function afterCommit(req: Request, task: () => unknown): Promise<void> {
  const tx = open.get(req);
  if (tx) tx.afterCommit.push(task);
  else await task();
}

/**
 * Keeps `body` for replays of this key instead of the answer sent (e.g. an answer carrying a
 * link's secret token: the token is shown once and never stored). No effect without a key.
 */
export function storeAnswerAs(req: Request, body: unknown): void {
  const tx = open.get(req);
  if (tx) tx.storedBody = { body };
}
