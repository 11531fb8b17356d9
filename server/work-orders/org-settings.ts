/**
 * Each organization's work-order settings: defaults with their reasons, overridden per
 * organization. Unknown or stale keys in the stored overrides are dropped on read.
 */
import type { DataSource } from 'typeorm';
import { OrgSettingsSchema, type OrgSettings, type OrgSettingsView, type UpdateOrgSettingsRequest } from '../../shared/api/work-orders';
import type { Actor } from '../auth/actor';
import type { Clock } from '../auth/clock';
import { OrgSettingsRecord } from '../entities/org-settings-record';
import { forbidden } from '../errors';

export const DEFAULT_ORG_SETTINGS: Readonly<OrgSettings> = Object.freeze({
  autoOpenSeverity: 'watch',
  responseMinutes: { urgent: 4 * 60, routine: 3 * 24 * 60 },
  escalateAfterMinutes: 30,
  verificationWindowMinutes: 8 * 60,
  verificationHoldMinutes: 60,
  dispatchHoldMinutes: 45,
  currency: 'USD',
});

export const ORG_SETTING_REASONS: Record<keyof OrgSettings, string> = {
  autoOpenSeverity:
    'every repair finding the engine rates "watch" or worse needs a technician sooner or later; "info" (sensor faults) never sends one',
  responseMinutes:
    'urgent: a closed refrigerator keeps food safe about 4 hours without cooling (USDA FSIS, "Keeping Food Safe During an Emergency"); routine: three days for a slow trend (common practice)',
  escalateAfterMinutes: 'half an hour without acceptance leaves the backup contractor most of the 4-hour allowance (common practice)',
  verificationWindowMinutes:
    'a repaired cabinet pulls down to its normal range within a few hours (2–4 h after a simulated fan-motor replacement); eight hours leaves room for a defrost and a full load (common practice)',
  verificationHoldMinutes: 'an hour in range shows the cooling holds, not just one compressor run (common practice)',
  dispatchHoldMinutes:
    "findings of one power loss start within the engine's 90-minute window; waiting 45 minutes lets the neighbours' findings arrive before a technician is sent to each unit (common practice)",
  currency: 'amounts are integer cents of this ISO 4217 currency',
};

function merge(overrides: Partial<OrgSettings> | null | undefined): OrgSettings {
  const merged = {
    ...DEFAULT_ORG_SETTINGS,
    ...overrides,
    responseMinutes: { ...DEFAULT_ORG_SETTINGS.responseMinutes, ...overrides?.responseMinutes },
  };
  const parsed = OrgSettingsSchema.safeParse(merged);
  return parsed.success ? parsed.data : structuredClone(DEFAULT_ORG_SETTINGS) as OrgSettings;
}

export class OrgSettingsService {
  constructor(
    private readonly dataSource: DataSource,
    private readonly clock: Clock,
  ) {}

  async forOrganization(organizationId: string): Promise<OrgSettings> {
    const record = await this.dataSource.getRepository(OrgSettingsRecord).findOneBy({ organizationId });
    return merge(record?.settings);
  }

  async view(actor: Actor): Promise<OrgSettingsView> {
    return { settings: await this.forOrganization(actor.organizationId as string), defaults: merge({}), reasons: ORG_SETTING_REASONS };
  }

  async update(actor: Actor, change: UpdateOrgSettingsRequest): Promise<OrgSettingsView> {
    if (!actor.organizationId) throw forbidden();
    const repository = this.dataSource.getRepository(OrgSettingsRecord);
    const record = await repository.findOneBy({ organizationId: actor.organizationId });
    const stored = { ...record?.settings, ...change, responseMinutes: { ...record?.settings?.responseMinutes, ...change.responseMinutes } };
    await repository.save({ organizationId: actor.organizationId, settings: stored, updatedAt: this.clock.now(), updatedByUserId: actor.id });
    return this.view(actor);
  }
}
