/**
 * The scenario's faults in the simulator's terms: the ones written into the seeded history
 * (past trouble and storyline faults that began before the live start), and the storyline
 * as the fleet file's schedule for the live simulator.
 */
import type { FleetDevice, FleetFault, FleetFile } from '../../simulator/cli/fleet';
import type { ScheduledFault } from '../../simulator/model';
import { PAST_TROUBLE } from './past-repairs';
import { appliancesOf, DAY_MS, SENSOR_INTERVAL_SECONDS, type PlannedAppliance, type ScenarioPlan } from './plan';
import { STORYLINE, STORYLINE_REPLAY_HOURS, storylineWindowMs } from './storyline';

const HOUR_MS = 3_600_000;

/** The end of the seeded history: the simulator replays from here at the storyline's speed. */
export function liveStartMsOf(plan: ScenarioPlan): number {
  return plan.nowMs - STORYLINE_REPLAY_HOURS * HOUR_MS;
}

export function pastFaultsOf(plan: ScenarioPlan, appliance: PlannedAppliance): ScheduledFault[] {
  return PAST_TROUBLE.filter((trouble) => trouble.applianceKey === appliance.key).map((trouble) => {
    const startMs = plan.nowMs - trouble.startDaysAgo * DAY_MS;
    return { fault: trouble.fault, startMs, endMs: startMs + trouble.lastsH * HOUR_MS, severity: trouble.severity, probe: trouble.probe };
  });
}

export function storylineFaultsOf(plan: ScenarioPlan, appliance: PlannedAppliance): ScheduledFault[] {
  const liveStartMs = liveStartMsOf(plan);
  return STORYLINE.filter((step) => step.applianceKey === appliance.key || step.propertyKey === appliance.propertyKey).map((step) => ({
    fault: step.fault,
    ...storylineWindowMs(liveStartMs, step),
    probe: step.probe,
  }));
}

/** Every fault the seeded trace of one appliance carries. */
export function historyFaultsOf(plan: ScenarioPlan, appliance: PlannedAppliance): ScheduledFault[] {
  return [...pastFaultsOf(plan, appliance), ...storylineFaultsOf(plan, appliance)];
}

export function storylineFleetFaults(plan: ScenarioPlan): FleetFault[] {
  const liveStartMs = liveStartMsOf(plan);
  const deviceOf = (key: string) => appliancesOf(plan).find((appliance) => appliance.key === key)?.deviceId;
  return STORYLINE.map((step) => ({
    fault: step.fault,
    ...(step.applianceKey ? { deviceId: deviceOf(step.applianceKey) } : { propertyKey: step.propertyKey }),
    ...storylineWindowMs(liveStartMs, step),
    ...(step.probe ? { probe: step.probe } : {}),
  }));
}

/** The simulator's fleet file for the scenario; `applianceIds` by appliance key. */
export function scenarioFleetFile(plan: ScenarioPlan, secrets: Record<string, string>, applianceIds: Record<string, string>): FleetFile {
  const devices: FleetDevice[] = appliancesOf(plan).map((appliance) => ({
    deviceId: appliance.deviceId,
    secret: secrets[appliance.key],
    propertyKey: appliance.propertyKey,
    unitLabel: appliance.unitLabel,
    applianceId: applianceIds[appliance.key] ?? null,
    style: appliance.style,
    model: appliance.model,
    intervalSeconds: SENSOR_INTERVAL_SECONDS,
    seed: appliance.seed,
    profile: appliance.profile,
  }));
  const properties = plan.properties.map(({ key, name, addressLine1, city, region, postalCode, timeZone, utcOffsetHours }) => ({
    key,
    name,
    addressLine1,
    city,
    region,
    postalCode,
    timeZone,
    utcOffsetHours,
  }));
  return { version: 1, seed: plan.seed, properties, devices, faults: storylineFleetFaults(plan) };
}
