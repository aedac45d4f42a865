import connectPgSimple from 'connect-pg-simple';
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
  const store = new PgStore({
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
