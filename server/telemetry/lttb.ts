import { LTTB } from 'downsample';
import type { HistoryPoint } from '../../shared/api/telemetry';

/**
 * Largest-Triangle-Three-Buckets (Steinarsson 2013, "Downsampling Time Series for Visual
 * Representation") from the `downsample` package. Keeps the first and last point and, per
 * bucket, the point that spans the largest triangle with its neighbours.
 */
export function lttb(points: HistoryPoint[], threshold: number): HistoryPoint[] {
  if (points.length <= threshold || threshold < 3) return points;
  return LTTB(points, threshold) as HistoryPoint[];
}
