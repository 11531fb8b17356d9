/**
 * Door openings as a non-homogeneous Poisson process, drawn by thinning: candidates arrive at
 * the peak rate and are kept with probability activity(hour) / peak. The draws do not depend on
 * the physics step or on how often the unit is sampled, so the same seed opens the doors at the
 * same moments in a 1-minute and a 5-minute trace. Durations are log-normal around the profile's
 * mean (a quick grab of a few seconds, sometimes a minute of hesitation).
 */
import type { ApplianceProfile } from './types';
import { DOOR_WEIGHT_MAX, doorActivity, localHour } from './environment';
import { exponentialS, gaussian, Rng } from './rng';

/** One door: when it closes again and how many seconds it stood open in the current step. */
export class Door {
  openUntilMs = -Infinity;
  openSInStep = 0;

  /** Starts the step: carries the rest of an opening that began earlier. */
  beginStep(fromMs: number, toMs: number): void {
    this.openSInStep = Math.max(0, Math.min(this.openUntilMs, toMs) - fromMs) / 1000;
  }

  /** An opening at atMs for durationMs, counting only time not already open. */
  open(atMs: number, durationMs: number, stepEndMs: number): void {
    const fromMs = Math.max(atMs, this.openUntilMs);
    const untilMs = atMs + durationMs;
    if (untilMs > fromMs) this.openSInStep += Math.max(0, Math.min(untilMs, stepEndMs) - fromMs) / 1000;
    this.openUntilMs = Math.max(this.openUntilMs, untilMs);
  }

  isOpen(atMs: number): boolean {
    return atMs < this.openUntilMs;
  }
}

export class DoorHabits {
  readonly freshFood = new Door();
  readonly freezer = new Door();
  private nextCandidateMs: number;
  private readonly peakRatePerS: number;

  constructor(
    private readonly profile: ApplianceProfile,
    private readonly rng: Rng,
    startMs: number,
  ) {
    this.peakRatePerS = (profile.doorOpeningsPerDay / 86_400) * DOOR_WEIGHT_MAX;
    this.nextCandidateMs = startMs + this.waitMs();
  }

  private waitMs(): number {
    return this.peakRatePerS > 0 ? exponentialS(this.rng, this.peakRatePerS) * 1000 : Infinity;
  }

  /** Draws the openings of [fromMs, toMs) and the seconds each door stands open in it. */
  step(fromMs: number, toMs: number): void {
    this.freshFood.beginStep(fromMs, toMs);
    this.freezer.beginStep(fromMs, toMs);
    const p = this.profile;
    while (this.nextCandidateMs < toMs) {
      const atMs = this.nextCandidateMs;
      const activity = doorActivity(localHour(atMs, p.utcOffsetHours), p.doorHabitShiftH);
      if (this.rng() * DOOR_WEIGHT_MAX < activity) this.openOne(atMs, toMs);
      this.nextCandidateMs += this.waitMs();
    }
  }

  private openOne(atMs: number, stepEndMs: number): void {
    const p = this.profile;
    const door = this.rng() < p.freezerDoorShare ? this.freezer : this.freshFood;
    // Log-normal with σ = 0.6; the −σ²/2 keeps the mean at doorOpenMeanS.
    const durationS = p.doorOpenMeanS * Math.exp(0.6 * gaussian(this.rng) - 0.18);
    door.open(atMs, durationS * 1000, stepEndMs);
  }

  /** A long opening for loading groceries. */
  openFor(door: Door, atMs: number, durationS: number, stepEndMs: number): void {
    door.open(atMs, durationS * 1000, stepEndMs);
  }
}
