// Worker-thread entry of the engine pool (engine-pool.ts). Node cannot load TypeScript on its
// own, so register tsx's ESM and CommonJS hooks in this thread first (the repo's .ts files are
// CommonJS-typed; the engine also imports ESM-only packages), then load the task module.
import { register as registerEsm } from 'tsx/esm/api';
import { register as registerCjs } from 'tsx/cjs/api';

registerCjs();
registerEsm();
// A CommonJS module imported from ESM: its exports may sit on `default` only.
const tasks = await import('./engine-tasks.ts');
const runEngineTask = tasks.runEngineTask ?? tasks.default?.runEngineTask;
if (typeof runEngineTask !== 'function') throw new Error('engine-tasks.ts exports no runEngineTask');

/** `started` is a port the pool listens on: the run-time limit counts from this message. */
export default function run({ task, started }) {
  started.postMessage(0);
  started.close();
  return runEngineTask(task);
}
