/**
 * Departures from the appliance's own rhythm that do not warm the cabinet: the compressor
 * duty estimate climbing toward continuous running, and a freezer drifting far colder than
 * its normal while the fresh food holds (a damper stuck closed). Reported as a watch-level
 * warming-trend (DESIGN.md has no kind for "runs too much").
 */
import { closeDutyBucket, dutyExcess, finishDutyLearning, newDutyState, trackDuty } from '../../server/detection/duty';
import { DetectionEngine } from '../../server/detection/engine';
import { DEFAULT_SETTINGS } from '../../server/detection/settings';
import { lambdaForGap } from '../../server/detection/stats';
import type { EngineReading } from '../../server/detection/types';
import { DAY_MS, HOUR_MS, MINUTE_MS, repairFindings, run, simulate, START_MS } from './support/traces';

/** A freezer sawtooth: falls 1.5 °C while the compressor runs, rises back while it rests. */
function sawtooth(atMs: number, onMinutes: number, offMinutes: number): number {
  const periodMs = (onMinutes + offMinutes) * MINUTE_MS;
  const phaseMs = (atMs - START_MS) % periodMs;
  const onMs = onMinutes * MINUTE_MS;
  return phaseMs < onMs ? -17 - (1.5 * phaseMs) / onMs : -18.5 + (1.5 * (phaseMs - onMs)) / (periodMs - onMs);
}

function dutyOf(onMinutes: number, offMinutes: number, intervalMinutes: number, hours = 24): number {
  const d = newDutyState();
  const bucketMs = DEFAULT_SETTINGS.bucketMinutes * MINUTE_MS;
  let bucket = -1;
  for (let t = START_MS; t < START_MS + hours * HOUR_MS; t += intervalMinutes * MINUTE_MS) {
    const b = Math.floor(t / bucketMs);
    if (bucket >= 0 && b !== bucket) closeDutyBucket(d, true, DEFAULT_SETTINGS);
    bucket = b;
    trackDuty(d, sawtooth(t, onMinutes, offMinutes), t, DEFAULT_SETTINGS);
  }
  finishDutyLearning(d);
  return d.baseline as number;
}

describe('the compressor duty estimate', () => {
  it('reads the running share of a sawtooth by construction, at 1- to 5-minute intervals', () => {
    // 40 minutes on, 20 off: two thirds of the time; 20 on, 40 off: one third.
    for (const interval of [1, 2, 5]) {
      expect(dutyOf(40, 20, interval)).toBeCloseTo(2 / 3, 1);
      expect(dutyOf(20, 40, interval)).toBeCloseTo(1 / 3, 1);
    }
  });

  it('smooths the per-bucket shares with the EWMA recursion of the NIST/SEMATECH e-Handbook §6.3.2.4', () => {
    // The handbook's worked example (λ = 0.3, EWMA0 = 50), scaled to shares (÷ 100): a bucket
    // with share Y moves the estimate by λ·(Y − EWMA) when λ = 1 − exp(−Δt/τ).
    const handbookData = [52.0, 47.0, 53.0, 49.3, 50.1, 47.0, 51.0, 50.1, 51.2, 50.5];
    const handbookEwma = [50.6, 49.52, 50.56, 50.18, 50.16, 49.21, 49.75, 49.85, 50.26, 50.33];
    const tauHours = DEFAULT_SETTINGS.dutyTimeConstantHours;
    const changeMs = -Math.log(0.7) * tauHours * HOUR_MS;
    expect(lambdaForGap(changeMs, tauHours * HOUR_MS)).toBeCloseTo(0.3, 10);
    const d = { ...newDutyState(), ewma: 0.5 };
    handbookData.forEach((y, i) => {
      d.fallMs = (y / 100) * changeMs;
      d.changeMs = changeMs;
      closeDutyBucket(d, false, DEFAULT_SETTINGS);
      expect(d.ewma! * 100).toBeCloseTo(handbookEwma[i], 2);
    });
  });

  it('compares readings five minutes apart, so one-minute probe noise does not read as cycling', () => {
    const d = newDutyState();
    // One probe step (0.0625 °C) of flicker between the five-minute marks of a steady freezer.
    for (let i = 0; i <= 60; i++) trackDuty(d, -18 + (i % 5 !== 0 && i % 2 ? 0.0625 : 0), START_MS + i * MINUTE_MS, DEFAULT_SETTINGS);
    // Twelve comparisons five minutes apart, every one between equal values: no change seen.
    expect(d.changeMs).toBe(0);
    // The same flicker compared minute by minute would have counted as change every minute.
    trackDuty(d, -17.5, START_MS + 65 * MINUTE_MS, DEFAULT_SETTINGS);
    expect(d.changeMs).toBe(5 * MINUTE_MS);
    expect(d.fallMs).toBe(0);
  });

  it('stays near its normal on a healthy week and reports the excess of a unit running on', () => {
    const healthy = run(simulate({ style: 'top-freezer', days: 4 }), 'top-freezer');
    const excess = dutyExcess(healthy.engine.snapshot().duty)!;
    expect(Math.abs(excess)).toBeLessThan(DEFAULT_SETTINGS.dutyExcessLimit);
    const starved = run(simulate({ style: 'top-freezer', days: 4, fault: 'condenser-airflow', onsetHours: 30 }), 'top-freezer');
    expect(dutyExcess(starved.engine.snapshot().duty)!).toBeGreaterThan(DEFAULT_SETTINGS.dutyExcessLimit);
  });
});

