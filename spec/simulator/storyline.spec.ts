/**
 * The live storyline as the simulator plays it after the seeded history (no broker): the
 * model of each storyline appliance from where the seed stopped, with the fleet file's
 * schedule, shows the promised faults in order within the replay window.
 */
import { DetectionEngine } from '../../server/detection/engine';
import { settingsFor } from '../../server/detection/settings';
import { FRESH_FOOD_LIMIT_C } from '../../shared/temperature';
import { liveStartMsOf, scenarioFleetFile } from '../../seeds/scenario/faults';
import { appliancesOf, applianceByKey, DEFAULT_SCENARIO_SEED, planScenario, SENSOR_INTERVAL_SECONDS, type PlannedAppliance } from '../../seeds/scenario/plan';
import { STORYLINE, STORYLINE_REPLAY_HOURS } from '../../seeds/scenario/storyline';
import { warmupStartMs } from '../../simulator/cli/fleet-runner';
import { faultsFor } from '../../simulator/cli/schedule';
import { ApplianceSimulator, DISCONNECTED_SENTINEL_C, type SimSample } from '../../simulator/model';

const HOUR_MS = 3_600_000;
const INTERVAL_MS = SENSOR_INTERVAL_SECONDS * 1000;
const NOW_MS = Date.UTC(2026, 11, 1, 18, 0);
const plan = planScenario(DEFAULT_SCENARIO_SEED, NOW_MS);
const liveStartMs = liveStartMsOf(plan);
const replayEndMs = liveStartMs + STORYLINE_REPLAY_HOURS * HOUR_MS;
const fleet = scenarioFleetFile(plan, {}, {});

/** What the live simulator publishes for one appliance: continuing after the live start, warmed up through ongoing faults. */
function livePlay(appliance: PlannedAppliance, untilMs: number, firstAtMs = liveStartMs + INTERVAL_MS): SimSample[] {
  const device = fleet.devices.find((candidate) => candidate.deviceId === appliance.deviceId)!;
  const faults = faultsFor(device, fleet.faults);
  const sim = new ApplianceSimulator(device.profile, { seed: device.seed, startMs: warmupStartMs(firstAtMs, faults), faults });
  const samples: SimSample[] = [];
  for (let atMs = firstAtMs; atMs <= untilMs; atMs += INTERVAL_MS) {
    sim.advanceTo(atMs);
    const sample = sim.sample();
    if (sample) samples.push(sample);
  }
  return samples;
}

interface OpenedFinding {
  atMs: number;
  kind: string;
  severity: string;
  cause: string | undefined;
}

/** Findings the real detection engine opens over the samples, in order. */
function openedFindings(appliance: PlannedAppliance, samples: SimSample[]): OpenedFinding[] {
  const engine = new DetectionEngine(appliance.style, settingsFor(appliance.style));
  const opened: OpenedFinding[] = [];
  for (const sample of samples) {
    for (const event of engine.push({ atMs: sample.atMs, freshFoodC: sample.freshFoodC, freezerC: sample.freezerC, doorOpen: sample.doorOpen })) {
      if (event.type === 'opened') opened.push({ atMs: event.atMs, kind: event.finding.kind, severity: event.finding.severity, cause: event.finding.probableCauses[0]?.code });
    }
  }
  return opened;
}

function firstAt(samples: SimSample[], test: (sample: SimSample) => boolean): number | null {
  return samples.find(test)?.atMs ?? null;
}

/** Median of the readings in the hour before each sample, the way a level is judged (common practice: ignores one door opening). */
function hourMedian(samples: SimSample[], index: number, pick: (sample: SimSample) => number | null): number {
  const values = samples
    .filter((s) => s.atMs > samples[index].atMs - HOUR_MS && s.atMs <= samples[index].atMs)
    .map(pick)
    .filter((v): v is number => v !== null && v > DISCONNECTED_SENTINEL_C)
    .sort((a, b) => a - b);
  return values[Math.floor(values.length / 2)];
}

function firstLevelAbove(samples: SimSample[], pick: (sample: SimSample) => number | null, limitC: number): number | null {
  const index = samples.findIndex((_, i) => hourMedian(samples, i, pick) > limitC);
  return index >= 0 ? samples[index].atMs : null;
}

const stepOf = (fault: string) => STORYLINE.find((step) => step.fault === fault)!;

