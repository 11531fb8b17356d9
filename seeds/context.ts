import type { DataSource } from 'typeorm';

/** What every seed step gets. Steps run in order and share `facts` to pass ids along. */
export interface SeedContext {
  dataSource: DataSource;
  /** Seeding is deterministic from this number. */
  seed: number;
  /** The project's git-ignored data folder (the simulator's fleet file goes there). */
  dataDir: string;
  /** "Now" for the scenario, so backfilled history ends at start time. */
  nowMs: number;
  /** Limits the history to this many days before the live start (quick seeds for specs); default the whole scenario. */
  historyDays?: number;
  facts: Record<string, unknown>;
  log(message: string): void;
}

export interface SeedStep {
  name: string;
  run(context: SeedContext): Promise<void>;
}
