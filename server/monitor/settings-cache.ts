/**
 * The detection settings the live monitor judges each appliance with: the organization's
 * overrides for the appliance's style over the engine's defaults, read through
 * DetectionSettingsService.effective and kept in memory per (organization, style).
 *
 * An entry is dropped when a manager changes or resets that style's settings in this process
 * (the service announces it); as a fallback for changes made by another server process, an
 * entry is also re-read once it is older than `maxAgeMs`.
 */
import type { ApplianceStyle } from '../../shared/domain';
import type { DetectionSettings } from '../detection/settings';
import { onDetectionSettingsChanged } from '../services/detection-settings';

export interface SettingsSource {
  effective(organizationId: string, style: ApplianceStyle): Promise<DetectionSettings>;
}

/** Five minutes: a change made through another process reaches the monitor within that (common practice). */
export const SETTINGS_MAX_AGE_MS = 5 * 60_000;

interface Entry {
  settings: Promise<DetectionSettings>;
  loadedAtMs: number;
}

export class EffectiveSettingsCache {
  private readonly entries = new Map<string, Entry>();
  private readonly stopListening: () => void;

  constructor(
    private readonly source: SettingsSource,
    private readonly nowMs: () => number,
    private readonly maxAgeMs = SETTINGS_MAX_AGE_MS,
  ) {
    this.stopListening = onDetectionSettingsChanged((organizationId, style) => this.invalidate(organizationId, style));
  }

  /** The same object for as long as the entry lives: a caller can tell a change by identity. */
  get(organizationId: string, style: ApplianceStyle): Promise<DetectionSettings> {
    const key = `${organizationId}|${style}`;
    const entry = this.entries.get(key);
    const nowMs = this.nowMs();
    if (entry && nowMs - entry.loadedAtMs < this.maxAgeMs) return entry.settings;
    const settings = this.source.effective(organizationId, style);
    this.entries.set(key, { settings, loadedAtMs: nowMs });
    // A failed read is not remembered: the next batch asks again.
    settings.catch(() => {
      if (this.entries.get(key)?.settings === settings) this.entries.delete(key);
    });
    return settings;
  }

  invalidate(organizationId: string, style: ApplianceStyle): void {
    this.entries.delete(`${organizationId}|${style}`);
  }

  close(): void {
    this.stopListening();
    this.entries.clear();
  }
}
