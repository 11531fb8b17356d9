import { settingsFor } from '../../server/detection/settings';
import { MonitoredAppliance, type ApplianceRef } from '../../server/monitor/monitored-appliance';
import { SILENT_AFTER_INTERVALS } from '../../server/telemetry/liveness';
import { HOUR_MS, MINUTE_MS } from './support/monitor-rig';

/**
 * Liveness counts from the later of the newest reading and the moment the monitor received
 * it: a sensor emptying a backlog (or the demo replaying the hours before start) reports now,
 * whatever its readings' times; one that sends nothing falls silent after three intervals.
 */
describe("an appliance's liveness", () => {
  const ref: ApplianceRef = { applianceId: 'a-1', unitId: 'u-1', propertyId: 'p-1', organizationId: 'org-a', style: 'fresh-food-only', intervalSeconds: 600 };
  const nowMs = Date.UTC(2026, 11, 1, 12);

  /** Every 10 minutes with a compressor ripple (a constant value would read as a stuck probe). */
  function readingsEnding(endMs: number, hours: number) {
    const readings = [];
    for (let t = endMs - hours * HOUR_MS; t <= endMs; t += 10 * MINUTE_MS) readings.push({ atMs: t, freshFoodC: 3.4 + 0.3 * Math.sin(t / (7 * MINUTE_MS)), freezerC: null, freshFoodFlag: null, freezerFlag: null, doorOpen: null });
    return readings;
  }

  it('is reporting while old readings arrive now, and silent once they stop', () => {
    const appliance = new MonitoredAppliance(ref, null, nowMs, settingsFor('fresh-food-only'));
    appliance.feed(readingsEnding(nowMs - 8 * HOUR_MS, 12));
    expect(appliance.healthAt(nowMs)).withContext('never heard from by this process: judged on the readings alone').toBe('silent');
    appliance.lastHeardMs = nowMs;
    expect(appliance.healthAt(nowMs)).not.toBe('silent');
    const limitMs = SILENT_AFTER_INTERVALS * ref.intervalSeconds * 1000;
    expect(appliance.healthAt(nowMs + limitMs)).not.toBe('silent');
    expect(appliance.healthAt(nowMs + limitMs + 1)).toBe('silent');
  });

  it('is reporting on fresh readings without the monitor having received anything', () => {
    const appliance = new MonitoredAppliance(ref, null, nowMs, settingsFor('fresh-food-only'));
    appliance.feed(readingsEnding(nowMs, 12));
    expect(appliance.lastHeardMs).toBeNull();
    expect(appliance.healthAt(nowMs + 5 * MINUTE_MS)).not.toBe('silent');
  });
});
