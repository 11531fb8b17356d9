/**
 * The baseline to beat: a plain thermometer alarm that sounds when a probe has read above
 * its food-safety limit (40 °F fresh food, 0 °F freezer; U.S. FDA) for 30 minutes. It knows
 * nothing of the appliance's normal, of defrosts or of sensor codes.
 */
import type { Probe } from '../../../shared/domain';
import { FREEZER_LIMIT_C, FRESH_FOOD_LIMIT_C } from '../../../shared/temperature';
import type { SimSample } from '../../../simulator/model';

const ALARM_AFTER_MS = 30 * 60_000;

/** Times at which the alarm sounds; it re-arms once the probe reads at or below its limit. */
export function thermometerAlarms(trace: readonly SimSample[], probes: readonly Probe[]): number[] {
  const alarms: number[] = [];
  for (const probe of probes) {
    const limitC = probe === 'fresh_food' ? FRESH_FOOD_LIMIT_C : FREEZER_LIMIT_C;
    let aboveSinceMs: number | null = null;
    let sounded = false;
    for (const s of trace) {
      const value = probe === 'fresh_food' ? s.freshFoodC : s.freezerC;
      if (value === null) continue;
      if (value <= limitC) {
        aboveSinceMs = null;
        sounded = false;
        continue;
      }
      aboveSinceMs ??= s.atMs;
      if (!sounded && s.atMs - aboveSinceMs >= ALARM_AFTER_MS) {
        alarms.push(s.atMs);
        sounded = true;
      }
    }
  }
  return alarms.sort((a, b) => a - b);
}
