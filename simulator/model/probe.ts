/**
 * The digital probe: a 12-bit one-wire thermometer of the common DS18B20 type. Values (from
 * memory of that part's data sheet): 0.0625 °C steps at 12-bit resolution, range −55..+125 °C,
 * −127 °C is what host libraries report when the probe does not answer (disconnected) and 85 °C
 * is the power-on reset value of its register (read before a conversion finished). Accuracy
 * about ±0.5 °C, modelled as a fixed offset per probe plus small random noise.
 */
import type { SensorEffect } from './faults';
import { gaussian, Rng } from './rng';

export const PROBE_RESOLUTION_C = 0.0625;
export const PROBE_MIN_C = -55;
export const PROBE_MAX_C = 125;
export const DISCONNECTED_SENTINEL_C = -127;
export const POWER_ON_SENTINEL_C = 85;

/** Round to the probe's 12-bit step and clamp to its range. */
export function quantizeProbeC(tempC: number): number {
  const clamped = Math.min(PROBE_MAX_C, Math.max(PROBE_MIN_C, tempC));
  return Math.round(clamped / PROBE_RESOLUTION_C) * PROBE_RESOLUTION_C;
}

/** One probe channel: keeps the last reported value so a stuck fault can repeat it. */
export class ProbeChannel {
  private lastReportedC: number | null = null;
  private stuckC: number | null = null;

  constructor(
    private readonly offsetC: number,
    private readonly noiseC: number,
  ) {}

  read(trueC: number, effect: SensorEffect, rng: Rng): number | null {
    if (effect.dropout > 0 && rng() < effect.dropout) return null;
    if (effect.disconnected > 0 && rng() < effect.disconnected) return DISCONNECTED_SENTINEL_C;
    if (effect.powerOn > 0 && rng() < effect.powerOn) return POWER_ON_SENTINEL_C;
    const measuredC = quantizeProbeC(trueC + this.offsetC + this.noiseC * gaussian(rng));
    if (!effect.stuck) {
      this.stuckC = null;
      this.lastReportedC = measuredC;
      return measuredC;
    }
    if (this.stuckC === null) this.stuckC = this.lastReportedC ?? measuredC;
    return this.stuckC;
  }
}
