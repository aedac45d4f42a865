import { badRequest, serviceUnavailable, unprocessable, validationFailed } from '../errors.js';
import type { EngineTask } from '../workers/engine-tasks.js';
import { runOnEnginePool } from '../workers/engine-pool.js';

/**
 * Runs an engine task on the worker pool and turns its refusals into the API's errors: a
 * scenario the engine refuses → 400 with its fields; an impossible request → 400; a forecast
 * the solver cannot finish → 422; a full
 * queue → 503 (the client may retry).
 */
export async function runEngine<T>(task: EngineTask): Promise<{ value: T; ms: number }> {
  let result;
  try {
    result = await runOnEnginePool(task);
  } catch (e) {
    if (e instanceof Error && /queue is at limit/i.test(e.message)) throw serviceUnavailable();
    throw e;
  }
  if (result.ok) return { value: result.value as T, ms: result.ms };
  if (result.reason === 'scenario') throw validationFailed(result.fields);
  if (result.reason === 'unsolvable') {
    throw unprocessable('The forecast could not be worked out for these values (the solver hit its step limit). Check for extreme numbers, or shorten the plan.');
  }
  throw badRequest(result.message, { _: result.message });
}

