import type { Logger } from 'pino';

/**
 * Work queued inside a transaction to run once it committed: e-mails and live events
 * must never announce a change that was rolled back. A failing task is logged only.
 */
export class AfterCommit {
  private readonly tasks: (() => Promise<void>)[] = [];

  later(task: () => Promise<void>): void {
    this.tasks.push(task);
  }

  async run(logger: Logger): Promise<void> {
    for (const task of this.tasks.splice(0)) {
      try {
        await task();
      } catch (error) {
        logger.error({ err: error }, 'work orders: a follow-up of a committed change failed');
      }
    }
  }
}
