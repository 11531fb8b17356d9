/**
 * The fault schedule of the command line:
 *   --fault CODE@TARGET[,start=WHEN][,for=DURATION][,severity=0..1][,probe=fresh_food|freezer]
 * TARGET is a device id, a 1-based appliance number in the fleet file, or property:KEY
 * (every appliance of that property: how a power cut behaves). WHEN is an ISO 8601 time,
 * "+6h" after the simulation start or "-2d" before now; DURATION is like "90m", "5h", "2d".
 */
import { PROBES, type Probe } from '../../shared/domain';
import type { FaultCode, ScheduledFault } from '../model';
import type { FleetDevice, FleetFault, FleetFile } from './fleet';

export const FAULT_CODES: readonly FaultCode[] = [
  'evaporator-fan',
  'defrost-system',
  'condenser-airflow',
  'compressor-start',
  'air-damper',
  'door-seal',
  'power-loss',
  'sensor-disconnected',
  'sensor-power-on',
  'sensor-stuck',
  'sensor-dropout',
];

const UNIT_MS: Record<string, number> = { s: 1000, m: 60_000, h: 3_600_000, d: 86_400_000 };

export function parseDurationMs(text: string): number {
  const match = /^(\d+(?:\.\d+)?)(s|m|h|d)$/.exec(text.trim());
  if (!match) throw new Error(`"${text}" is not a duration like 90m, 5h or 2d`);
  return Number(match[1]) * UNIT_MS[match[2]];
}

/** "+6h" after simStartMs, "-2d" before nowMs, or an ISO 8601 time. */
export function parseWhenMs(text: string, simStartMs: number, nowMs: number): number {
  if (text.startsWith('+')) return simStartMs + parseDurationMs(text.slice(1));
  if (text.startsWith('-')) return nowMs - parseDurationMs(text.slice(1));
  const atMs = Date.parse(text);
  if (!Number.isFinite(atMs)) throw new Error(`"${text}" is not +DURATION, -DURATION or an ISO 8601 time`);
  return atMs;
}

export type ParsedFault = FleetFault;

function resolveTarget(target: string, fleet: FleetFile): Pick<FleetFault, 'deviceId' | 'propertyKey'> {
  if (target.startsWith('property:')) {
    const key = target.slice('property:'.length);
    if (!fleet.properties.some((property) => property.key === key)) throw new Error(`no property "${key}" in the fleet file`);
    return { propertyKey: key };
  }
  if (/^\d+$/.test(target)) {
    const device = fleet.devices[Number(target) - 1];
    if (!device) throw new Error(`appliance number ${target} is outside 1-${fleet.devices.length}`);
    return { deviceId: device.deviceId };
  }
  if (!fleet.devices.some((device) => device.deviceId === target)) throw new Error(`no device "${target}" in the fleet file`);
  return { deviceId: target };
}

export function parseFaultSpec(spec: string, fleet: FleetFile, simStartMs: number, nowMs: number): ParsedFault {
  const [head, ...options] = spec.split(',');
  const [code, target] = head.split('@');
  if (!FAULT_CODES.includes(code as FaultCode)) throw new Error(`unknown fault "${code}"; one of ${FAULT_CODES.join(', ')}`);
  if (!target) throw new Error(`--fault ${spec}: say which appliance, e.g. ${code}@1`);
  const fault: ParsedFault = { fault: code as FaultCode, ...resolveTarget(target, fleet), startMs: simStartMs, endMs: null };
  let durationMs: number | null = null;
  for (const option of options) {
    const [key, value] = option.split('=');
    if (key === 'start') fault.startMs = parseWhenMs(value, simStartMs, nowMs);
    else if (key === 'for') durationMs = parseDurationMs(value);
    else if (key === 'severity') fault.severity = Math.min(1, Math.max(0, Number(value)));
    else if (key === 'probe' && PROBES.includes(value as Probe)) fault.probe = value as Probe;
    else throw new Error(`--fault ${spec}: cannot read "${option}"`);
  }
  if (durationMs !== null) fault.endMs = fault.startMs + durationMs;
  return fault;
}

/** The faults that apply to one device, in the model's form. */
export function faultsFor(device: FleetDevice, faults: readonly ParsedFault[]): ScheduledFault[] {
  return faults
    .filter((fault) => fault.deviceId === device.deviceId || fault.propertyKey === device.propertyKey)
    .map((fault) => ({ fault: fault.fault, startMs: fault.startMs, endMs: fault.endMs ?? null, severity: fault.severity, probe: fault.probe }));
}
