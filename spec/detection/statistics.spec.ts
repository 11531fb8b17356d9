import { linearRegression, medianAbsoluteDeviation } from 'simple-statistics';
import { cusumRun, ewmaLimits, ewmaSeries, leastSquares, robustSigma, theilSenSlope } from '../../server/detection/stats';

describe('EWMA', () => {
  // NIST/SEMATECH e-Handbook of Statistical Methods, §6.3.2.4 "EWMA Control Charts",
  // worked example: λ = 0.3, EWMA0 = target = 50, s = 2.0539, k = 3.
  const handbookData = [
    52.0, 47.0, 53.0, 49.3, 50.1, 47.0, 51.0, 50.1, 51.2, 50.5, 49.6, 47.6, 49.9, 51.3, 47.8, 51.2, 52.6, 52.4, 53.6, 52.1,
  ];
  const handbookEwma = [
    50.6, 49.52, 50.56, 50.18, 50.16, 49.21, 49.75, 49.85, 50.26, 50.33, 50.11, 49.36, 49.52, 50.05, 49.38, 49.92, 50.73,
    51.23, 51.94, 51.99,
  ];

  it('reproduces the handbook EWMA sequence (NIST/SEMATECH e-Handbook §6.3.2.4)', () => {
    const series = ewmaSeries(handbookData, 0.3, 50);
    expect(series.length).toBe(20);
    series.forEach((value, index) => expect(value).toBeCloseTo(handbookEwma[index], 2));
  });

  it('reproduces the handbook control limits 47.4115 / 52.5884 (NIST/SEMATECH e-Handbook §6.3.2.4)', () => {
    const limits = ewmaLimits(50, 2.0539, 0.3, 3);
    expect(limits.upper).toBeCloseTo(52.5884, 4);
    // The handbook truncates the lower limit (47.41158… prints as 47.4115).
    expect(Math.abs(limits.lower - 47.4115)).toBeLessThan(1e-4);
  });

  it('finds every handbook point inside its limits, as the handbook concludes', () => {
    const limits = ewmaLimits(50, 2.0539, 0.3, 3);
    const outside = ewmaSeries(handbookData, 0.3, 50).filter((v) => v < limits.lower || v > limits.upper);
    expect(outside).toEqual([]);
  });
});

describe('tabular CUSUM', () => {
  // Montgomery, Introduction to Statistical Quality Control, Table 9.1 / Example 9.1:
  // μ0 = 10, σ = 1, K = 0.5, H = 5.
  const table91 = [
    9.45, 7.99, 9.29, 11.66, 12.16, 10.18, 8.04, 11.46, 9.2, 10.34, 9.03, 11.47, 10.51, 9.4, 10.08, 9.37, 10.62, 10.31,
    8.52, 10.84, 10.9, 9.33, 12.29, 11.5, 10.6, 11.08, 10.38, 11.62, 11.31, 10.52,
  ];
  const publishedUpperSums = [
    0, 0, 0, 1.16, 2.82, 2.5, 0.04, 1.0, 0, 0, 0, 0.97, 0.98, 0, 0, 0, 0.12, 0, 0, 0.34, 0.74, 0, 1.79, 2.79, 2.89, 3.47,
    3.35, 4.47, 5.28,
  ];

  it('first signals at observation 29 (Montgomery, Table 9.1)', () => {
    const result = cusumRun(table91, 10, 0.5, 5);
    expect(result.period).toBe(29);
  });

  it('matches the tabulated upper sums C+ for periods 1..29 (Montgomery, Table 9.1)', () => {
    const result = cusumRun(table91, 10, 0.5, 5);
    publishedUpperSums.forEach((sum, index) => expect(result.sums[index]).toBeCloseTo(sum, 2));
  });

  it('dates the shift: last in control at period 22, N+ = 7 (Montgomery, Example 9.1)', () => {
    expect(cusumRun(table91, 10, 0.5, 5).lastInControl).toBe(22);
  });

  it('does not signal on the first 20 in-control observations', () => {
    expect(cusumRun(table91.slice(0, 20), 10, 0.5, 5).period).toBeNull();
  });
});

