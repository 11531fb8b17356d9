/**
 * The loop's rules as plain functions: the state machine, priority from the situation,
 * and the verification verdict from a trail of quarter-hour levels.
 */
import { DEFAULT_SETTINGS } from '../../server/detection/settings';
import { priorityOf, titleOf } from '../../server/work-orders/request-opening';
import { canMove } from '../../server/work-orders/states';
import { judgeObservations, observationsOf, probeRecovered } from '../../server/work-orders/verification';
import { WORK_ORDER_STATES } from '../../shared/api/work-orders';
import { FREEZER_LIMIT_C, FRESH_FOOD_LIMIT_C } from '../../shared/temperature';

const MINUTE_MS = 60_000;

describe('work-order rules', () => {
  describe('states', () => {
    it('follows dispatched → accepted → scheduled → on-site → completed → verified', () => {
      const path = ['dispatched', 'accepted', 'scheduled', 'on-site', 'completed', 'verified'] as const;
      for (let i = 1; i < path.length; i++) expect(canMove(path[i - 1], path[i])).withContext(`${path[i - 1]} → ${path[i]}`).toBeTrue();
    });

    it('lets a failed verification reopen the job, and a reopened job be visited again', () => {
      expect(canMove('completed', 'reopened')).toBeTrue();
      expect(canMove('reopened', 'scheduled')).toBeTrue();
      expect(canMove('reopened', 'on-site')).toBeTrue();
    });

    it('ends for good at verified, declined and cancelled, and never skips the visit', () => {
      for (const final of ['verified', 'declined', 'cancelled'] as const) {
        for (const to of WORK_ORDER_STATES) expect(canMove(final, to)).withContext(`${final} → ${to}`).toBeFalse();
      }
      expect(canMove('dispatched', 'completed')).toBeFalse();
      expect(canMove('accepted', 'completed')).toBeFalse();
      expect(canMove('scheduled', 'completed')).toBeFalse();
      expect(canMove('completed', 'cancelled')).toBeFalse();
    });
  });

  describe('priority', () => {
    it('is urgent when there is no cooling or food is at risk, routine for a slow trend', () => {
      expect(priorityOf({ kinds: ['warming-trend'], severity: 'urgent', minutes_above_4c: 0 })).toBe('routine');
      expect(priorityOf({ kinds: ['warming-trend'], severity: 'watch', minutes_above_4c: 15 })).toBe('urgent');
      expect(priorityOf({ kinds: ['warming-trend', 'over-temperature'], severity: 'urgent', minutes_above_4c: 0 })).toBe('urgent');
      expect(priorityOf({ kinds: ['no-cooling'], severity: 'urgent', minutes_above_4c: 0 })).toBe('urgent');
    });

    it('names the request after the kind and the probable cause', () => {
      expect(titleOf({ kind: 'over-temperature', top_cause: 'evaporator-fan' })).toBe('Too warm: probable evaporator fan motor stopped');
      expect(titleOf({ kind: 'warming-trend', top_cause: null })).toBe('Warming trend');
    });
  });

  describe('verification from telemetry', () => {
    it('counts a compartment as recovered below its limit and within the band of its own baseline', () => {
      // U.S. FDA, "Refrigerator Thermometers": fresh food at or below 40 °F (4.4 °C), freezer at or below 0 °F (−17.8 °C).
      expect(probeRecovered('fresh_food', FRESH_FOOD_LIMIT_C - 0.1, null)).toBeTrue();
      expect(probeRecovered('fresh_food', FRESH_FOOD_LIMIT_C + 0.1, null)).toBeFalse();
      // A unit normally at 2 °C is not recovered at 4 °C, though that is below the limit.
      expect(probeRecovered('fresh_food', 2 + DEFAULT_SETTINGS.recoveredBandC + 0.5, 2)).toBeFalse();
      expect(probeRecovered('fresh_food', 2 + DEFAULT_SETTINGS.recoveredBandC - 0.1, 2)).toBeTrue();
      expect(probeRecovered('freezer', FREEZER_LIMIT_C + DEFAULT_SETTINGS.freezerAlarmMarginC + 0.2, null)).toBeFalse();
      expect(probeRecovered('freezer', -19, -18.5)).toBeTrue();
    });

    it('verifies once recovered for the hold inside the window, and not before', () => {
      const holdMs = 60 * MINUTE_MS;
      const obs = (minutes: number, recovered: boolean) => ({ atMs: minutes * MINUTE_MS, recovered });
      const dueMs = 480 * MINUTE_MS;
      expect(judgeObservations([obs(60, true), obs(105, true)], null, dueMs, holdMs, 105 * MINUTE_MS)).toEqual({ outcome: 'waiting', recoveredSinceMs: 60 * MINUTE_MS });
      expect(judgeObservations([obs(60, true), obs(120, true)], null, dueMs, holdMs, 120 * MINUTE_MS)).toEqual({ outcome: 'verified', recoveredSinceMs: 60 * MINUTE_MS, atMs: 120 * MINUTE_MS });
      // A relapse restarts the hold.
      expect(judgeObservations([obs(60, true), obs(90, false), obs(130, true)], null, dueMs, holdMs, 130 * MINUTE_MS).outcome).toBe('waiting');
      // The hold carries over from an earlier batch.
      expect(judgeObservations([obs(100, true)], 40 * MINUTE_MS, dueMs, holdMs, 100 * MINUTE_MS).outcome).toBe('verified');
    });

    it('reopens when the window ends first, even in the middle of a batch', () => {
      const obs = (minutes: number, recovered: boolean) => ({ atMs: minutes * MINUTE_MS, recovered });
      expect(judgeObservations([obs(470, true), obs(485, true), obs(545, true)], null, 480 * MINUTE_MS, 60 * MINUTE_MS, 545 * MINUTE_MS)).toEqual({ outcome: 'reopen' });
      expect(judgeObservations([], null, 480 * MINUTE_MS, 60 * MINUTE_MS, 481 * MINUTE_MS)).toEqual({ outcome: 'reopen' });
    });

    it('reads a trail against each probe and ignores levels from before the completion', () => {
      const status = {
        probes: { fresh_food: { levelC: 3, levelAtMs: 3, baselineC: 3 }, freezer: { levelC: -18, levelAtMs: 3, baselineC: -18 } },
        trail: [
          { atMs: 1, levelsC: { fresh_food: 3, freezer: -18 } },
          { atMs: 2, levelsC: { fresh_food: 3, freezer: -12 } },
          { atMs: 3, levelsC: { fresh_food: 3, freezer: null } },
        ],
      };
      expect(observationsOf(status, 1)).toEqual([
        { atMs: 2, recovered: false },
        { atMs: 3, recovered: false },
      ]);
    });
  });
});
