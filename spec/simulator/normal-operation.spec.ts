/**
 * A healthy appliance: temperatures, compressor rhythm, automatic defrost and door habits.
 */
import { ApplianceSimulator, defaultProfile, generateTrace, localHour } from '../../simulator/model';
import { FREEZER_LIMIT_C, FRESH_FOOD_LIMIT_C } from '../../shared/temperature';
import {
  DAY_MS,
  HOUR_MS,
  MINUTE_MS,
  START_MS,
  compressorStartsPerDay,
  dutyCycle,
  freezerValues,
  freshValues,
  median,
  quantile,
} from './trace-stats';

describe('simulator: normal operation of the default top-freezer', () => {
  const profile = defaultProfile('top-freezer');
  const trace = generateTrace({ profile, seed: 11, startMs: START_MS, durationMs: 7 * DAY_MS, intervalMs: MINUTE_MS });

  it('keeps fresh food between about 1 and 5 °C apart from door openings and defrost', () => {
    // FDA, "Refrigerator Thermometers: Cold Facts about Food Safety": at or below 40 °F (4.4 °C);
    // a healthy unit hovers a little above freezing (common practice): 5th–95th percentile.
    const fresh = freshValues(trace);
    expect(quantile(fresh, 0.05)).toBeGreaterThanOrEqual(1);
    expect(quantile(fresh, 0.95)).toBeLessThanOrEqual(5);
    expect(median(fresh)).toBeLessThan(FRESH_FOOD_LIMIT_C);
  });

  it('keeps the freezer near its setpoint and at or below 0 °F most of the time', () => {
    // FDA, same page: freezer at or below 0 °F (−17.8 °C); the thermostat band straddles it.
    const freezer = freezerValues(trace);
    expect(Math.abs(median(freezer) - profile.freezerSetpointC)).toBeLessThan(1.5);
    expect(quantile(freezer, 0.25)).toBeLessThan(FREEZER_LIMIT_C);
    expect(quantile(freezer, 0.95)).toBeLessThan(-10);
  });

  it('cycles the compressor several times a day at a plausible duty', () => {
    // Common practice: a healthy unit runs roughly 30–70 % of the time in cycles of tens of minutes.
    const startsPerDay = compressorStartsPerDay(trace);
    expect(startsPerDay).toBeGreaterThan(10);
    expect(startsPerDay).toBeLessThan(80);
    const duty = dutyCycle(trace);
    expect(duty).toBeGreaterThan(0.25);
    expect(duty).toBeLessThan(0.8);
  });

  it('shows the freezer readings swing with the compressor cycle', () => {
    const freezer = freezerValues(trace);
    const swingK = quantile(freezer, 0.9) - quantile(freezer, 0.1);
    expect(swingK).toBeGreaterThan(1.5);
    expect(swingK).toBeLessThan(8);
  });
});

describe('simulator: automatic defrost', () => {
  it('defrosts at the profile interval with a brief rise of the freezer air', () => {
    // Common practice (from memory): every several hours to a few days, roughly 20–45 min.
    const profile = { ...defaultProfile('top-freezer'), defrostIntervalH: 8, defrostDurationMin: 25 };
    const sim = new ApplianceSimulator(profile, { seed: 5, startMs: START_MS });
    const defrostStartsMs: number[] = [];
    const risesK: number[] = [];
    let wasDefrosting = false;
    let freezerBeforeC = 0;
    let peakC = -Infinity;
    for (let atMs = START_MS; atMs < START_MS + 3 * DAY_MS; atMs += MINUTE_MS) {
      sim.advanceTo(atMs);
      const truth = sim.truth();
      if (truth.defrosting && !wasDefrosting) {
        defrostStartsMs.push(atMs);
        peakC = -Infinity;
      }
      if (truth.defrosting) peakC = Math.max(peakC, truth.freezerAirC);
      if (!truth.defrosting && wasDefrosting) risesK.push(peakC - freezerBeforeC);
      if (!truth.defrosting) freezerBeforeC = truth.freezerAirC;
      wasDefrosting = truth.defrosting;
    }
    expect(defrostStartsMs.length).toBeGreaterThanOrEqual(8);
    for (let i = 1; i < defrostStartsMs.length; i++) {
      expect(Math.abs(defrostStartsMs[i] - defrostStartsMs[i - 1] - 8 * HOUR_MS)).toBeLessThanOrEqual(MINUTE_MS);
    }
    for (const riseK of risesK) {
      expect(riseK).toBeGreaterThan(2);
      expect(riseK).toBeLessThan(20);
    }
  });

  it('keeps the compressor off for the whole defrost period', () => {
    const profile = { ...defaultProfile('top-freezer'), defrostIntervalH: 6, defrostDurationMin: 30 };
    const sim = new ApplianceSimulator(profile, { seed: 8, startMs: START_MS });
    let defrostMinutes = 0;
    for (let atMs = START_MS; atMs < START_MS + DAY_MS; atMs += MINUTE_MS) {
      sim.advanceTo(atMs);
      if (!sim.truth().defrosting) continue;
      defrostMinutes++;
      expect(sim.sample()?.compressorOn ?? false).toBeFalse();
    }
    // Four defrosts of 30 min in a day, within a minute of sampling each.
    expect(defrostMinutes).toBeGreaterThanOrEqual(4 * 29);
    expect(defrostMinutes).toBeLessThanOrEqual(4 * 31);
  });
});

