import { DetectionEngine } from '../../server/detection/engine';
import { analyzeReadings } from '../../server/detection/analyze';
import type { EngineReading } from '../../server/detection/types';
import { HOUR_MS, MINUTE_MS, repairFindings, run, signal, simulate, START_MS } from './support/traces';

/** Hand-made defrost: the freezer air rises 7 °C over 20 minutes and recovers in 10, every 8 hours. */
function defrostRise(atMs: number): number {
  const sinceMs = (atMs - START_MS - 3 * HOUR_MS) % (8 * HOUR_MS);
  if (sinceMs < 0) return 0;
  const minutes = sinceMs / MINUTE_MS;
  if (minutes < 20) return (7 * minutes) / 20;
  if (minutes < 30) return 7 * (1 - (minutes - 20) / 10);
  return 0;
}

describe('the engine learns each appliance\'s own normal', () => {
  const readings = signal({ hours: 72, intervalMinutes: 1, cycleMinutes: 40, add: (t) => ({ freezer: defrostRise(t) }) });
  const result = run(readings, 'top-freezer');
  const learned = result.engine.learned();

  it('learns the baseline of each probe', () => {
    expect(learned.ready).toBeTrue();
    expect(learned.baselineC.fresh_food!).toBeCloseTo(3, 0);
    expect(learned.baselineC.freezer!).toBeCloseTo(-19, 0);
  });

  it('tells its current level and baseline per probe without the caller reading its state', () => {
    const levels = result.engine.probeLevels();
    const state = result.engine.snapshot();
    for (const p of state.probes) {
      expect(levels[p.probe]!.baselineC).toBe(p.level.baselineC);
      expect(levels[p.probe]!.levelC).toBe(p.level.levelC);
      expect(levels[p.probe]!.levelAtMs).toBe(p.level.levelTimesMs[p.level.levelTimesMs.length - 1]);
    }
    // The level lags the newest reading by less than a quarter hour bucket.
    expect(readings[readings.length - 1].atMs - levels.freezer!.levelAtMs!).toBeLessThan(15 * MINUTE_MS);
    expect(levels.fresh_food!.levelC!).toBeCloseTo(3, 0);
  });

  it('learns the compressor cycle period', () => {
    expect(learned.cyclePeriodMinutes!).toBeGreaterThan(35);
    expect(learned.cyclePeriodMinutes!).toBeLessThan(45);
  });

  it('learns the defrost interval and the size of its rise, and raises nothing for them', () => {
    expect(learned.defrostIntervalHours!).toBeCloseTo(8, 0);
    expect(learned.defrostRiseC!).toBeGreaterThan(5);
    expect(learned.defrostRiseC!).toBeLessThan(9);
    expect(repairFindings(result)).toEqual([]);
  });

  it('judges a unit set colder or warmer by its own normal, not as a fault', () => {
    for (const freshC of [1, 4]) {
      const other = run(signal({ hours: 48, freshC, freezerC: freshC === 1 ? -23 : -17.5, freezerSwingC: 0.4 }), 'top-freezer');
      expect(repairFindings(other)).withContext(`fresh food at ${freshC} °C`).toEqual([]);
      expect(other.engine.baselineC('fresh_food')!).toBeCloseTo(freshC, 0);
    }
  });

  it('learns the door pattern from the door switch', () => {
    const withDoors = signal({ hours: 72 }).map((r) => {
      const minuteOfDay = ((r.atMs - START_MS) / MINUTE_MS) % (24 * 60);
      return { ...r, doorOpen: minuteOfDay === 7 * 60 || minuteOfDay === 18 * 60 };
    });
    const doors = run(withDoors, 'top-freezer').engine.learned();
    expect(doors.doorOpeningsPerDay!).toBeCloseTo(2, 0);
    expect(doors.doorOpeningsByHourUtc[7]).toBe(3);
    expect(doors.doorOpeningsByHourUtc[18]).toBe(3);
  });
});

describe('engine state', () => {
  const readings = simulate({ style: 'top-freezer', days: 3, fault: 'evaporator-fan', onsetHours: 40 });

  it('resumes from a JSON snapshot exactly where it stopped (live ingest after a restart)', () => {
    const whole = run(readings, 'top-freezer');
    const cut = Math.floor(readings.length * 0.6);
    const first = run(readings.slice(0, cut), 'top-freezer');
    const stored = JSON.parse(JSON.stringify(first.engine.snapshot()));
    const resumed = run(readings.slice(cut), 'top-freezer', new DetectionEngine('top-freezer', undefined, stored));
    const tail = whole.events.filter((e) => e.atMs >= readings[cut].atMs);
    expect(resumed.events).toEqual(tail);
    expect(tail.length).toBeGreaterThan(0);
  });

  it('ignores readings at or before the last one (duplicates, late arrivals)', () => {
    const engine = new DetectionEngine('top-freezer');
    for (const r of readings.slice(0, 400)) engine.push(r);
    const before = JSON.stringify(engine.snapshot());
    expect(engine.push(readings[100])).toEqual([]);
    expect(engine.push({ ...readings[399], freshFoodC: 40 })).toEqual([]);
    expect(JSON.stringify(engine.snapshot())).toBe(before);
  });

  it('refuses a snapshot of another style', () => {
    const state = new DetectionEngine('top-freezer').snapshot();
    expect(() => new DetectionEngine('chest-freezer', undefined, state)).toThrowError(/top-freezer/);
  });
});

describe('health words (DESIGN.md)', () => {
  it('goes cold → drifting or warm → no-cooling as a dead compressor warms the cabinet, and silent without readings', () => {
    const readings = simulate({ style: 'top-freezer', days: 4, fault: 'compressor-start', onsetHours: 40 });
    const engine = new DetectionEngine('top-freezer');
    const seen: string[] = [];
    for (const r of readings) {
      engine.push(r);
      const health = engine.health();
      if (seen[seen.length - 1] !== health) seen.push(health);
    }
    expect(seen[0]).toBe('cold');
    expect(seen).toContain('warm');
    expect(seen[seen.length - 1]).toBe('no-cooling');
    const lastMs = readings[readings.length - 1].atMs;
    expect(engine.health(lastMs + 2 * HOUR_MS)).toBe('silent');
    expect(new DetectionEngine('top-freezer').health()).toBe('silent');
  });
});

describe('analyzeReadings', () => {
  it('sorts, de-duplicates and summarises', () => {
    const readings = signal({ hours: 30 });
    const shuffled: EngineReading[] = [...readings.slice(200), ...readings.slice(0, 200), ...readings.slice(50, 60)];
    const result = analyzeReadings(shuffled, 'top-freezer');
    expect(result.summary.readings).toBe(readings.length);
    expect(result.summary.medianIntervalMinutes).toBe(5);
    expect(result.summary.firstAtMs).toBe(readings[0].atMs);
    expect(result.summary.health).toBe('cold');
    expect(result.findings).toEqual([]);
  });
});
