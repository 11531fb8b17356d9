import fs from 'node:fs';
import path from 'node:path';
import type { StoredReading } from '../../server/ingest/store';
import { SIMULATOR_STATE_FILE_NAME } from '../../simulator/cli/fleet';
import type { ResumeState } from '../../simulator/cli/fleet-runner';
import { generateTrace } from '../../simulator/model';
import type { SeedContext, SeedStep } from '../context';
import { analyzeReadings, ensurePartitions, insertReadingsInChunks, storedReadingOf } from '../history/readings';
import { historyFaultsOf, liveStartMsOf } from '../scenario/faults';
import { PAST_TROUBLE } from '../scenario/past-repairs';
import { appliancesOf, DAY_MS, SENSOR_INTERVAL_SECONDS, type PlannedAppliance, type ScenarioPlan } from '../scenario/plan';

/**
 * Months of readings for every appliance, from the day its sensor was fitted to the live
 * start, simulated by the appliance model with the scenario's faults in them, and written
 * with their rollups. Also notes where each sensor stopped (the simulator continues from
 * there) and keeps the readings the monitor step replays.
 *
 * Facts: monitorFeeds (readings per appliance key, in time order), liveStartMs.
 */
/**
 * Physics step of the backfill, six times the live 20 s: the nodes relax exactly over any
 * step (physics.ts) and the defrost unit's detections came out the same at 20 and 60 s.
 */
const BACKFILL_STEP_MS = 120_000;
/** The monitor replays this much before the live start for every appliance: a day of learning and the level windows. */
const MONITOR_PRIMING_DAYS = 3;
/** And from this long before each past trouble, so the engine knows the unit's normal first. */
const TROUBLE_LEAD_DAYS = 2;
const INTERVAL_MS = SENSOR_INTERVAL_SECONDS * 1000;

export interface MonitorFeed {
  applianceKey: string;
  readings: StoredReading[];
}

function monitorFromMs(plan: ScenarioPlan, appliance: PlannedAppliance, liveStartMs: number): number {
  const troubleStarts = PAST_TROUBLE.filter((trouble) => trouble.applianceKey === appliance.key).map((trouble) => plan.nowMs - (trouble.startDaysAgo + TROUBLE_LEAD_DAYS) * DAY_MS);
  return Math.max(appliance.monitoredFromMs, Math.min(liveStartMs - MONITOR_PRIMING_DAYS * DAY_MS, ...troubleStarts));
}

function simulate(plan: ScenarioPlan, appliance: PlannedAppliance, liveStartMs: number, ids: { sensorId: string; applianceId: string }): StoredReading[] {
  const samples = generateTrace({
    profile: appliance.profile,
    seed: appliance.seed,
    startMs: appliance.monitoredFromMs,
    // Up to and including the live start's slot.
    durationMs: liveStartMs - appliance.monitoredFromMs + 1,
    intervalMs: INTERVAL_MS,
    faults: historyFaultsOf(plan, appliance),
    stepMs: BACKFILL_STEP_MS,
  });
  const sensor = { deviceId: appliance.deviceId, ...ids };
  // A lost reading used up its sequence number, as on a real sensor.
  return samples.map((sample) => storedReadingOf(sample, Math.round((sample.atMs - appliance.monitoredFromMs) / INTERVAL_MS), sensor));
}

function writeResumeState(dataDir: string, plan: ScenarioPlan, liveStartMs: number): void {
  const state: ResumeState = {};
  for (const appliance of appliancesOf(plan)) state[appliance.deviceId] = { lastAtMs: liveStartMs, seq: Math.round((liveStartMs - appliance.monitoredFromMs) / INTERVAL_MS) };
  fs.writeFileSync(path.join(dataDir, SIMULATOR_STATE_FILE_NAME), JSON.stringify(state));
}

export const historyStep: SeedStep = {
  name: 'history: months of readings from the appliance model, with their rollups',
  async run(context: SeedContext): Promise<void> {
    const plan = context.facts.plan as ScenarioPlan | undefined;
    if (!plan) throw new Error('the history step needs the scenario (run the scenario step first)');
    const applianceIds = context.facts.applianceIds as Record<string, string>;
    const sensorIds = context.facts.sensorIds as Record<string, string>;
    const liveStartMs = liveStartMsOf(plan);
    const appliances = appliancesOf(plan);
    await ensurePartitions(context.dataSource, Math.min(...appliances.map((a) => a.monitoredFromMs)), plan.nowMs);
    const feeds: MonitorFeed[] = [];
    let rows = 0;
    // Simulate the next appliance while the database stores the previous one.
    let writing: Promise<void> = Promise.resolve();
    for (const appliance of appliances) {
      const readings = simulate(plan, appliance, liveStartMs, { sensorId: sensorIds[appliance.key], applianceId: applianceIds[appliance.key] });
      const fromMs = monitorFromMs(plan, appliance, liveStartMs);
      feeds.push({ applianceKey: appliance.key, readings: readings.filter((reading) => reading.atMs >= fromMs) });
      rows += readings.length;
      await writing;
      writing = insertReadingsInChunks(context.dataSource, readings);
    }
    await writing;
    await analyzeReadings(context.dataSource);
    writeResumeState(context.dataDir, plan, liveStartMs);
    Object.assign(context.facts, { monitorFeeds: feeds, liveStartMs });
    context.log(`${rows.toLocaleString('en-US')} readings up to ${new Date(liveStartMs).toISOString()}, where the simulator continues`);
  },
};
