import { describe, expect, it } from 'vitest';
import { isLostJobCompletion } from '../../server/jobs/lost-completion';

/** An error as it reached process 'unhandledRejection' when PostgreSQL stopped while a pg-boss 10 job ran (captured on this stack). */
function withStack(message: string, stack: string): Error {
  const e = new Error(message);
  e.stack = stack;
  return e;
}

const REAL = withStack(
  'terminating connection due to administrator command',
  [
    'error: terminating connection due to administrator command',
    '    at /app/node_modules/pg-pool/index.js:45:11',
    '    at process.processTicksAndRejections (node:internal/process/task_queues:95:5)',
    '    at async Db.executeSql (/app/node_modules/pg-boss/src/db.js:42:14)',
    '    at async Manager.complete (/app/node_modules/pg-boss/src/manager.js:485:20)',
  ].join('\n'),
);

describe('isLostJobCompletion', () => {
  it("recognises pg-boss failing to record a job's end while the database is down", () => {
    expect(isLostJobCompletion(REAL)).toBe(true);
    expect(isLostJobCompletion(withStack('connect ECONNREFUSED', REAL.stack!.replace('Manager.complete', 'Manager.fail')))).toBe(true);
  });

  it('leaves every other unhandled rejection fatal', () => {
    expect(isLostJobCompletion(new Error('something else'))).toBe(false);
    expect(isLostJobCompletion(withStack('x', REAL.stack!.replace('Manager.complete', 'Manager.fetch')))).toBe(false);
    expect(isLostJobCompletion(withStack('x', '    at async Manager.complete (/app/server/jobs/runner.ts:1:1)'))).toBe(false);
    expect(isLostJobCompletion('a string')).toBe(false);
    expect(isLostJobCompletion(undefined)).toBe(false);
  });
});
