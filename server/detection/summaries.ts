/** Plain-words summaries of findings, in °C with °F beside (the product's screens convert again). */
import type { Probe } from '../../shared/domain';
import { cToF } from '../../shared/temperature';
import type { SensorFaultReason } from './state';

const PROBE_WORDS: Record<Probe, string> = { fresh_food: 'Fresh food', freezer: 'Freezer' };

function temp(tempC: number): string {
  return `${tempC.toFixed(1)} °C (${cToF(tempC).toFixed(0)} °F)`;
}

function clock(atMs: number): string {
  return `${new Date(atMs).toISOString().slice(0, 16).replace('T', ' ')} UTC`;
}

export function warmingSummary(probe: Probe, levelC: number, baselineC: number, slopeCPerHour: number | null, crossingAtMs: number | null | undefined): string {
  const rate = slopeCPerHour !== null && slopeCPerHour > 0.05 ? `, rising ${slopeCPerHour.toFixed(1)} °C per hour` : '';
  const crossing = crossingAtMs ? `; expected to pass its food-safety limit around ${clock(crossingAtMs)}` : '';
  return `${PROBE_WORDS[probe]} at ${temp(levelC)}, ${(levelC - baselineC).toFixed(1)} °C above its own normal of ${temp(baselineC)}${rate}${crossing}.`;
}

export function overTempSummary(probe: Probe, valueC: number, limitC: number, minutes: number): string {
  return `${PROBE_WORDS[probe]} at ${temp(valueC)}, above its limit of ${temp(limitC)} for about ${Math.round(minutes)} minutes.`;
}

export function noCoolingSummary(freshC: number | null, freezerC: number | null): string {
  const parts = [freshC !== null ? `fresh food ${temp(freshC)}` : null, freezerC !== null ? `freezer ${temp(freezerC)}` : null];
  return `No cooling: ${parts.filter(Boolean).join(' and ')}, heading toward room temperature.`;
}

const SENSOR_WORDS: Record<SensorFaultReason, string> = {
  disconnected: 'reports the "disconnected" code',
  'power-on': 'reports the power-on code instead of a measurement',
  implausible: 'reports temperatures no appliance can have',
  jumps: 'jumps faster than cabinet air can change',
  stuck: 'has reported exactly the same value for hours',
  dropout: 'has stopped reporting values',
};

export function sensorSummary(probe: Probe, reason: SensorFaultReason): string {
  return `${PROBE_WORDS[probe]} probe ${SENSOR_WORDS[reason]}; its readings are ignored until it reads normally again. Check the probe and its cable, not the appliance.`;
}
