/**
 * The worker-thread pool for CPU-heavy engine work (forecast bands, advice searches,
 * ensembles, calibration), so the event loop keeps answering light routes (hardening.md,
 * "Scale"). One pool per process, started on first use; holds no state a second server
 * process would need.
 */
import os from 'node:os';
import path from 'node:path';
import { pathToFileURL } from 'node:url';
import { Piscina } from 'piscina';
import type { EngineResult, EngineTask } from './engine-tasks.js';

/** Threads: one fewer than the cores (the main thread needs one), at least 1, at most 4. */
export function defaultThreads(cores = os.availableParallelism()): number {
  return Math.max(1, Math.min(4, cores - 1));
}

/** Tasks waiting beyond this are refused (503) rather than queued for minutes. */
export const MAX_QUEUE = 64;

// Resolved from the repo root: this file runs from server/workers under tsx and vitest alike.
const WORKER_FILE = path.resolve(process.cwd(), 'server/workers/engine-worker.mjs');

let pool: Piscina<EngineTask, EngineResult> | null = null;
let tasksRun = 0;

function getPool(): Piscina<EngineTask, EngineResult> {
  if (!pool) {
    const threads = Number(process.env.ENGINE_THREADS) || defaultThreads();
    pool = new Piscina<EngineTask, EngineResult>({
      filename: pathToFileURL(WORKER_FILE).href,
      minThreads: 1,
      maxThreads: threads,
      maxQueue: MAX_QUEUE,
      idleTimeout: 60_000,
    });
  }
  return pool;
}

/**
 * Starts the pool now: its first worker loads the engine (seconds on a busy machine), which
 * the first keeper to ask for advice after a boot would otherwise wait for.
 */
export function startEnginePool(): void {
  getPool();
}

/** Runs one engine task on a worker thread. */
export async function runOnEnginePool(task: EngineTask): Promise<EngineResult> {
  const result = await getPool().run(task);
  tasksRun++;
  return result;
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
