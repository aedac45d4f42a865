import type { Logger } from './logger.js';

/**
 * Work that runs after the response has gone (e.g. sending an e-mail, so the response time
 * does not reveal whether an account exists). Shutdown and tests wait for it with `drain()`.
 */
export class BackgroundTasks {
  private readonly pending = new Set<Promise<void>>();

  constructor(private readonly logger: Logger) {}

  run(name: string, task: () => Promise<void>): void {
    const p = Promise.resolve()
      .then(task)
      .catch((err: unknown) => this.logger.log('error', 'background.failed', { task: name, error: String(err) }))
      .finally(() => this.pending.delete(p));
    this.pending.add(p);
  }

  async drain(): Promise<void> {
    while (this.pending.size > 0) await Promise.all([...this.pending]);
  }
}
