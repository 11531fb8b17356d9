/** Where services read the time, so specs can move it (token expiry, session lifetime). */
export interface Clock {
  now(): Date;
}

export const systemClock: Clock = { now: () => new Date() };
