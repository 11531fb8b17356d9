import type { Pool } from 'pg';
import type { Logger } from 'pino';
import { writeRejects, type RejectEntry } from '../server/ingest/rejects';

/**
 * The broker's rejects (failed sign-ins, refused publishes and subscriptions), written to
 * the same tables as the ingest's once a second. Bounded: past `maxBuffered` the newest
 * are dropped and only logged, so a sign-in storm cannot exhaust the broker's memory.
 */
export class RejectSink {
  private buffer: RejectEntry[] = [];
  private dropped = 0;
  private readonly timer: NodeJS.Timeout;

  constructor(
    private readonly pool: Pool,
    private readonly logger: Logger,
    private readonly maxBuffered = 10_000,
    flushIntervalMs = 1000,
  ) {
    this.timer = setInterval(() => void this.flush(), flushIntervalMs);
    this.timer.unref();
  }

  record(entry: Omit<RejectEntry, 'source' | 'atMs'>): void {
    if (this.buffer.length >= this.maxBuffered) {
      this.dropped++;
      return;
    }
    this.buffer.push({ ...entry, source: 'broker', atMs: Date.now() });
  }

  async flush(): Promise<void> {
    if (!this.buffer.length) return;
    const entries = this.buffer;
    this.buffer = [];
    try {
      await writeRejects(this.pool, entries);
    } catch (error) {
      // A database outage: keep what fits for the next round.
      this.buffer = entries.concat(this.buffer).slice(0, this.maxBuffered);
      this.logger.warn({ err: error }, 'broker: could not record rejects yet');
    }
    if (this.dropped) {
      this.logger.warn({ dropped: this.dropped }, 'broker: rejects dropped while the buffer was full');
      this.dropped = 0;
    }
  }

  async close(): Promise<void> {
    clearInterval(this.timer);
    await this.flush();
  }
}
