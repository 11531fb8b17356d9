/**
 * Slopes for short windows of the level series. Ordinary least squares (checked against
 * NIST StRD "Norris" and simple-statistics) and the Theil–Sen median of pairwise slopes,
 * which a single defrost or door spike cannot tilt.
 */

export interface LineFit {
  slope: number;
  intercept: number;
}

/** Least squares with centred sums, which keeps precision when x is large (epoch time). */
export function leastSquares(xs: ArrayLike<number>, ys: ArrayLike<number>, count = xs.length): LineFit | null {
  if (count < 2) return null;
  let meanX = 0;
  let meanY = 0;
  for (let i = 0; i < count; i++) {
    meanX += xs[i];
    meanY += ys[i];
  }
  meanX /= count;
  meanY /= count;
  let sxy = 0;
  let sxx = 0;
  for (let i = 0; i < count; i++) {
    const dx = xs[i] - meanX;
    sxx += dx * dx;
    sxy += dx * (ys[i] - meanY);
  }
  if (sxx === 0) return null;
  const slope = sxy / sxx;
  return { slope, intercept: meanY - slope * meanX };
}

const pairSlopes: number[] = [];

/**
 * Theil–Sen slope: the median of the slopes between every pair of points, over
 * xs[start .. start + count). Reuses one scratch array (the engine calls it once per bucket).
 */
export function theilSenSlope(xs: ArrayLike<number>, ys: ArrayLike<number>, start = 0, count = xs.length - start): number | null {
  pairSlopes.length = 0;
  const end = start + count;
  for (let i = start; i < end; i++) {
    for (let j = i + 1; j < end; j++) {
      const dx = xs[j] - xs[i];
      if (dx !== 0) pairSlopes.push((ys[j] - ys[i]) / dx);
    }
  }
  if (pairSlopes.length === 0) return null;
  pairSlopes.sort((a, b) => a - b);
  const middle = pairSlopes.length >> 1;
  return pairSlopes.length % 2 ? pairSlopes[middle] : (pairSlopes[middle - 1] + pairSlopes[middle]) / 2;
}
