import { createHash } from 'node:crypto';
import type { RequestHandler, Response } from 'express';
import type { DataSource, QueryRunner } from 'typeorm';
import { createDataSource } from '../data-source.js';
import { badRequest, idempotencyInProgress, idempotencyKeyReused, serviceUnavailable } from '../errors.js';
import type { Logger } from '../logger.js';
import { bindKeyedTransaction, type KeyedTransaction } from './request-db.js';

export const IDEMPOTENCY_HEADER = 'idempotency-key';
export const REPLAYED_HEADER = 'Idempotent-Replayed';
/** Visible ASCII, 1–200 characters (a UUID from the client is the usual choice). */
const KEY_PATTERN = /^[\x21-\x7e]{1,200}$/;
/** Kept one day: long enough for any client retry loop. */
const KEEP_HOURS = 24;
const PRUNE_EVERY = 500;
/** A retry waits this long for the first attempt of its key (then 409 in_progress). */
const LOCK_TIMEOUT = '15s';
/**
 * A key's transaction idle this long means its route is stuck: PostgreSQL ends the session,
 * so the row locks and the connection come back (the answer is a 503; the retry runs again).
 * Longer than any engine run a keyed POST can start.
 */
const IDLE_IN_TRANSACTION_TIMEOUT = '120s';

const sha256 = (text: string) => createHash('sha256').update(text).digest('hex');

/**
 * `Idempotency-Key` for signed-in POST requests (any route; /api/auth/* excepted, where a
 * replayed answer would not start a session).
 *
 * One transaction per keyed request holds the key row, every write of the route and the stored
 * answer, and commits them together before the answer leaves:
 * - the first request with a key inserts its row (scope = user + hashed path, key); a
 *   concurrent retry of the key waits on the unique index, then replays the stored answer;
 * - the route reads and writes through the transaction's manager (`requestDb(req, ds)`,
 *   server/middleware/request-db.ts); side effects wait for COMMIT (`afterCommit`);
 * - a 2xx answer is stored and committed before it is sent; any other answer rolls back the
 *   key and the route's writes together, so a retry runs again;
 * - a client that goes away does not cancel anything: the route finishes, the answer is stored
 *   and committed, and the retry replays it;
 * - a failed COMMIT (connection lost, process killed) leaves neither the writes nor the key:
 *   PostgreSQL rolls the open transaction back, and the retry runs the request again.
 *
 * Its own data source with a small pool, so held key transactions can never starve the pool
 * the routes read through (a keyed route also reads through the app's data source, e.g. in
 * `requireAuth`).
 */
