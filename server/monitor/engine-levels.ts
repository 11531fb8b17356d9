/**
 * Reads each probe's smoothed level and learned baseline out of an engine snapshot.
 * The engine offers baselineC() but no level accessor yet; this is the one place that
 * looks inside its state, so a public accessor can replace it in one edit.
 */
import type { Probe } from '../../shared/domain';
import type { EngineState } from '../detection/state';
import type { ProbeLevelStatus } from '../events/internal';

export function probeLevels(state: EngineState): Partial<Record<Probe, ProbeLevelStatus>> {
  const levels: Partial<Record<Probe, ProbeLevelStatus>> = {};
  for (const p of state.probes) {
    const times = p.level.levelTimesMs;
    levels[p.probe] = {
      levelC: p.level.levelC,
      levelAtMs: times.length ? times[times.length - 1] : null,
      baselineC: p.level.baselineC,
    };
  }
  return levels;
}
