/**
 * Upper one-sided tabular CUSUM (Montgomery, Introduction to Statistical Quality Control,
 * §9.1): C⁺_i = max(0, x_i − (μ0 + K) + C⁺_{i−1}); a signal when C⁺_i > H. The run length
 * N⁺ (periods since C⁺ was last zero) dates the change: the process was last in control
 * at period i − N⁺.
 */

export interface CusumState {
  sum: number;
  /** Consecutive periods with a positive sum. */
  run: number;
}

export function newCusum(): CusumState {
  return { sum: 0, run: 0 };
}

/** Advances the upper CUSUM in place; returns true when it signals (sum above H). */
export function cusumStep(state: CusumState, value: number, target: number, reference: number, decision: number): boolean {
  state.sum = Math.max(0, value - (target + reference) + state.sum);
  state.run = state.sum > 0 ? state.run + 1 : 0;
  return state.sum > decision;
}

export interface CusumSignal {
  /** 1-based period of the first signal, or null. */
  period: number | null;
  /** 1-based period the process was last in control, or null. */
  lastInControl: number | null;
  sums: number[];
}

export function cusumRun(values: readonly number[], target: number, reference: number, decision: number): CusumSignal {
  const state = newCusum();
  const sums: number[] = [];
  let period: number | null = null;
  let lastInControl: number | null = null;
  values.forEach((value, index) => {
    const signalled = cusumStep(state, value, target, reference, decision);
    sums.push(state.sum);
    if (signalled && period === null) {
      period = index + 1;
      lastInControl = index + 1 - state.run;
    }
  });
  return { period, lastInControl, sums };
}
