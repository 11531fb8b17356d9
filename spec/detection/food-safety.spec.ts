import { DetectionEngine } from '../../server/detection/engine';
import { DEFAULT_SETTINGS, settingsFor } from '../../server/detection/settings';
import { FREEZER_LIMIT_C, FRESH_FOOD_LIMIT_C } from '../../shared/temperature';
import { HOUR_MS, MINUTE_MS, run, signal, START_MS } from './support/traces';

const spell = (fromH: number, minutes: number, riseC: number) => (atMs: number) => {
  const inside = atMs >= START_MS + fromH * HOUR_MS && atMs < START_MS + fromH * HOUR_MS + minutes * MINUTE_MS;
  return inside ? riseC : 0;
};

describe('food-safety thresholds', () => {
  it('uses 40 °F and 0 °F as the limits (U.S. FDA, "Refrigerator Thermometers: Cold Facts about Food Safety")', () => {
    // °F → °C exactly as NIST SP 811, Appendix B.8: 40 °F = 4.444… °C, 0 °F = −17.777… °C.
    expect(DEFAULT_SETTINGS.freshFoodLimitC).toBeCloseTo(40 / 9, 12);
    expect(DEFAULT_SETTINGS.freezerLimitC).toBeCloseTo(-160 / 9, 12);
    expect(FRESH_FOOD_LIMIT_C).toBeCloseTo(4.4444444444, 9);
    expect(FREEZER_LIMIT_C).toBeCloseTo(-17.7777777778, 9);
  });

  it('uses the 2-hour rule for food at risk (USDA FSIS, "Danger Zone (40 °F – 140 °F)")', () => {
    expect(DEFAULT_SETTINGS.foodAtRiskMinutes).toBe(120);
  });
});

describe('over-temperature', () => {
  const learnedDayThen = (add: (t: number) => { fresh?: number; freezer?: number }) => signal({ hours: 36, add });

  it('counts the minutes above 40 °F and turns critical past 2 hours above it (USDA FSIS 2-hour rule)', () => {
    const readings = learnedDayThen((t) => ({ fresh: spell(26, 150, 3.5)(t) }));
    const result = run(readings, 'top-freezer');
    const over = result.findings.filter((f) => f.kind === 'over-temperature' && f.compartment === 'fresh_food');
    expect(over.length).toBe(1);
    const finding = over[0];
    expect(finding.minutesAbove4c).toBeGreaterThanOrEqual(140);
    expect(finding.minutesAbove4c).toBeLessThanOrEqual(155);
    expect(finding.severity).toBe('critical');
    expect(finding.endedAtMs).not.toBeNull();
    // Detected after the grace period, using only readings up to then.
    expect(finding.detectedAtMs - finding.startedAtMs).toBeGreaterThanOrEqual(DEFAULT_SETTINGS.freshOverTempGraceMinutes * MINUTE_MS);
    const openedAs = result.events.find((e) => e.type === 'opened' && e.finding.id === finding.id)!.finding;
    expect(openedAs.severity).toBe('urgent');
  });

  it('raises nothing for a warm spell shorter than the grace period (a door left open for 40 minutes)', () => {
    const result = run(learnedDayThen((t) => ({ fresh: spell(26, 40, 3.5)(t) })), 'top-freezer');
    expect(result.findings.filter((f) => f.kind === 'over-temperature')).toEqual([]);
  });

  it('alarms for a freezer held above 0 °F past its grace period', () => {
    const result = run(learnedDayThen((t) => ({ freezer: spell(26, 180, 4.5)(t) })), 'top-freezer');
    const over = result.findings.filter((f) => f.kind === 'over-temperature' && f.compartment === 'freezer');
    expect(over.length).toBe(1);
    expect(over[0].detectedAtMs - over[0].startedAtMs).toBeGreaterThanOrEqual(DEFAULT_SETTINGS.freezerOverTempGraceMinutes * MINUTE_MS);
  });

  it('gives the freezer a margin above 0 °F for its thermostat swing, which a manager can set to zero', () => {
    // Half a degree above 0 °F for four hours: inside the default margin.
    const justAbove = signal({ hours: 36, freezerSwingC: 0.2, add: (t) => ({ freezer: spell(26, 240, 19 + FREEZER_LIMIT_C + 0.5)(t) }) });
    expect(run(justAbove, 'top-freezer').findings.filter((f) => f.kind === 'over-temperature')).toEqual([]);
    const strict = new DetectionEngine('top-freezer', settingsFor('top-freezer', { freezerAlarmMarginC: 0 }));
    const strictRun = run(justAbove, 'top-freezer', strict);
    expect(strictRun.findings.some((f) => f.kind === 'over-temperature' && f.compartment === 'freezer')).toBeTrue();
  });
});
