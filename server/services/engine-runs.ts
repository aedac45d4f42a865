import { type AppError, badRequest, engineBusy, engineMemoryLimit, engineTimeLimit, serviceUnavailable, unprocessable, validationFailed } from '../errors.js';
import type { EngineTask } from '../workers/engine-tasks.js';
import { EngineStopped, runOnEnginePool, type EngineStop } from '../workers/engine-pool.js';

/**
 * The answer to a task the pool stopped. Waiting (queue full, or no thread free in time) is the
 * service being busy: 503 with Retry-After, the same request may well pass later. Running past
 * the time limit or the worker's heap cap is the request's own size: retrying it will not help,
 * so 422 saying what to change (a 503 would invite the client to send the same work again).
 */
export function stoppedError(stop: EngineStop, limits: { taskMs: number }): AppError {
  switch (stop) {
    case 'queue-full':
    case 'queue-wait':
      return engineBusy();
    case 'time-limit':
      return engineTimeLimit(limits.taskMs);
    case 'out-of-memory':
      return engineMemoryLimit();
    case 'cancelled':
      // The client went away; nobody reads this answer.
      return serviceUnavailable();
  }
}

/** A keeper's request for engine work (server/middleware/engine-caller.ts); jobs run without one. */
export interface EngineCaller {
  /** Aborted when the client disconnects: the task is dropped from the queue or its worker ended. */
  signal: AbortSignal;
  /** Takes one of the account's concurrent-request slots (429 when none is free); returns its release. */
  claim(): Promise<() => Promise<void>>;
}

/**
 * Runs an engine task on the worker pool and turns its refusals into the API's errors: a
 * scenario the engine refuses → 400 with its fields; an impossible request → 400; a forecast
 * the solver cannot finish → 422; a task stopped by the pool's limits → stoppedError.
 * A keeper's `caller` holds one of the account's slots while the task waits and runs, and
 * cancels the task when the client disconnects.
 */
export async function runEngine<T>(task: EngineTask, caller?: EngineCaller): Promise<{ value: T; ms: number }> {
  const release = caller ? await caller.claim() : null;
  let result;
  try {
    result = await runOnEnginePool(task, { signal: caller?.signal });
  } catch (e) {
    if (e instanceof EngineStopped) throw stoppedError(e.stop, e.limits);
    throw e;
  } finally {
    await release?.();
  }
  if (result.ok) return { value: result.value as T, ms: result.ms };
  if (result.reason === 'scenario') throw validationFailed(result.fields);
  if (result.reason === 'unsolvable') {
    throw unprocessable('The forecast could not be worked out for these values: the sums would not settle. Check for extreme numbers, or shorten the plan.');
  }
  throw badRequest(result.message, { _: result.message });
}
