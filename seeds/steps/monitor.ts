import pino from 'pino';
import { EventBus } from '../../server/events/bus';
import { MonitorService } from '../../server/monitor/monitor-service';
import type { SeedContext, SeedStep } from '../context';
import type { MonitorFeed } from './history';

/**
 * The real monitor over the seeded history: the findings and incidents of the past trouble
 * come from the detection engine itself, and every appliance's learned normal is saved, so
 * the live monitor continues where the history ends instead of learning for a day. Nothing
 * listens on this bus: the past incidents' requests and work orders are the next step's.
 */
const BATCH_MS = 86_400_000;

function batchesOf(feed: MonitorFeed): MonitorFeed['readings'][] {
  const batches: MonitorFeed['readings'][] = [];
  let current: MonitorFeed['readings'] = [];
  for (const reading of feed.readings) {
    if (current.length && reading.atMs - current[0].atMs >= BATCH_MS) {
      batches.push(current);
      current = [];
    }
    current.push(reading);
  }
  if (current.length) batches.push(current);
  return batches;
}

export const monitorStep: SeedStep = {
  name: 'monitor: the detection engine over the history (past incidents, learned normals)',
  async run(context: SeedContext): Promise<void> {
    const feeds = context.facts.monitorFeeds as MonitorFeed[] | undefined;
    if (!feeds) throw new Error('the monitor step needs the history step first');
    let clockMs = 0;
    const service = new MonitorService({
      dataSource: context.dataSource,
      bus: new EventBus(),
      logger: pino({ level: 'silent' }),
      // The monitor's "now" is the reading time: the history is judged as it was lived.
      clock: { now: () => new Date(clockMs) },
    });
    let readings = 0;
    for (const feed of feeds) {
      for (const batch of batchesOf(feed)) {
        clockMs = batch[batch.length - 1].atMs;
        await service.handleBatch({ readings: batch, committedAtMs: clockMs });
        readings += batch.length;
      }
    }
    await service.idle();
    delete context.facts.monitorFeeds;
    const [counts] = await context.dataSource.query(`SELECT (SELECT count(*)::int FROM finding) AS findings, (SELECT count(*)::int FROM incident) AS incidents`);
    context.log(`${readings.toLocaleString('en-US')} readings judged: ${counts.findings} findings, ${counts.incidents} incidents`);
  },
};
