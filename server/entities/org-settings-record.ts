import { Column, Entity, PrimaryColumn } from 'typeorm';
import type { OrgSettings } from '../../shared/api/work-orders';

/** An organization's overrides of the work-order settings; absent keys take the defaults. */
@Entity({ name: 'org_settings' })
export class OrgSettingsRecord {
  @PrimaryColumn({ name: 'organization_id', type: 'uuid' })
  organizationId: string;

  @Column({ type: 'jsonb', default: () => `'{}'` })
  settings: Partial<OrgSettings>;

  @Column({ name: 'updated_at', type: 'timestamptz' })
  updatedAt: Date;

  @Column({ name: 'updated_by_user_id', type: 'uuid', nullable: true })
  updatedByUserId: string | null;
}
