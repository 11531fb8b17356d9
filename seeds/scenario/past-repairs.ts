/**
 * Trouble in the seeded history: faults injected into the backfilled traces, which the real
 * detection engine turns into findings and incidents, and for the mechanical ones the
 * completed, verified work order that fixed them (the fault ends when the technician left).
 */
import type { CauseCode } from '../../shared/domain';
import type { FaultCode } from '../../simulator/model';
import { PARTS } from './catalogue';

export interface PartUsed {
  part: keyof typeof PARTS;
  quantity: number;
}

export interface PastTrouble {
  applianceKey: string;
  fault: FaultCode;
  severity: number;
  /** Days before the scenario's "now" the fault began. */
  startDaysAgo: number;
  /** Hours from the fault's start to the repair (or, for a sensor glitch, to its end). */
  lastsH: number;
  probe?: 'fresh_food' | 'freezer';
  /** Null: no technician (a sensor glitch). */
  repair: PastRepair | null;
}

export interface PastRepair {
  causeFound: CauseCode;
  findings: string;
  parts: PartUsed[];
  labourMinutes: number;
  /** Minutes from dispatch to acceptance. */
  acceptAfterMin: number;
}

export const PAST_TROUBLE: readonly PastTrouble[] = [
  {
    applianceKey: 'p3/3A/1',
    fault: 'condenser-airflow',
    severity: 0.9,
    startDaysAgo: 74,
    lastsH: 40,
    repair: {
      causeFound: 'condenser-airflow',
      findings: 'Condenser fan motor seized and coil matted with dust. Replaced the motor, cleaned the coil; unit pulled down within two hours.',
      parts: [
        { part: 'condenserFanMotor', quantity: 1 },
        { part: 'coilCleaning', quantity: 1 },
      ],
      labourMinutes: 75,
      acceptAfterMin: 22,
    },
  },
  {
    applianceKey: 'p3/1B/2',
    fault: 'compressor-start',
    severity: 1,
    startDaysAgo: 52,
    lastsH: 22,
    repair: {
      causeFound: 'compressor-start',
      findings: 'Compressor clicking on the overload, start relay burnt. Replaced relay and overload; compressor starts and runs at normal current.',
      parts: [
        { part: 'startRelay', quantity: 1 },
        { part: 'overload', quantity: 1 },
      ],
      labourMinutes: 60,
      acceptAfterMin: 14,
    },
  },
  {
    applianceKey: 'p2/8/1',
    fault: 'compressor-start',
    severity: 1,
    startDaysAgo: 38,
    lastsH: 26,
    repair: {
      causeFound: 'compressor-start',
      findings: 'Compressor would not start, start relay rattles when shaken. Replaced the relay; windings and overload tested good.',
      parts: [{ part: 'startRelay', quantity: 1 }],
      labourMinutes: 40,
      acceptAfterMin: 41,
    },
  },
  {
    applianceKey: 'p1/206/1',
    fault: 'evaporator-fan',
    severity: 1,
    startDaysAgo: 21,
    lastsH: 16,
    repair: {
      causeFound: 'evaporator-fan',
      findings: 'Evaporator fan motor hums but does not turn, line voltage present at its connector. Replaced the motor.',
      parts: [{ part: 'evaporatorFanMotor', quantity: 1 }],
      labourMinutes: 45,
      acceptAfterMin: 9,
    },
  },
  {
    applianceKey: 'p1/403/1',
    fault: 'air-damper',
    severity: 1,
    startDaysAgo: 9,
    lastsH: 30,
    repair: {
      causeFound: 'air-damper',
      findings: 'Air damper stuck closed, fresh-food section starved of cold air. Replaced the damper control assembly.',
      parts: [{ part: 'damperControl', quantity: 1 }],
      labourMinutes: 55,
      acceptAfterMin: 33,
    },
  },
  { applianceKey: 'p3/4A/2', fault: 'sensor-stuck', severity: 1, startDaysAgo: 15, lastsH: 8, repair: null },
];
