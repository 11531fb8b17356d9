import { Column, Entity, PrimaryGeneratedColumn } from 'typeorm';
import type { RequestLevel, RequestSource, RequestStatus } from '../../shared/api/service-requests';
import type { Priority } from '../../shared/api/work-orders';

/** A request for repair: from the monitor, a tenant's report or a manager. */
@Entity({ name: 'service_request' })
export class ServiceRequest {
  @PrimaryGeneratedColumn('uuid')
  id: string;

  @Column({ name: 'organization_id', type: 'uuid' })
  organizationId: string;

  @Column({ name: 'property_id', type: 'uuid' })
  propertyId: string;

  @Column({ name: 'unit_id', type: 'uuid', nullable: true })
  unitId: string | null;

  /** Null for a property-level request (a power loss). */
  @Column({ name: 'appliance_id', type: 'uuid', nullable: true })
  applianceId: string | null;

  @Column({ type: 'text' })
  level: RequestLevel;

  @Column({ type: 'text' })
  source: RequestSource;

  @Column({ type: 'text', default: 'open' })
  status: RequestStatus;

  @Column({ type: 'text' })
  priority: Priority;

  @Column({ type: 'text' })
  title: string;

  @Column({ type: 'text', default: '' })
  description: string;

  @Column({ name: 'incident_id', type: 'uuid', nullable: true })
  incidentId: string | null;

  @Column({ type: 'text', array: true, default: () => `'{}'` })
  symptoms: string[];

  @Column({ name: 'opened_by_user_id', type: 'uuid', nullable: true })
  openedByUserId: string | null;

  @Column({ name: 'opened_at', type: 'timestamptz' })
  openedAt: Date;

  @Column({ name: 'closed_at', type: 'timestamptz', nullable: true })
  closedAt: Date | null;

  @Column({ name: 'close_reason', type: 'text', nullable: true })
  closeReason: string | null;

  @Column({ name: 'merged_into_id', type: 'uuid', nullable: true })
  mergedIntoId: string | null;

  /** Set when the request closes: fixed on the first visit, or only after a reopening. */
  @Column({ name: 'first_visit_fix', type: 'boolean', nullable: true })
  firstVisitFix: boolean | null;

  @Column({ name: 'updated_at', type: 'timestamptz' })
  updatedAt: Date;
}
