/**
 * Exponentially weighted moving average and its control limits, as defined in the
 * NIST/SEMATECH e-Handbook of Statistical Methods, §6.3.2.4:
 *   EWMA_t = λ·Y_t + (1 − λ)·EWMA_{t−1},  limits EWMA_0 ± k·s·√(λ / (2 − λ)).
 */

export interface EwmaLimits {
  lower: number;
  upper: number;
}

export function ewmaStep(previous: number, value: number, lambda: number): number {
  return lambda * value + (1 - lambda) * previous;
}

export function ewmaSeries(values: readonly number[], lambda: number, start: number): number[] {
  const series: number[] = [];
  let current = start;
  for (const value of values) {
    current = ewmaStep(current, value, lambda);
    series.push(current);
  }
  return series;
}

/** Asymptotic (steady-state) limits, the ones the handbook's example prints. */
export function ewmaLimits(target: number, sigma: number, lambda: number, k = 3): EwmaLimits {
  const halfWidth = k * sigma * Math.sqrt(lambda / (2 - lambda));
  return { lower: target - halfWidth, upper: target + halfWidth };
}

/** Smoothing weight for an irregularly sampled series: a time constant instead of a fixed λ. */
export function lambdaForGap(gapMs: number, timeConstantMs: number): number {
  if (gapMs <= 0) return 0;
  return 1 - Math.exp(-gapMs / timeConstantMs);
}
