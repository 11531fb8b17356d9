import type { Clock } from '../../../server/auth/clock';

/** A clock the spec moves by hand, for expiry and lifetimes. */
export class ManualClock implements Clock {
  constructor(private currentMs = Date.parse('2026-03-02T15:00:00Z')) {}

  now(): Date {
    return new Date(this.currentMs);
  }

  advance(ms: number): void {
    this.currentMs += ms;
  }
}
