import connectPgSimple from 'connect-pg-simple';
import { LRUCache } from 'lru-cache';
import session from 'express-session';
import type { Request } from 'express';
import type { Pool } from 'pg';
import type { Config } from './config.js';
import type { Logger } from './logger.js';

declare module 'express-session' {
  interface SessionData {
    userId: string;
    /** Epoch ms when this signed-in session began; the absolute timeout counts from here. */
    createdAt: number;
  }
}

export const SESSION_COOKIE_NAME = 'shoalshift.sid';

/**
 * Sessions live in PostgreSQL (connect-pg-simple), so any server process can serve any
 * request. Idle timeout: the cookie and the stored row expire `idleSeconds` after the last
 * request (rolling). Absolute timeout: checked in requireAuth against `createdAt`.
 */
export function createSessionMiddleware(config: Config, pool: Pool, logger: Logger) {
  const PgStore = connectPgSimple(session);
  // Moving the expiry by less than a tenth of the idle timeout (at most a minute) changes
  // nothing a keeper would notice, so most requests skip the write.
  const touchStepSeconds = Math.min(60, config.session.idleSeconds / 10);
  /**
   * express-session holds every answer until the store's touch returns. Here the touch is
   * answered at once and the row's expiry moves in the background, and only when it has moved
   * by more than the step. A lost touch can only make a session end earlier, never later.
   * Each process remembers the expiry it last wrote per session, so most requests send no
   * query at all; forgetting (a restart, another process) only costs one more UPDATE.
   */
  const lastWritten = new LRUCache<string, number>({ max: 50_000 });
  class SessionStore extends PgStore {
    override touch(sid: string, sess: session.SessionData, fn?: (err?: unknown) => void): void {
      const expires = sess.cookie?.expires ? new Date(sess.cookie.expires).getTime() : Date.now() + config.session.idleSeconds * 1000;
      const expireSeconds = Math.ceil(expires / 1000);
      const written = lastWritten.get(sid);
      if (written === undefined || expireSeconds - written > touchStepSeconds) {
        lastWritten.set(sid, expireSeconds);
        pool
          .query(`UPDATE session SET expire = to_timestamp($1) WHERE sid = $2 AND expire < to_timestamp($1) - make_interval(secs => $3)`, [
            expireSeconds,
            sid,
            touchStepSeconds,
          ])
          .catch((err: unknown) => {
            lastWritten.delete(sid);
            logger.log('warn', 'session.touch_failed', { error: String(err) });
          });
      }
      fn?.();
    }
  }
  const store = new SessionStore({
    pool,
    tableName: 'session',
    createTableIfMissing: false,
    // Each process prunes expired rows now and then; harmless when several do.
    pruneSessionInterval: config.env === 'test' ? false : 15 * 60,
    errorLog: (...args: unknown[]) => logger.log('error', 'session.store_error', { error: args.map(String).join(' ') }),
  });
  const middleware = session({
    name: SESSION_COOKIE_NAME,
    secret: config.session.secret,
    store,
    resave: false,
    saveUninitialized: false,
    rolling: true,
    unset: 'destroy',
    cookie: {
      httpOnly: true,
      sameSite: 'lax',
      secure: config.env === 'production' ? true : 'auto',
      path: '/',
      maxAge: config.session.idleSeconds * 1000,
    },
  });
  return { middleware, store };
}

/** Starts a fresh session for the user: a new id, so a session fixed before sign-in is useless. */
export function startUserSession(req: Request, userId: string): Promise<void> {
  return new Promise((resolve, reject) => {
    req.session.regenerate((err) => {
      if (err) return reject(err);
      req.session.userId = userId;
      req.session.createdAt = Date.now();
      req.session.save((saveErr) => (saveErr ? reject(saveErr) : resolve()));
    });
  });
}

/** Deletes the session row; the cookie is cleared by the caller. */
export function destroySession(req: Request): Promise<void> {
  return new Promise((resolve, reject) => {
    if (!req.session) return resolve();
    req.session.destroy((err) => (err ? reject(err) : resolve()));
  });
}
