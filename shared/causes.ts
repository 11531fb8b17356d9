/**
 * What each probable cause means, for the manager's screens and the technician's work
 * order: a title in plain words, what its temperature signature looks like, the parts to
 * bring and the checks to make. The repair content is common practice of the trade (no
 * published source). Client and server both show it.
 */
import type { CauseCode } from './domain';

export interface CauseInfo {
  code: CauseCode;
  title: string;
  signature: string;
  /** Parts a technician should bring so the first visit can fix it. */
  parts: string[];
  /** Checks to make on site, in order. */
  checks: string[];
  /** Whether the likely repair may open the sealed (refrigerant) system. */
  sealedSystemPossible: boolean;
  /** Whether a technician should be sent at all. */
  dispatch: boolean;
}

/** Shown wherever the product tells someone to touch an appliance. */
export const SAFETY_CAUTIONS: readonly string[] = [
  'Disconnect power before any repair, and confirm the outlet voltage with a meter before and after.',
  'Sealed-system (refrigerant) work is for certified technicians only: in the US, EPA Section 608 Type I or Universal certification.',
  'Food-safety decisions defer to the local health authority.',
  "A landlord's duty to repair and its deadlines depend on local law and the lease; follow local codes and licensed practice.",
];

export const CAUSES: Readonly<Record<CauseCode, CauseInfo>> = {
  'evaporator-fan': {
    code: 'evaporator-fan',
    title: 'Evaporator fan motor stopped',
    signature: 'Both sections warm at a moderate pace and level off: fresh food near 10 °C (50 °F), freezer not cold enough, while the compressor keeps running.',
    parts: ['Evaporator fan motor (matching model)', 'Fan blade', 'Fan motor grommets'],
    checks: [
      'With power off, open the evaporator cover: the fan blade should spin freely by hand; check for ice around the blade.',
      'With power restored and the compressor called for, measure line voltage (about 120 V AC in North America) at the fan connector with a meter.',
      'A motor that hums or twitches but does not spin with voltage present is bad: replace it.',
      'No voltage at the connector: check the door switch and the control board output before replacing the motor.',
    ],
    sealedSystemPossible: false,
    dispatch: true,
  },
  'defrost-system': {
    code: 'defrost-system',
    title: 'Automatic defrost not working',
    signature: 'The brief defrost rises of the freezer disappear; days later the fresh food warms as ice chokes the coil and the air duct.',
    parts: ['Defrost heater', 'Defrost termination thermostat (bi-metal)', 'Defrost timer or control board (per model)'],
    checks: [
      'With power off, remove the evaporator cover and look at the coil: an even frost-over or a solid block of ice confirms a defrost failure.',
      'Measure the heater for continuity with a meter (an open heater is bad).',
      'With the coil cold, the termination thermostat should show continuity; a warm one may read open.',
      'Advance the timer or run the board test into defrost and confirm the heater draws current.',
      'Melt the ice fully (not with a sharp tool) before testing the fan and airflow again.',
    ],
    sealedSystemPossible: false,
    dispatch: true,
  },
  'condenser-airflow': {
    code: 'condenser-airflow',
    title: 'Condenser fan stopped or condenser coil dirty',
    signature: 'The compressor runs on without pulling the freezer down; the cabinet drifts up a few degrees, worse on hot days, while the fresh food may even get colder.',
    parts: ['Condenser fan motor (matching model)', 'Condenser coil brush and vacuum'],
    checks: [
      'Check that the unit has its rated clearance from walls and cabinets and that the room is not unusually hot.',
      'With power off, clean the condenser coil and the grille.',
      'With power on and the compressor running, the condenser fan must run: measure line voltage at its connector with a meter if it does not.',
      'A fan motor that hums but does not spin with voltage present is bad.',
    ],
    sealedSystemPossible: false,
    dispatch: true,
  },
  'compressor-start': {
    code: 'compressor-start',
    title: 'Compressor not starting (start relay, overload or compressor)',
    signature: 'The freezer climbs fast toward room temperature while the fan still moves its cold into the fresh food, which follows hours later; the compressor clicks but does not run.',
    parts: ['Start relay (PTC) and overload for the compressor model', 'Run capacitor if fitted'],
    checks: [
      'Confirm the outlet voltage with a meter and that the unit is plugged in and switched on.',
      'Listen for the overload clicking every few minutes: the compressor tries and fails to start.',
      'With power off, remove the relay: test it (a PTC relay shows low resistance cold; a rattling relay is broken) and test the overload for continuity.',
      'Measure the compressor windings (start, run, common) for continuity and against ground.',
      'Windings open or grounded: compressor replacement is sealed-system work for an EPA Section 608 certified technician; weigh repair against replacement.',
    ],
    sealedSystemPossible: true,
    dispatch: true,
  },
  'air-damper': {
    code: 'air-damper',
    title: 'Air damper stuck closed',
    signature: 'The fresh food warms while the freezer stays normal or even gets colder: the cold air no longer reaches the fresh-food section.',
    parts: ['Damper control assembly (motorised or mechanical, per model)'],
    checks: [
      'Check that food is not blocking the air vents between the compartments.',
      'With power off, look for ice in the duct and around the damper door.',
      'Check that the damper opens when the fresh-food section calls for cold (motorised dampers: voltage at the motor with a meter; mechanical: the control linkage).',
    ],
    sealedSystemPossible: false,
    dispatch: true,
  },
  'door-seal': {
    code: 'door-seal',
    title: 'Door seal (gasket) leaking or door not closing',
    signature: 'Readings turn spiky as warm room air rushes in, the compressor runs more and the cabinet warms a little; frost builds near the door.',
    parts: ['Door gasket for the model', 'Door hinge parts or shims if the door sags'],
    checks: [
      'Close the door on a sheet of paper at several points: it should hold the paper with some drag.',
      'Look for torn, hardened or folded gasket sections and frost near the door.',
      'Check that the unit is level enough for the doors to swing closed and that nothing inside stops them.',
    ],
    sealedSystemPossible: false,
    dispatch: true,
  },
  'power-loss': {
    code: 'power-loss',
    title: 'Power loss',
    signature: 'Several appliances of one property warm together, or one appliance warms while nothing runs at all (no fan, no compressor).',
    parts: [],
    checks: [
      'Check the breaker or fuse and the utility status before sending a technician.',
      'Confirm the outlet voltage with a meter once power is back.',
      'Keep the doors closed: a closed refrigerator keeps food safe about 4 hours, a full freezer about 48 hours (USDA FSIS).',
    ],
    sealedSystemPossible: false,
    dispatch: false,
  },
  sensor: {
    code: 'sensor',
    title: 'Temperature sensor fault',
    signature: 'The sensor reports codes instead of temperatures, the same value for hours, impossible jumps, or nothing at all; the appliance itself may be fine.',
    parts: ['Replacement probe or sensor unit', 'Batteries for the sensor'],
    checks: [
      'Check the probe cable and connector, and the sensor battery.',
      'Compare with a separate thermometer placed in the cabinet for an hour before deciding the appliance is at fault.',
    ],
    sealedSystemPossible: false,
    dispatch: false,
  },
};

export function causeInfo(code: CauseCode): CauseInfo {
  return CAUSES[code];
}
