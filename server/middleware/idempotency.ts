import { createHash } from 'node:crypto';
import type { RequestHandler, Response } from 'express';
import { Pool, type PoolClient } from 'pg';
import { AppError, badRequest, serviceUnavailable } from '../errors.js';
import type { Logger } from '../logger.js';

export const IDEMPOTENCY_HEADER = 'idempotency-key';
export const REPLAYED_HEADER = 'Idempotent-Replayed';
/** Visible ASCII, 1–200 characters (a UUID from the client is the usual choice). */
const KEY_PATTERN = /^[\x21-\x7e]{1,200}$/;
/** Kept one day: long enough for any client retry loop. */
const KEEP_HOURS = 24;
const PRUNE_EVERY = 500;

const sha256 = (text: string) => createHash('sha256').update(text).digest('hex');

/**
 * `Idempotency-Key` for signed-in POST requests (any route; /api/auth/* excepted, where a
 * replayed answer would not start a session).
 *
 * How it works: the first request with a key inserts a row (scope = user + path, key) in a
 * transaction it holds open while the route runs, so a concurrent retry of the same key waits
 * on the unique index. A 2xx answer is stored and committed BEFORE it is sent, so every
 * acknowledged answer can be replayed; a non-2xx answer rolls the row back so a retry runs
 * again (4xx writes nothing). If this process dies mid-request, PostgreSQL rolls the open
 * transaction back when the connection drops, and the retry runs the request again.
 *
 * Limit (said plainly): the route's own write commits on its own connection just before the
 * key row commits; a crash in that gap (microseconds) lets the retry write a second time.
 * Closing it fully needs the route to write inside the key's transaction.
 *
 * A separate small pool so a held key transaction can never starve the routes' pool.
 */
export function createIdempotency(databaseUrl: string, logger: Logger) {
  const pool = new Pool({
    connectionString: databaseUrl,
    max: 10,
    connectionTimeoutMillis: 5_000,
    idleTimeoutMillis: 5_000,
    allowExitOnIdle: true,
    application_name: 'shoalshift-idempotency',
  });
  pool.on('error', (err) => logger.log('warn', 'db.idempotency_pool_error', { error: String(err) }));
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

    const scope = `${userId}:POST ${req.baseUrl}${req.path}`.slice(0, 300);
    // A multipart upload is not parsed yet here: its media type and length stand in for the
    // body (not the boundary, which a client draws afresh for each attempt).
    const fingerprint = sha256(
      req.body !== undefined
        ? JSON.stringify(req.body)
        : `${(req.get('content-type') ?? '').split(';')[0]}|${req.get('content-length') ?? ''}`,
    );
    if (++keyed % PRUNE_EVERY === 0) {
      pool.query(`DELETE FROM idempotency_keys WHERE created_at < now() - interval '${KEEP_HOURS} hours'`).catch(() => {});
    }

    let client: PoolClient;
    try {
      client = await pool.connect();
    } catch (err) {
      return next(err);
    }
    // A checked-out client that loses its connection between queries (PostgreSQL restarted
    // while the route runs) emits 'error'; with no listener node-postgres crashes the process.
    let lostConnection: Error | undefined;
    const onClientError = (err: Error) => {
      lostConnection = err;
      logger.log('warn', 'db.idempotency_client_error', { error: String(err) });
    };
    client.on('error', onClientError);
    let released = false;
    const release = (err?: Error) => {
      if (released) return;
      released = true;
      client.off('error', onClientError);
      client.release(err ?? lostConnection);
    };

    try {
      await client.query('BEGIN');
      // A retry waits for the first request to finish, but not forever.
      await client.query(`SET LOCAL lock_timeout = '15s'`);
      const inserted = await client.query(
        `INSERT INTO idempotency_keys (scope, key, fingerprint, status) VALUES ($1, $2, $3, 0) ON CONFLICT DO NOTHING RETURNING 1`,
        [scope, key, fingerprint],
      );
      if (inserted.rowCount === 0) {
        await client.query('ROLLBACK');
        release();
        return replay(res, next);
      }
    } catch (err) {
      await client.query('ROLLBACK').catch(() => {});
      release(err instanceof Error ? err : undefined);
      if (err && typeof err === 'object' && (err as { code?: string }).code === '55P03') {
        return next(new AppError(409, 'in_progress', 'A request with this Idempotency-Key is still running. Retry shortly.', undefined, { 'Retry-After': '1' }));
      }
      return next(err);
    }

    async function replay(response: Response, nextFn: typeof next) {
      try {
        const { rows } = await pool.query<{ fingerprint: string; status: number; body: unknown }>(
          `SELECT fingerprint, status, body FROM idempotency_keys WHERE scope = $1 AND key = $2`,
          [scope, key],
        );
        const row = rows[0];
        if (!row) return nextFn(new AppError(409, 'in_progress', 'Retry this request.', undefined, { 'Retry-After': '1' }));
        if (row.fingerprint !== fingerprint) {
          return nextFn(new AppError(422, 'idempotency_key_reused', 'This Idempotency-Key was already used for a different request.'));
        }
        response.set(REPLAYED_HEADER, 'true');
        if (row.body === null) return void response.status(row.status).end();
        response.status(row.status).json(row.body);
      } catch (err) {
        nextFn(err);
      }
    }

    // Store a 2xx answer and commit before it leaves; anything else rolls back.
    const settle = async (status: number, body: unknown) => {
      if (status >= 200 && status < 300) {
        await client.query(`UPDATE idempotency_keys SET status = $3, body = $4 WHERE scope = $1 AND key = $2`, [
          scope,
          key,
          status,
          body === undefined ? null : JSON.stringify(body),
        ]);
        await client.query('COMMIT');
      } else {
        await client.query('ROLLBACK');
      }
      release();
    };

    let settled = false;
    const originalJson = res.json.bind(res);
    const originalEnd = res.end.bind(res) as (...args: unknown[]) => Response;
    const fail = (err: unknown) => {
      logger.log('error', 'idempotency.store_failed', { error: err instanceof Error ? err.message : String(err) });
      client.query('ROLLBACK').catch(() => {});
      release(err instanceof Error ? err : undefined);
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
    // Client gone or route never answered: give the row back.
    res.on('close', () => {
      if (settled) return;
      settled = true;
      client.query('ROLLBACK').then(() => release(), (err: Error) => release(err));
    });
    next();
  };

  return { middleware, close: () => pool.end() };
}
