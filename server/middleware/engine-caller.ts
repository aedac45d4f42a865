import type { Request, Response } from 'express';
import type { AppDeps } from '../deps.js';
import { tooManyRequests } from '../errors.js';
import type { EngineCaller } from '../services/engine-runs.js';
import { claimEngineSlot, releaseEngineSlot } from '../services/engine-slots.js';
import { currentUser } from './require-auth.js';

/**
 * What a route hands the services that run the engine for a signed-in keeper: the account's
 * concurrency slot (claimed only when the engine actually runs, so cache hits cost nothing) and
 * an AbortSignal that fires when the client disconnects before the answer is written.
 *
 * `res` 'close' rather than `req` 'close': since Node 16 a request's 'close' fires as soon as
 * its body has been read, long before the answer.
 */
export function engineCaller(req: Request, res: Response, { dataSource: ds, config, logger }: Pick<AppDeps, 'dataSource' | 'config' | 'logger'>): EngineCaller {
  const user = currentUser(req);
  const controller = new AbortController();
  res.once('close', () => {
    if (!res.writableEnded) controller.abort('client disconnected');
  });
  // Longest one request can hold the engine: a wait for a thread, then a run (plus a margin).
  const leaseMs = config.engine.queueWaitMs + config.engine.taskMs + 5_000;
  return {
    signal: controller.signal,
    async claim() {
      const claim = await claimEngineSlot(ds, user.id, config.engine.requestsPerAccount, leaseMs);
      if ('retryAfter' in claim) {
        logger.log('warn', 'engine.account_busy', { userId: user.id, limit: config.engine.requestsPerAccount });
        throw tooManyRequests(
          claim.retryAfter,
          `You already have ${config.engine.requestsPerAccount} forecasts or advice requests running. Wait for one to finish, then try again.`,
        );
      }
      return async () => {
        try {
          await releaseEngineSlot(ds, user.id, claim.holder);
        } catch (err) {
          // The lease expires by itself; a failed release only delays the account's next request.
          logger.log('warn', 'engine.slot_release_failed', { userId: user.id, error: String(err) });
        }
      };
    },
  };
}