describe('regression slope', () => {
  // NIST Statistical Reference Datasets, linear regression "Norris" (lower difficulty), 36 observations.
  // Certified: B1 = 1.00211681802045, B0 = -0.262323073774029.
  const norrisY = [
    0.1, 338.8, 118.1, 888.0, 9.2, 228.1, 668.5, 998.5, 449.1, 778.9, 559.2, 0.3, 0.1, 778.1, 668.8, 339.3, 448.9, 10.8,
    557.7, 228.3, 998.0, 888.8, 119.6, 0.3, 0.6, 557.6, 339.3, 888.0, 998.5, 778.9, 10.2, 117.6, 228.9, 668.4, 449.2, 0.2,
  ];
  const norrisX = [
    0.2, 337.4, 118.2, 884.6, 10.1, 226.5, 666.3, 996.3, 448.6, 777.0, 558.2, 0.4, 0.6, 775.5, 666.9, 338.0, 447.5, 11.6,
    556.0, 228.1, 995.8, 887.6, 120.2, 0.3, 0.3, 556.8, 339.1, 887.2, 999.0, 779.0, 11.1, 118.3, 229.2, 669.1, 448.9, 0.5,
  ];
  const certifiedSlope = 1.00211681802045;
  const certifiedIntercept = -0.262323073774029;

  it('has the 36 Norris observations', () => {
    expect(norrisX.length).toBe(36);
    expect(norrisY.length).toBe(36);
  });

  it('matches the NIST StRD Norris certified values to 12 significant digits', () => {
    const fit = leastSquares(norrisX, norrisY)!;
    expect(Math.abs(fit.slope - certifiedSlope) / certifiedSlope).toBeLessThan(1e-12);
    expect(Math.abs(fit.intercept - certifiedIntercept) / Math.abs(certifiedIntercept)).toBeLessThan(1e-10);
  });

  it('agrees with simple-statistics linearRegression on Norris', () => {
    const reference = linearRegression(norrisX.map((x, i) => [x, norrisY[i]]));
    const fit = leastSquares(norrisX, norrisY)!;
    expect(fit.slope).toBeCloseTo(reference.m, 10);
    expect(fit.intercept).toBeCloseTo(reference.b, 8);
    expect(reference.m).toBeCloseTo(certifiedSlope, 10);
  });

  it('keeps its precision when x is epoch milliseconds (Norris shifted by 1.7e12)', () => {
    const shifted = norrisX.map((x) => x + 1.7e12);
    const fit = leastSquares(shifted, norrisY)!;
    expect(Math.abs(fit.slope - certifiedSlope) / certifiedSlope).toBeLessThan(1e-9);
  });

  it('Theil–Sen is near the Norris slope and ignores one wild point that tilts least squares', () => {
    expect(theilSenSlope(norrisX, norrisY)!).toBeCloseTo(1.0, 1);
    const xs = [0, 1, 2, 3, 4, 5, 6, 7, 8, 9];
    const ys = xs.map((x) => 0.5 * x);
    ys[9] = 40; // a defrost spike at the end of a window
    expect(theilSenSlope(xs, ys)).toBeCloseTo(0.5, 10);
    expect(leastSquares(xs, ys)!.slope).toBeGreaterThan(1.5);
  });

  it('returns null for fewer than two points or no spread in x', () => {
    expect(leastSquares([1], [1])).toBeNull();
    expect(leastSquares([2, 2, 2], [1, 2, 3])).toBeNull();
    expect(theilSenSlope([3, 3], [1, 2])).toBeNull();
  });
});

describe('robust spread', () => {
  it('scales the simple-statistics MAD by 1.4826 to estimate σ', () => {
    const values = [2, 4, 4, 4, 5, 5, 7, 9];
    expect(robustSigma(values)).toBeCloseTo(1.4826 * medianAbsoluteDeviation(values), 12);
    expect(medianAbsoluteDeviation(values)).toBe(0.5);
  });
});
