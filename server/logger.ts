/**
 * One JSON line per event on stdout/stderr. Callers pass facts, never secrets (no passwords,
 * tokens, session ids or cookies).
 */
export type LogLevel = 'info' | 'warn' | 'error';
export type LogFields = Record<string, string | number | boolean | null | undefined>;

export interface Logger {
  log(level: LogLevel, event: string, fields?: LogFields): void;
}

export const consoleLogger: Logger = {
  log(level, event, fields = {}) {
    const line = JSON.stringify({ time: new Date().toISOString(), level, event, ...fields });
    if (level === 'info') console.log(line);
    else console.error(line);
  },
};

/** Keeps entries in memory: for tests that check what was logged. */
export function memoryLogger(): Logger & { entries: { level: LogLevel; event: string; fields: LogFields }[] } {
  const entries: { level: LogLevel; event: string; fields: LogFields }[] = [];
  return {
    entries,
    log(level, event, fields = {}) {
      entries.push({ level, event, fields });
    },
  };
}
