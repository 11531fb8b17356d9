import { Column, Entity, PrimaryGeneratedColumn } from 'typeorm';
import type { AccessWindow } from '../../shared/api/work-orders';
import type { Symptom } from '../../shared/api/tenant';

/** What a tenant reported, attached to the appliance's open request. */
@Entity({ name: 'tenant_report' })
export class TenantReportRecord {
  @PrimaryGeneratedColumn('uuid')
  id: string;

  @Column({ name: 'service_request_id', type: 'uuid' })
  serviceRequestId: string;

  @Column({ name: 'unit_id', type: 'uuid' })
  unitId: string;

  @Column({ name: 'appliance_id', type: 'uuid' })
  applianceId: string;

  @Column({ name: 'reporter_user_id', type: 'uuid', nullable: true })
  reporterUserId: string | null;

  @Column({ type: 'text', array: true })
  symptoms: Symptom[];

  @Column({ type: 'text', default: '' })
  description: string;

  /** When a technician may enter. */
  @Column({ name: 'access_windows', type: 'jsonb', default: () => `'[]'` })
  accessWindows: AccessWindow[];

  @Column({ name: 'pet_present', type: 'boolean', default: false })
  petPresent: boolean;

  @Column({ name: 'created_at', type: 'timestamptz' })
  createdAt: Date;
}
