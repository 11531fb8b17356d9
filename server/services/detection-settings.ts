import type { DataSource } from 'typeorm';
import {
  DETECTION_SETTING_FIELDS,
  DetectionOverridesSchema,
  fieldsFor,
  type DetectionOverrides,
  type DetectionSettingsView,
  type StyleSettingsView,
} from '../../shared/api/settings';
import { APPLIANCE_STYLES, probesOf, type ApplianceStyle } from '../../shared/domain';
import type { Actor } from '../auth/actor';
import { SETTING_DOCS, settingsFor, type DetectionSettings } from '../detection/settings';
import { DetectionStyleSettings } from '../entities/detection-style-settings';
import { badRequest } from '../errors';
import { isoOrNull, organizationOf } from './inventory-support';

const STYLE_NAMES: Record<ApplianceStyle, string> = {
  'top-freezer': 'a top-freezer refrigerator',
  'bottom-freezer': 'a bottom-freezer refrigerator',
  'side-by-side': 'a side-by-side refrigerator',
  'fresh-food-only': 'a fresh-food-only refrigerator',
  'upright-freezer': 'an upright freezer',
  'chest-freezer': 'a chest freezer',
};

/** Stored overrides pass the current bounds again on read: a stale or hand-edited key is dropped. */
function clean(stored: unknown): DetectionOverrides {
  const source = (stored && typeof stored === 'object' ? stored : {}) as Record<string, unknown>;
  const result: DetectionOverrides = {};
  for (const field of DETECTION_SETTING_FIELDS) {
    if (source[field.key] === undefined) continue;
    const one = DetectionOverridesSchema.safeParse({ [field.key]: source[field.key] });
    if (one.success) Object.assign(result, one.data);
  }
  return result;
}

export type DetectionSettingsListener = (organizationId: string, style: ApplianceStyle) => void;

const changeListeners = new Set<DetectionSettingsListener>();

/**
 * Tells the listener whenever a style's overrides are replaced or reset in this process (the
 * live monitor drops its cached settings for that organization and style). Returns the
 * function that stops listening.
 */
export function onDetectionSettingsChanged(listener: DetectionSettingsListener): () => void {
  changeListeners.add(listener);
  return () => changeListeners.delete(listener);
}

function announceChange(organizationId: string, style: ApplianceStyle): void {
  for (const listener of changeListeners) listener(organizationId, style);
}

/**
 * The manager's detection overrides per appliance style, over the engine's documented
 * defaults. The live monitor and the logger-file analysis read them through `effective`.
 */
export class DetectionSettingsService {
  constructor(private readonly dataSource: DataSource) {}

  async view(actor: Actor): Promise<DetectionSettingsView> {
    const organizationId = organizationOf(actor);
    const rows: { style: ApplianceStyle; overrides: unknown; updated_at: Date; updated_by: string | null }[] = await this.dataSource.query(
      `SELECT d.style, d.overrides, d.updated_at, u.display_name AS updated_by
         FROM detection_style_settings d LEFT JOIN app_user u ON u.id = d.updated_by_user_id WHERE d.organization_id = $1`,
      [organizationId],
    );
    const byStyle = new Map(rows.map((row) => [row.style, row]));
    const styles: StyleSettingsView[] = APPLIANCE_STYLES.map((style) => {
      const row = byStyle.get(style);
      return { style, probes: [...probesOf(style)], overrides: clean(row?.overrides), updatedAt: isoOrNull(row?.updated_at), updatedBy: row?.updated_by ?? null };
    });
    const fields = DETECTION_SETTING_FIELDS.map((field) => ({ ...field, defaultValue: SETTING_DOCS[field.key].value as number, reason: SETTING_DOCS[field.key].reason }));
    return { fields, styles };
  }

  /** Replaces the style's overrides; an empty set means the defaults apply. */
  async replace(actor: Actor, style: ApplianceStyle, overrides: DetectionOverrides): Promise<DetectionSettingsView> {
    const organizationId = organizationOf(actor);
    const allowed = new Set(fieldsFor(probesOf(style)).map((field) => field.key));
    const stray = (Object.keys(overrides) as (keyof DetectionOverrides)[]).filter((key) => overrides[key] !== undefined && !allowed.has(key));
    if (stray.length) throw badRequest(`${stray.join(', ')} do${stray.length > 1 ? '' : 'es'} not apply to ${STYLE_NAMES[style]}`);
    await this.dataSource.getRepository(DetectionStyleSettings).save({ organizationId, style, overrides, updatedAt: new Date(), updatedByUserId: actor.id });
    announceChange(organizationId, style);
    return this.view(actor);
  }

  async reset(actor: Actor, style: ApplianceStyle): Promise<DetectionSettingsView> {
    const organizationId = organizationOf(actor);
    await this.dataSource.getRepository(DetectionStyleSettings).delete({ organizationId, style });
    announceChange(organizationId, style);
    return this.view(actor);
  }

  async overridesFor(organizationId: string, style: ApplianceStyle): Promise<DetectionOverrides> {
    const row = await this.dataSource.getRepository(DetectionStyleSettings).findOneBy({ organizationId, style });
    return clean(row?.overrides);
  }

  /** Defaults, the style's defaults, then this organization's overrides for the style. */
  async effective(organizationId: string, style: ApplianceStyle): Promise<DetectionSettings> {
    return settingsFor(style, await this.overridesFor(organizationId, style));
  }
}
