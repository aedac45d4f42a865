/**
 * The worker-thread pool for CPU-heavy engine work (forecast bands, advice searches,
 * ensembles, calibration, the alert job's forecasts), so the event loop keeps answering light
 * routes (hardening.md, "Scale"). One pool per process, started on first use; holds no state a
 * second server process would need.
 *
 * Every task runs under limits (issue 11): a wait in the queue and a run time, each ended by
 * aborting the task (piscina then terminates the worker running it, the only way to stop a
 * synchronous computation), a heap cap per worker (`resourceLimits`), and the caller's own
 * AbortSignal (the client went away).
 */
import os from 'node:os';
import path from 'node:path';
import { MessageChannel } from 'node:worker_threads';
import { pathToFileURL } from 'node:url';
import { Piscina } from 'piscina';
import type { EngineResult, EngineTask } from './engine-tasks.js';

/** Threads: one fewer than the cores (the main thread needs one), at least 1, at most 4. */
export function defaultThreads(cores = os.availableParallelism()): number {
  return Math.max(1, Math.min(4, cores - 1));
}

/** Tasks waiting beyond this are refused (503) rather than queued for minutes. */
export const MAX_QUEUE = 64;

export interface EngineLimits {
  /** Longest a task may run once a worker has picked it up, ms. */
  taskMs: number;
  /** Longest a task may wait for a free worker, ms. */
  queueWaitMs: number;
  /** Old-generation heap cap of each worker thread, MB. */
  heapMb: number;
}

/** Defaults (config.ts reads ENGINE_TASK_SECONDS, ENGINE_QUEUE_WAIT_SECONDS, ENGINE_HEAP_MB). */
export const DEFAULT_ENGINE_LIMITS: EngineLimits = { taskMs: 20_000, queueWaitMs: 10_000, heapMb: 512 };

/** Why a task was stopped before it answered. */
export type EngineStop = 'time-limit' | 'queue-wait' | 'queue-full' | 'out-of-memory' | 'cancelled';

export class EngineStopped extends Error {
  constructor(readonly stop: EngineStop, readonly limits: EngineLimits) {
    super(`engine task stopped: ${stop}`);
    this.name = 'EngineStopped';
  }
}

// Resolved from the repo root: this file runs from server/workers under tsx and vitest alike.
const WORKER_FILE = path.resolve(process.cwd(), 'server/workers/engine-worker.mjs');

let limits: EngineLimits = DEFAULT_ENGINE_LIMITS;
let pool: Piscina<unknown, EngineResult> | null = null;
let tasksRun = 0;

/**
 * Sets the limits of this process's pool (createApp and the job runner call it with the
 * configuration). A heap change takes effect when the pool next starts.
 */
export function configureEnginePool(next: EngineLimits): void {
  limits = next;
}

function getPool(): Piscina<unknown, EngineResult> {
  if (!pool) {
    const threads = Number(process.env.ENGINE_THREADS) || defaultThreads();
    pool = new Piscina<unknown, EngineResult>({
      filename: pathToFileURL(WORKER_FILE).href,
      minThreads: 1,
      maxThreads: threads,
      maxQueue: MAX_QUEUE,
      idleTimeout: 60_000,
      // A worker that outgrows its heap dies alone (ERR_WORKER_OUT_OF_MEMORY), not the process.
      resourceLimits: { maxOldGenerationSizeMb: limits.heapMb, maxYoungGenerationSizeMb: Math.min(64, Math.ceil(limits.heapMb / 8)) },
    });
  }
  return pool;
}

/**
 * Starts the pool now: its first worker loads the engine (seconds on a busy machine), which
 * the first keeper to ask for advice after a boot would otherwise wait for. Call it after the
 * limits are configured (they fix the workers' heap cap when the pool starts).
 */
export function startEnginePool(): void {
  getPool();
}

/**
 * Runs one engine task on a worker thread within the limits; throws EngineStopped when it was
 * stopped (time, queue, memory, or `signal` aborted by the caller).
 */
export async function runOnEnginePool(task: EngineTask, options: { signal?: AbortSignal } = {}): Promise<EngineResult> {
  if (options.signal?.aborted) throw new EngineStopped('cancelled', limits);
  const current = limits;
  const abort = new AbortController();
  let stop: EngineStop | null = null;
  const end = (why: EngineStop) => {
    if (stop) return;
    stop = why;
    abort.abort(why);
  };
  // The worker says when it starts, so waiting for a thread and running are timed apart.
  const { port1, port2 } = new MessageChannel();
  let timer = setTimeout(() => end('queue-wait'), current.queueWaitMs);
  port1.once('message', () => {
    clearTimeout(timer);
    timer = setTimeout(() => end('time-limit'), current.taskMs);
  });
  port1.unref();
  const onCaller = () => end('cancelled');
  options.signal?.addEventListener('abort', onCaller, { once: true });
  try {
    const result = await getPool().run({ task, started: port2 }, { transferList: [port2] as never, signal: abort.signal });
    tasksRun++;
    return result;
  } catch (e) {
    if (stop) throw new EngineStopped(stop, current);
    const code = (e as { code?: unknown }).code;
    if (code === 'ERR_WORKER_OUT_OF_MEMORY') throw new EngineStopped('out-of-memory', current);
    if (e instanceof Error && /queue is at limit/i.test(e.message)) throw new EngineStopped('queue-full', current);
    throw e;
  } finally {
    clearTimeout(timer);
    options.signal?.removeEventListener('abort', onCaller);
    port1.close();
  }
}

/** How many tasks this process has run on the pool (tests use it to prove a cache hit). */
export function engineTasksRun(): number {
  return tasksRun;
}

/** Ends the worker threads (shutdown and test teardown); the next task starts a new pool. */
export async function closeEnginePool(): Promise<void> {
  const p = pool;
  pool = null;
  if (p) await p.destroy();
}
