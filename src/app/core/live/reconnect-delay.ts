/**
 * Waiting time before reconnect attempt `attempt` (0 for the first): exponential from
 * `baseMs`, capped at `maxMs`, with "equal jitter" (half fixed, half random) so a fleet of
 * browsers that lost the server together does not return in one wave (common practice).
 */
export function reconnectDelayMs(attempt: number, random: () => number = Math.random, baseMs = 1_000, maxMs = 30_000): number {
  const ceilingMs = Math.min(maxMs, baseMs * 2 ** Math.max(0, attempt));
  return Math.round(ceilingMs / 2 + random() * (ceilingMs / 2));
}