export function createIdempotency(databaseUrl: string, logger: Logger) {
  const keyedDs = createDataSource(databaseUrl, logger, {
    applicationName: 'shoalshift-idempotency',
    pool: { max: 10, idleTimeoutMillis: 5_000, allowExitOnIdle: true },
  });
  // Initialised on the first keyed request (and again after a failed attempt).
  let ready: Promise<DataSource> | undefined;
  const dataSource = () =>
    (ready ??= keyedDs.initialize().catch((err: unknown) => {
      ready = undefined;
      throw err;
    }));
  let keyed = 0;

  const middleware: RequestHandler = async (req, res, next) => {
    if (req.method !== 'POST') return next();
    const key = req.get(IDEMPOTENCY_HEADER);
    if (key === undefined) return next();
    if (!KEY_PATTERN.test(key)) {
      return next(badRequest('Idempotency-Key must be 1 to 200 visible ASCII characters.', { 'Idempotency-Key': 'is malformed' }));
    }
    const userId = req.session?.userId;
    // Anonymous answers are not stored: a key must never let one person replay another's answer.
    if (!userId || req.path.startsWith('/auth/')) return next();

    // The path is hashed: it may carry a secret (an invite token in /invites/:token/accept).
    const scope = `${userId}:${sha256(`POST ${req.baseUrl}${req.path}`)}`;
    // A multipart upload is not parsed yet here: its media type and length stand in for the
    // body (not the boundary, which a client draws afresh for each attempt).
    const fingerprint = sha256(
      req.body !== undefined
        ? JSON.stringify(req.body)
        : `${(req.get('content-type') ?? '').split(';')[0]}|${req.get('content-length') ?? ''}`,
    );

    let qr: QueryRunner;
    try {
      const ds = await dataSource();
      if (++keyed % PRUNE_EVERY === 0) {
        ds.query(`DELETE FROM idempotency_keys WHERE created_at < now() - interval '${KEEP_HOURS} hours'`).catch(() => {});
      }
      qr = ds.createQueryRunner();
      await qr.connect();
    } catch (err) {
      return next(err);
    }
    let released = false;
    const release = () => {
      if (released) return;
      released = true;
      qr.release().catch(() => {});
    };
    const rollback = async () => {
      try {
        if (qr.isTransactionActive) await qr.rollbackTransaction();
      } catch {
        // The connection is gone or broken: PostgreSQL has rolled back already. TypeORM drops
        // a client that errored; one that merely failed a query is clean after the failure.
      }
      release();
    };

    try {
      await qr.startTransaction();
      await qr.query(`SET LOCAL lock_timeout = '${LOCK_TIMEOUT}'`);
      await qr.query(`SET LOCAL idle_in_transaction_session_timeout = '${IDLE_IN_TRANSACTION_TIMEOUT}'`);
      const inserted: unknown[] = await qr.query(
        `INSERT INTO idempotency_keys (scope, key, fingerprint, status) VALUES ($1, $2, $3, 0) ON CONFLICT DO NOTHING RETURNING 1`,
        [scope, key, fingerprint],
      );
      if (inserted.length === 0) {
        await rollback();
        return replay(res, next);
      }
    } catch (err) {
      await rollback();
      if (err && typeof err === 'object' && (err as { code?: string }).code === '55P03') {
        return next(idempotencyInProgress());
      }
      return next(err);
    }

    async function replay(response: Response, nextFn: typeof next) {
      try {
        const rows: { fingerprint: string; status: number; body: unknown }[] = await (await dataSource()).query(
          `SELECT fingerprint, status, body FROM idempotency_keys WHERE scope = $1 AND key = $2`,
          [scope, key],
        );
        const row = rows[0];
        if (!row) return nextFn(idempotencyInProgress('Retry this request.'));
        if (row.fingerprint !== fingerprint) {
          return nextFn(idempotencyKeyReused());
        }
        response.set(REPLAYED_HEADER, 'true');
        if (row.body === null) return void response.status(row.status).end();
        response.status(row.status).json(row.body);
      } catch (err) {
        nextFn(err);
      }
    }

    const tx: KeyedTransaction = { manager: qr.manager, afterCommit: [] };
    bindKeyedTransaction(req, tx);

    // Store a 2xx answer and commit it with the route's writes before it leaves; anything else
    // rolls both back. Side effects run once COMMIT has succeeded, before the answer is sent.
    const settle = async (status: number, body: unknown) => {
      if (status < 200 || status >= 300) return rollback();
      const kept = tx.storedBody ? tx.storedBody.body : body;
      await qr.query(`UPDATE idempotency_keys SET status = $3, body = $4 WHERE scope = $1 AND key = $2`, [
        scope,
        key,
        status,
        kept === undefined ? null : JSON.stringify(kept),
      ]);
      await qr.commitTransaction();
      release();
      for (const task of tx.afterCommit) {
        try {
          await task();
        } catch (err) {
          logger.log('error', 'idempotency.after_commit_failed', { error: err instanceof Error ? err.message : String(err) });
        }
      }
    };

    let settled = false;
    const originalJson = res.json.bind(res);
    const originalEnd = res.end.bind(res) as (...args: unknown[]) => Response;
    const fail = (err: unknown) => {
      logger.log('error', 'idempotency.store_failed', { error: err instanceof Error ? err.message : String(err) });
      void rollback();
      res.status(503);
      originalJson(serviceUnavailable().toBody());
    };
    res.json = (body: unknown) => {
      if (settled) return originalJson(body);
      settled = true;
      settle(res.statusCode, body).then(() => originalJson(body), fail);
      return res;
    };
    res.end = ((...args: unknown[]) => {
      if (settled) return originalEnd(...args);
      settled = true;
      settle(res.statusCode, undefined).then(() => originalEnd(...args), fail);
      return res;
    }) as Response['end'];
    // A client that goes away changes nothing: the route finishes and its answer is stored for
    // the retry. (The transaction is deliberately not tied to the socket.)
    res.on('close', () => {
      if (!settled) logger.log('info', 'idempotency.client_gone', { path: `${req.baseUrl}${req.path}`.replace(/[^/]{20,}/g, ':value') });
    });
    next();
  };

  return {
    middleware,
    close: async () => {
      const pending = ready;
      ready = undefined;
      await pending?.catch(() => {});
      if (keyedDs.isInitialized) await keyedDs.destroy();
    },
  };
}
