import type { PipelineStats } from '../../server/ingest/pipeline';
import { describeIngest, ingestProbe } from '../../server/services/ingest-probe';

const NOW_MS = Date.UTC(2026, 11, 2, 10, 0, 0);

function stats(overrides: Partial<PipelineStats & { connected: boolean }> = {}): PipelineStats & { connected: boolean } {
  return {
    received: 1300,
    stored: 1234,
    duplicates: 50,
    rejected: { schema: 3, 'not-json': 2 },
    batches: 40,
    retries: 0,
    droppedQos0: 0,
    queued: 0,
    lastError: null,
    lastCommitAtMs: NOW_MS - 4000,
    failingSinceMs: null,
    connected: true,
    ...overrides,
  };
}

describe('the ingest on the status page', () => {
  it('is up with what it stored, refused and skipped, and when it last committed', () => {
    expect(describeIngest(stats(), NOW_MS)).toEqual({ state: 'up', latencyMs: null, detail: '1,234 readings stored since start, 5 refused, 50 duplicates skipped; last batch 4 s ago' });
    expect(describeIngest(stats({ lastCommitAtMs: NOW_MS - 30 * 60_000 }), NOW_MS).detail).toContain('last batch 30 min ago');
    expect(describeIngest(stats({ lastCommitAtMs: null, stored: 0 }), NOW_MS).detail).toContain('no batch yet');
  });

  it('counts a probe error value as stored with a flag, not as refused', () => {
    const detail = describeIngest(stats({ rejected: { 'sensor-error-value': 8, schema: 1 } }), NOW_MS).detail;
    expect(detail).toBe('1,234 readings stored since start (8 probe error values kept as flags), 1 refused, 50 duplicates skipped; last batch 4 s ago');
  });

  it('is down while cut off from the broker', () => {
    expect(describeIngest(stats({ connected: false }), NOW_MS)).toEqual(jasmine.objectContaining({ state: 'down', detail: jasmine.stringMatching(/^not connected to the broker/) }));
  });

  it('is down while storing fails, saying since when and why', () => {
    const failing = stats({ failingSinceMs: Date.UTC(2026, 11, 2, 9, 58, 30), retries: 7, lastError: 'connect ECONNREFUSED 127.0.0.1:5432' });
    expect(describeIngest(failing, NOW_MS).state).toBe('down');
    expect(describeIngest(failing, NOW_MS).detail).toBe('storing readings has failed since 09:58:30 UTC (7 retries): connect ECONNREFUSED 127.0.0.1:5432; readings wait in the broker');
  });

  it('reads the worker afresh on every probe', async () => {
    let current = stats();
    const probe = ingestProbe({ stats: () => current }, () => NOW_MS);
    expect((await probe()).state).toBe('up');
    current = stats({ connected: false });
    expect((await probe()).state).toBe('down');
  });
});
