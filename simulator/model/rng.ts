/**
 * Deterministic pseudo-random numbers. mulberry32 (a 32-bit state generator in the public
 * domain, common practice for reproducible simulations) is small, fast and good enough for
 * noise and habits; it is not for anything that needs cryptographic strength.
 */

export type Rng = () => number;

/** Uniform numbers in [0, 1) from a 32-bit seed; same seed, same sequence. */
export function createRng(seed: number): Rng {
  let state = seed >>> 0;
  return () => {
    state = (state + 0x6d2b79f5) >>> 0;
    let t = state;
    t = Math.imul(t ^ (t >>> 15), t | 1);
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
}

/** A second independent stream from the same seed (hash mix of the seed and a stream tag). */
export function deriveSeed(seed: number, stream: number): number {
  let h = (seed ^ Math.imul(stream + 1, 0x9e3779b9)) >>> 0;
  h = Math.imul(h ^ (h >>> 16), 0x85ebca6b);
  h = Math.imul(h ^ (h >>> 13), 0xc2b2ae35);
  return (h ^ (h >>> 16)) >>> 0;
}

export function uniform(rng: Rng, low: number, high: number): number {
  return low + (high - low) * rng();
}

/** Log-uniform: as likely to land in 6–12 h as in 36–72 h. */
export function logUniform(rng: Rng, low: number, high: number): number {
  return Math.exp(uniform(rng, Math.log(low), Math.log(high)));
}

/** Standard normal by Box–Muller. */
export function gaussian(rng: Rng): number {
  const u = 1 - rng();
  return Math.sqrt(-2 * Math.log(u)) * Math.cos(2 * Math.PI * rng());
}

/** Waiting time of a Poisson process with the given rate (per second), in seconds. */
export function exponentialS(rng: Rng, ratePerS: number): number {
  return -Math.log(1 - rng()) / ratePerS;
}

export function pick<T>(rng: Rng, items: readonly T[]): T {
  return items[Math.floor(rng() * items.length)];
}
