/**
 * Each probe's smoothed level and learned baseline from a stored engine snapshot (for readers
 * that hold only the saved state, such as the appliance view). Live code asks the engine
 * itself: DetectionEngine.probeLevels().
 */
import type { Probe } from '../../shared/domain';
import { levelsOfState, type EngineState } from '../detection/state';
import type { ProbeLevelStatus } from '../events/internal';

export function probeLevels(state: EngineState): Partial<Record<Probe, ProbeLevelStatus>> {
  return levelsOfState(state);
}
