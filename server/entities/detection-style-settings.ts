import { Column, Entity, PrimaryColumn } from 'typeorm';
import type { DetectionOverrides } from '../../shared/api/settings';
import type { ApplianceStyle } from '../../shared/domain';

/** A manager's overrides of the detection defaults for one appliance style; absent keys keep the default. */
@Entity({ name: 'detection_style_settings' })
export class DetectionStyleSettings {
  @PrimaryColumn({ name: 'organization_id', type: 'uuid' })
  organizationId: string;

  @PrimaryColumn({ type: 'text' })
  style: ApplianceStyle;

  @Column({ type: 'jsonb', default: () => `'{}'` })
  overrides: DetectionOverrides;

  @Column({ name: 'updated_at', type: 'timestamptz' })
  updatedAt: Date;

  @Column({ name: 'updated_by_user_id', type: 'uuid', nullable: true })
  updatedByUserId: string | null;
}