describe('simulator: door habits', () => {
  it('opens the doors more by day than by night, the fresh-food door more than the freezer', () => {
    const profile = { ...defaultProfile('top-freezer'), doorOpeningsPerDay: 40, freezerDoorShare: 0.2 };
    const sim = new ApplianceSimulator(profile, { seed: 21, startMs: START_MS });
    let day = 0;
    let night = 0;
    let wasOpen = false;
    for (let atMs = START_MS; atMs < START_MS + 14 * DAY_MS; atMs += 5000) {
      sim.advanceTo(atMs);
      const open: boolean = sim.sample()?.doorOpen ?? wasOpen;
      if (open && !wasOpen) {
        const hour = localHour(atMs, profile.utcOffsetHours);
        if (hour >= 8 && hour < 22) day++;
        else if (hour < 6) night++;
      }
      wasOpen = open;
    }
    // 14 h of day against 6 h of night: even per hour, day must clearly lead (common practice).
    expect(day / 14).toBeGreaterThan((3 * night) / 6);
    expect(day + night).toBeGreaterThan(14 * 25);
  });

  it('sends most openings to the fresh-food door', () => {
    const profile = { ...defaultProfile('top-freezer'), doorOpeningsPerDay: 40, freezerDoorShare: 0.2 };
    const sim = new ApplianceSimulator(profile, { seed: 4, startMs: START_MS });
    let freshOpenings = 0;
    let freezerOpenings = 0;
    let last = sim.truth();
    for (let atMs = START_MS; atMs < START_MS + 7 * DAY_MS; atMs += 5000) {
      sim.advanceTo(atMs);
      const now = sim.truth();
      if (now.freshDoorOpen && !last.freshDoorOpen) freshOpenings++;
      if (now.freezerDoorOpen && !last.freezerDoorOpen) freezerOpenings++;
      last = now;
    }
    expect(freshOpenings).toBeGreaterThan(2.5 * freezerOpenings);
    expect(freezerOpenings).toBeGreaterThan(0);
  });

  it('recovers from a door opening within minutes', () => {
    const profile = { ...defaultProfile('top-freezer'), doorOpeningsPerDay: 0 };
    const sim = new ApplianceSimulator(profile, { seed: 2, startMs: START_MS - 12 * HOUR_MS });
    sim.advanceTo(START_MS);
    const beforeC = sim.truth().freshAirC;
    sim.openDoor('fresh_food', 60);
    sim.advanceTo(START_MS + MINUTE_MS);
    const peakC = sim.truth().freshAirC;
    sim.advanceTo(START_MS + 20 * MINUTE_MS);
    const afterC = sim.truth().freshAirC;
    expect(peakC - beforeC).toBeGreaterThan(2);
    expect(afterC - beforeC).toBeLessThan(1);
  });
});

describe('simulator: the room', () => {
  it('warms by day and cools by night around its mean', () => {
    const profile = { ...defaultProfile(), roomMeanC: 21, roomDailySwingK: 2, roomPeakHourLocal: 15, roomWeatherSwingK: 0 };
    const sim = new ApplianceSimulator(profile, { seed: 1, startMs: START_MS });
    const byHour: number[] = [];
    for (let hour = 0; hour < 24; hour++) {
      sim.advanceTo(START_MS + (hour - profile.utcOffsetHours) * HOUR_MS);
      byHour.push(sim.truth().roomC);
    }
    expect(byHour[15]).toBeCloseTo(23, 1);
    expect(byHour[3]).toBeCloseTo(19, 1);
    expect(byHour.reduce((sum, c) => sum + c, 0) / 24).toBeCloseTo(21, 1);
  });
});
