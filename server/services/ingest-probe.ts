import type { ComponentHealth } from '../../shared/api/health';
import type { PipelineStats } from '../ingest/pipeline';
import type { ComponentProbe } from './health';

/** What the probe reads of the ingest worker (IngestWorker.stats()). */
export interface IngestStatsSource {
  stats(): PipelineStats & { connected: boolean };
}

const count = (n: number) => n.toLocaleString('en-US');

function ago(fromMs: number, nowMs: number): string {
  const seconds = Math.max(0, Math.round((nowMs - fromMs) / 1000));
  if (seconds < 120) return `${seconds} s ago`;
  if (seconds < 7200) return `${Math.round(seconds / 60)} min ago`;
  return `${Math.round(seconds / 3600)} h ago`;
}

/** Messages that never became a reading; a probe error value is stored (as a flag), so it is not one. */
function refusedTotal(stats: PipelineStats): number {
  return Object.entries(stats.rejected).reduce((sum, [reason, n]) => (reason === 'sensor-error-value' ? sum : sum + (n ?? 0)), 0);
}

/**
 * The ingest as the status page shows it. Down while it is cut off from the broker or
 * while storing keeps failing (readings then wait, unacknowledged, in the broker, so none
 * is lost; the detail says since when). Up, it says how much it stored and refused.
 */
export function describeIngest(stats: PipelineStats & { connected: boolean }, nowMs: number): ComponentHealth {
  if (!stats.connected) return { state: 'down', latencyMs: null, detail: 'not connected to the broker; reconnecting (readings wait in the broker meanwhile)' };
  if (stats.failingSinceMs !== null) {
    const since = new Date(stats.failingSinceMs).toISOString().slice(11, 19);
    return { state: 'down', latencyMs: null, detail: `storing readings has failed since ${since} UTC (${count(stats.retries)} retries): ${stats.lastError ?? 'unknown error'}; readings wait in the broker` };
  }
  const last = stats.lastCommitAtMs === null ? 'no batch yet' : `last batch ${ago(stats.lastCommitAtMs, nowMs)}`;
  const flagged = stats.rejected['sensor-error-value'] ?? 0;
  const stored = `${count(stats.stored)} readings stored since start${flagged ? ` (${count(flagged)} probe error values kept as flags)` : ''}`;
  return { state: 'up', latencyMs: null, detail: `${stored}, ${count(refusedTotal(stats))} refused, ${count(stats.duplicates)} duplicates skipped; ${last}` };
}

export function ingestProbe(source: IngestStatsSource, now: () => number = Date.now): ComponentProbe {
  return async () => describeIngest(source.stats(), now());
}
