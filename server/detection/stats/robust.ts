/**
 * Robust location and spread. simple-statistics provides median and the median absolute
 * deviation; the scale factor 1.4826 makes the MAD estimate σ for normal data.
 */
import { medianAbsoluteDeviation, median as medianOf } from 'simple-statistics';

export const MAD_TO_SIGMA = 1.4826;

export function median(values: readonly number[]): number {
  return medianOf(values as number[]);
}

export function robustSigma(values: readonly number[]): number {
  return MAD_TO_SIGMA * medianAbsoluteDeviation(values as number[]);
}

/** Median of a small window without touching the caller's array (the level series). */
export function medianOfWindow(values: readonly number[], scratch: number[]): number {
  scratch.length = 0;
  // Insertion sort: the window holds a handful of values.
  for (const value of values) {
    let i = scratch.length;
    scratch.push(value);
    while (i > 0 && scratch[i - 1] > value) {
      scratch[i] = scratch[i - 1];
      i--;
    }
    scratch[i] = value;
  }
  const middle = scratch.length >> 1;
  return scratch.length % 2 ? scratch[middle] : (scratch[middle - 1] + scratch[middle]) / 2;
}
