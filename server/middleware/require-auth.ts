import type { Request, RequestHandler } from 'express';
import type { DataSource } from 'typeorm';
import type { Config } from '../config.js';
import { unauthorized } from '../errors.js';
import { User } from '../entities/user.js';
import { destroySession } from '../session.js';

const USER = Symbol('user');
type WithUser = Request & { [USER]?: User };

/**
 * 401 unless the request carries a live signed-in session. Also ends sessions past the absolute
 * timeout (ASVS 7.3.2) and sessions that began before the user's last password change.
 */
export function requireAuth(ds: DataSource, config: Config): RequestHandler {
  return async (req, _res, next) => {
    const { userId, createdAt } = req.session ?? {};
    if (!userId || !createdAt) return next(unauthorized());
    const user = await liveSessionUser(ds, config, req);
    if (!user) {
      await destroySession(req);
      return next(unauthorized('Your session has ended. Sign in again.'));
    }
    (req as WithUser)[USER] = user;
    next();
  };
}

/**
 * The user of a live session (the rules `requireAuth` applies: within the absolute timeout, begun
 * after the user's last password change), or null; ends nothing, for routes open to both.
 */
export async function liveSessionUser(ds: DataSource, config: Config, req: Request): Promise<User | null> {
  const { userId, createdAt } = req.session ?? {};
  if (!userId || !createdAt || Date.now() - createdAt > config.session.absoluteSeconds * 1000) return null;
  const user = await ds.getRepository(User).findOneBy({ id: userId });
  return user && user.passwordChangedAt.getTime() <= createdAt ? user : null;
}

/** The user `requireAuth` loaded for this request. */
export function currentUser(req: Request): User {
  const user = (req as WithUser)[USER];
  if (!user) throw new Error('currentUser read on a route without requireAuth');
  return user;
}