describe('rhythm-change findings', () => {
  it('a damper stuck closed that leaves the fresh food cold is found from the freezer drifting colder, and diagnosed air-damper', () => {
    // A colder room (18 °C) and a generous leak: the fresh food never warms (common practice:
    // the compressor runs on for the fresh food and the freezer gets colder).
    const readings = simulate({ style: 'bottom-freezer', days: 4, fault: 'air-damper', onsetHours: 40, severity: 0.9, profile: { roomMeanC: 18 } });
    const after = readings.filter((r) => r.atMs >= START_MS + 52 * HOUR_MS);
    const before = readings.filter((r) => r.atMs >= START_MS + 16 * HOUR_MS && r.atMs < START_MS + 40 * HOUR_MS);
    const mean = (rs: EngineReading[], pick: (r: EngineReading) => number | null) => rs.reduce((s, r) => s + (pick(r) ?? 0), 0) / rs.length;
    expect(mean(after, (r) => r.freezerC)).toBeLessThan(mean(before, (r) => r.freezerC) - DEFAULT_SETTINGS.coldDriftC);
    const result = run(readings, 'bottom-freezer');
    const found = repairFindings(result);
    expect(found.length).toBeGreaterThan(0);
    const first = found[0];
    expect(first.kind).toBe('warming-trend');
    expect(first.compartment).toBe('both');
    expect(first.summary).toContain('colder than its own normal');
    expect(first.detectedAtMs).toBeGreaterThan(START_MS + 40 * HOUR_MS);
    expect(first.probableCauses[0].code).toBe('air-damper');
  });

  it('a starved condenser that keeps the cabinet cold is found from the compressor running on', () => {
    const result = run(simulate({ style: 'upright-freezer', days: 5, fault: 'condenser-airflow', onsetHours: 30, severity: 0.9, profile: { roomMeanC: 18 } }), 'upright-freezer');
    const found = repairFindings(result);
    expect(found.length).toBeGreaterThan(0);
    expect(found.some((f) => f.summary.includes('run about'))).toBeTrue();
    expect(found[0].detectedAtMs).toBeGreaterThan(START_MS + 30 * HOUR_MS);
  });

  it('raises nothing on healthy weeks with groceries and a hot afternoon, at 1 to 15 minutes', () => {
    for (const intervalMinutes of [1, 5, 15]) {
      for (const style of ['top-freezer', 'fresh-food-only', 'chest-freezer'] as const) {
        const readings = simulate({
          style,
          days: 7,
          intervalMinutes,
          seed: 11 + intervalMinutes,
          extraEvents: [
            { kind: 'grocery-load', atMs: START_MS + 2 * DAY_MS, magnitude: 10 },
            { kind: 'hot-day', atMs: START_MS + 4 * DAY_MS, magnitude: 8 },
          ],
        });
        expect(repairFindings(run(readings, style))).withContext(`${style} every ${intervalMinutes} min`).toEqual([]);
      }
    }
  });

  it('a stuck freezer probe (no movement at all) raises a sensor fault, not a rhythm change', () => {
    const readings = simulate({ style: 'top-freezer', days: 4, fault: 'sensor-stuck', probe: 'freezer', onsetHours: 30 });
    const result = run(readings, 'top-freezer');
    expect(repairFindings(result)).toEqual([]);
    expect(result.findings.some((f) => f.kind === 'sensor-fault' && f.compartment === 'freezer')).toBeTrue();
  });

  it('resumes a state saved before the duty estimate existed (version 1) and learns its normal afresh', () => {
    const readings = simulate({ style: 'top-freezer', days: 3 });
    const firstDay = readings.filter((r) => r.atMs < START_MS + 30 * HOUR_MS);
    const saved = run(firstDay, 'top-freezer').engine.snapshot() as unknown as Record<string, unknown>;
    delete saved.duty;
    delete saved.rhythmChange;
    saved.version = 1;
    const resumed = new DetectionEngine('top-freezer', undefined, saved as never);
    const baseline = resumed.baselineC('freezer');
    expect(resumed.learned().ready).toBeTrue();
    for (const r of readings.filter((x) => x.atMs >= START_MS + 30 * HOUR_MS)) resumed.push(r);
    const state = resumed.snapshot();
    expect(state.version).toBe(2);
    expect(state.duty.baseline).not.toBeNull();
    expect(resumed.baselineC('freezer')!).toBeCloseTo(baseline!, 0);
    expect(resumed.openFindings().filter((f) => f.kind !== 'sensor-fault')).toEqual([]);
  });

  it('is causal: cut at the reading that concluded it, the engine concludes the same', () => {
    const readings = simulate({ style: 'upright-freezer', days: 5, fault: 'condenser-airflow', onsetHours: 30, severity: 0.9, profile: { roomMeanC: 18 } });
    const first = repairFindings(run(readings, 'upright-freezer'))[0];
    const cut = readings.filter((r) => r.atMs <= first.detectedAtMs);
    const again = new DetectionEngine('upright-freezer');
    for (const r of cut) again.push(r);
    expect(again.openFindings().find((f) => f.id === first.id)?.detectedAtMs).toBe(first.detectedAtMs);
  });
});