describe('live storyline (simulator model, no broker)', () => {
  const fan = livePlay(applianceByKey(plan, stepOf('evaporator-fan').applianceKey!), replayEndMs);
  const sensor = livePlay(applianceByKey(plan, stepOf('sensor-disconnected').applianceKey!), replayEndMs);
  const powerAppliances = appliancesOf(plan).filter((appliance) => appliance.propertyKey === stepOf('power-loss').propertyKey);
  const power = powerAppliances.map((appliance) => livePlay(appliance, replayEndMs + 48 * HOUR_MS));

  it('schedules the faults in the promised order, all starting before the replay catches up', () => {
    expect(STORYLINE.map((step) => step.fault)).toEqual(['defrost-system', 'evaporator-fan', 'sensor-disconnected', 'power-loss']);
    const starts = STORYLINE.map((step) => step.startH);
    expect([...starts].sort((a, b) => a - b)).toEqual(starts);
    expect(Math.max(...starts)).toBeLessThan(STORYLINE_REPLAY_HOURS);
  });

  it('defrost failure: food safe at the live start, a warming trend around the replay, too warm only a day or more after it', () => {
    const appliance = applianceByKey(plan, stepOf('defrost-system').applianceKey!);
    const fresh = (s: SimSample) => s.freshFoodC;
    const play = livePlay(appliance, replayEndMs + 3 * 24 * HOUR_MS, liveStartMs - 3 * 24 * HOUR_MS);
    const atLive = play.findIndex((s) => s.atMs >= liveStartMs);
    // U.S. FDA: fresh food at or below 40 °F (4.4 °C).
    expect(hourMedian(play, atLive, fresh)).toBeLessThan(FRESH_FOOD_LIMIT_C - 1);
    const opened = openedFindings(appliance, play);
    const trend = opened.find((finding) => finding.kind === 'warming-trend');
    const warm = opened.find((finding) => finding.kind === 'over-temperature');
    expect(trend?.severity).toBe('watch');
    expect(trend!.atMs).toBeGreaterThan(liveStartMs - 12 * HOUR_MS);
    expect(trend!.atMs).toBeLessThan(replayEndMs);
    expect(warm!.atMs - trend!.atMs).toBeGreaterThan(24 * HOUR_MS);
    expect(firstLevelAbove(play, fresh, FRESH_FOOD_LIMIT_C)!).toBeGreaterThan(trend!.atMs + 24 * HOUR_MS);
  });

  it('evaporator fan: the freezer is not cold enough within hours, and the engine calls it urgent in the replay', () => {
    const startMs = liveStartMs + stepOf('evaporator-fan').startH * HOUR_MS;
    const freezer = (s: SimSample) => s.freezerC;
    expect(firstLevelAbove(fan.filter((s) => s.atMs < startMs), freezer, -15)).toBeNull();
    const warmAtMs = firstLevelAbove(fan, freezer, -15);
    expect(warmAtMs!).toBeGreaterThan(startMs);
    expect(warmAtMs! - startMs).toBeLessThan(6 * HOUR_MS);
    // The real engine, fed from a day before the fault, concludes an urgent finding before the replay ends.
    const appliance = applianceByKey(plan, stepOf('evaporator-fan').applianceKey!);
    const urgent = openedFindings(appliance, livePlay(appliance, replayEndMs, liveStartMs - 30 * HOUR_MS)).find((finding) => finding.severity === 'urgent');
    expect(urgent).toBeDefined();
    expect(urgent!.atMs).toBeGreaterThan(startMs);
    expect(urgent!.atMs).toBeLessThan(replayEndMs);
    expect(urgent!.cause).toBe('evaporator-fan');
  });

  it('disconnected sensor: the freezer probe reads −127 for the scheduled hours only, the fresh-food probe never', () => {
    const step = stepOf('sensor-disconnected');
    const startMs = liveStartMs + step.startH * HOUR_MS;
    const endMs = startMs + step.forH! * HOUR_MS;
    const disconnected = sensor.filter((s) => s.freezerC === DISCONNECTED_SENTINEL_C);
    expect(disconnected.length).toBeGreaterThan(0);
    expect(Math.min(...disconnected.map((s) => s.atMs))).toBeGreaterThanOrEqual(startMs);
    expect(Math.max(...disconnected.map((s) => s.atMs))).toBeLessThan(endMs);
    expect(sensor.some((s) => s.freshFoodC === DISCONNECTED_SENTINEL_C)).toBeFalse();
    expect(firstAt(sensor, (s) => s.freezerC === DISCONNECTED_SENTINEL_C)!).toBeGreaterThan(liveStartMs + stepOf('evaporator-fan').startH * HOUR_MS);
  });

  it('power loss: every appliance of the property stops and warms together, after the sensor fault, and all recover', () => {
    const step = stepOf('power-loss');
    const startMs = liveStartMs + step.startH * HOUR_MS;
    const endMs = startMs + step.forH! * HOUR_MS;
    expect(power.length).toBeGreaterThanOrEqual(3);
    expect(startMs).toBeGreaterThan(firstAt(sensor, (s) => s.freezerC === DISCONNECTED_SENTINEL_C)!);
    for (const samples of power) {
      const outage = samples.filter((s) => s.atMs >= startMs && s.atMs < endMs);
      expect(outage.every((s) => !s.compressorOn)).toBeTrue();
      const probe = (s: SimSample) => s.freezerC ?? s.freshFoodC;
      const before = hourMedian(samples, samples.findIndex((s) => s.atMs >= startMs), probe);
      expect(probe(outage[outage.length - 1])!).toBeGreaterThan(before + 1);
      expect(samples.filter((s) => s.atMs > endMs).some((s) => s.compressorOn)).toBeTrue();
      // A day and a half later the cabinet is back within a compressor cycle's swing of where it was (the contents take hours to pull down).
      const dayAfter = samples.findIndex((s) => s.atMs >= endMs + 36 * HOUR_MS);
      expect(hourMedian(samples, dayAfter, probe)).toBeLessThan(before + 2);
    }
  });
});
