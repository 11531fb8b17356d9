/**
 * Physically plausible appliance simulator (pure TypeScript, no I/O). See physics.ts for the
 * thermal network, controls.ts for the control board, faults.ts for the fault signatures,
 * probe.ts for the sensor and profile.ts for the calibrated defaults.
 */
export type {
  ApplianceProfile,
  ExtraEvent,
  ExtraEventKind,
  FaultCode,
  ScheduledFault,
  SensorFaultCode,
  SimSample,
  SimulatorOptions,
  TraceOptions,
} from './types';
export { SENSOR_FAULTS } from './types';
export { createRng, deriveSeed, gaussian, uniform, logUniform } from './rng';
export type { Rng } from './rng';
export { defaultProfile, randomProfile } from './profile';
export { ApplianceSimulator } from './simulator';
export type { SimTruth } from './simulator';
export { generateTrace } from './trace';
export {
  DISCONNECTED_SENTINEL_C,
  POWER_ON_SENTINEL_C,
  PROBE_RESOLUTION_C,
  quantizeProbeC,
} from './probe';
export { localHour, doorActivity } from './environment';
