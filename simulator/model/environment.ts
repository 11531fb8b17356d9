/**
 * The appliance's surroundings: room temperature and the household's door habits.
 *
 * Room temperature = daily mean + a daily cosine (peak in the afternoon by default) + slow
 * "weather" made of three sinusoids with periods of a few days and random phases (cheap,
 * deterministic, no random draw per step) + hot-day events (+5..10 K for a day with 3 h
 * ramps). Door openings follow a Poisson process whose rate follows the local hour: few at
 * night, peaks at breakfast, lunch and dinner (common practice of household routines).
 */
import type { ApplianceProfile } from './types';
import { Rng, uniform } from './rng';

const HOUR_MS = 3_600_000;
const DAY_MS = 24 * HOUR_MS;
const WEATHER_PERIODS_DAYS = [2.9, 5.3, 9.1];
const HOT_DAY_MS = DAY_MS;
const HOT_DAY_RAMP_MS = 3 * HOUR_MS;

/** Relative door activity per local hour 0..23 (night 0.1, dinner peak about 2). */
const DOOR_WEIGHT_BY_HOUR = [
  0.15, 0.1, 0.08, 0.08, 0.1, 0.2, 0.6, 1.5, 1.6, 1.0, 0.9, 1.0, 1.4, 1.1, 0.9, 0.9, 1.1, 1.6, 2.2, 2.0, 1.5, 1.1,
  0.7, 0.35,
];
const DOOR_WEIGHT_MEAN = DOOR_WEIGHT_BY_HOUR.reduce((sum, w) => sum + w, 0) / 24;
/** Highest relative rate, the envelope for thinning the Poisson process. */
export const DOOR_WEIGHT_MAX = Math.max(...DOOR_WEIGHT_BY_HOUR) / DOOR_WEIGHT_MEAN;

/** Hour of day 0..24 in the unit's local time. */
export function localHour(atMs: number, utcOffsetHours: number): number {
  const ms = (((atMs + utcOffsetHours * HOUR_MS) % DAY_MS) + DAY_MS) % DAY_MS;
  return ms / HOUR_MS;
}

/** Door activity at a local hour relative to the daily mean (mean over a day = 1). */
export function doorActivity(hourLocal: number, habitShiftH: number): number {
  const hour = Math.floor((((hourLocal - habitShiftH) % 24) + 24) % 24);
  return DOOR_WEIGHT_BY_HOUR[hour] / DOOR_WEIGHT_MEAN;
}

interface HotDay {
  atMs: number;
  amplitudeK: number;
}

export class RoomClimate {
  private readonly weatherPhases: number[];
  private readonly weatherAmplitudes: number[];
  private readonly hotDays: HotDay[] = [];
  /** Room air changes slowly: one value per minute saves the trigonometry of most steps. */
  private cachedMinute = NaN;
  private cachedC = 0;

  constructor(
    private readonly profile: ApplianceProfile,
    rng: Rng,
  ) {
    this.weatherPhases = WEATHER_PERIODS_DAYS.map(() => uniform(rng, 0, 2 * Math.PI));
    // Split the weather swing over the three components so the sum keeps about that size.
    this.weatherAmplitudes = [0.5, 0.3, 0.2].map((share) => share * profile.roomWeatherSwingK * 1.4);
  }

  addHotDay(atMs: number, amplitudeK: number): void {
    this.hotDays.push({ atMs, amplitudeK });
    this.cachedMinute = NaN;
  }

  tempC(atMs: number): number {
    const minute = Math.floor(atMs / 60_000);
    if (minute !== this.cachedMinute) {
      this.cachedMinute = minute;
      this.cachedC = this.computeC(minute * 60_000);
    }
    return this.cachedC;
  }

  private computeC(atMs: number): number {
    const p = this.profile;
    const hour = localHour(atMs, p.utcOffsetHours);
    let tempC = p.roomMeanC + p.roomDailySwingK * Math.cos((2 * Math.PI * (hour - p.roomPeakHourLocal)) / 24);
    const days = atMs / DAY_MS;
    for (let i = 0; i < WEATHER_PERIODS_DAYS.length; i++) {
      tempC += this.weatherAmplitudes[i] * Math.sin((2 * Math.PI * days) / WEATHER_PERIODS_DAYS[i] + this.weatherPhases[i]);
    }
    for (let i = 0; i < this.hotDays.length; i++) tempC += hotDayOffsetK(this.hotDays[i], atMs);
    return tempC;
  }
}

/** Trapezoid with cosine ramps: 0 before, amplitude through the day, 0 after. */
function hotDayOffsetK(day: HotDay, atMs: number): number {
  const sinceMs = atMs - day.atMs;
  if (sinceMs <= 0 || sinceMs >= HOT_DAY_MS) return 0;
  const edgeMs = Math.min(sinceMs, HOT_DAY_MS - sinceMs);
  if (edgeMs >= HOT_DAY_RAMP_MS) return day.amplitudeK;
  return (day.amplitudeK * (1 - Math.cos((Math.PI * edgeMs) / HOT_DAY_RAMP_MS))) / 2;
}
