import { Column, Entity, PrimaryGeneratedColumn } from 'typeorm';
import type { CauseFound, CostStatus, DispatchMethod, Priority, WorkOrderState } from '../../shared/api/work-orders';

/** The job dispatched to a contractor for a service request. */
@Entity({ name: 'work_order' })
export class WorkOrder {
  @PrimaryGeneratedColumn('uuid')
  id: string;

  @Column({ name: 'organization_id', type: 'uuid' })
  organizationId: string;

  @Column({ name: 'service_request_id', type: 'uuid' })
  serviceRequestId: string;

  @Column({ name: 'contractor_id', type: 'uuid' })
  contractorId: string;

  @Column({ type: 'text' })
  state: WorkOrderState;

  @Column({ type: 'text' })
  priority: Priority;

  @Column({ name: 'dispatch_method', type: 'text' })
  dispatchMethod: DispatchMethod;

  @Column({ name: 'dispatched_at', type: 'timestamptz' })
  dispatchedAt: Date;

  @Column({ name: 'due_at', type: 'timestamptz' })
  dueAt: Date;

  @Column({ name: 'accepted_at', type: 'timestamptz', nullable: true })
  acceptedAt: Date | null;

  @Column({ name: 'declined_at', type: 'timestamptz', nullable: true })
  declinedAt: Date | null;

  @Column({ name: 'decline_reason', type: 'text', nullable: true })
  declineReason: string | null;

  @Column({ name: 'scheduled_start_at', type: 'timestamptz', nullable: true })
  scheduledStartAt: Date | null;

  @Column({ name: 'scheduled_end_at', type: 'timestamptz', nullable: true })
  scheduledEndAt: Date | null;

  @Column({ name: 'completed_at', type: 'timestamptz', nullable: true })
  completedAt: Date | null;

  @Column({ name: 'verified_at', type: 'timestamptz', nullable: true })
  verifiedAt: Date | null;

  /** Completion plus the verification window: reopened if not pulled back down by then. */
  @Column({ name: 'verification_due_at', type: 'timestamptz', nullable: true })
  verificationDueAt: Date | null;

  /** Since when both compartments have been back in their normal range after completion. */
  @Column({ name: 'recovered_since', type: 'timestamptz', nullable: true })
  recoveredSince: Date | null;

  @Column({ name: 'escalated_at', type: 'timestamptz', nullable: true })
  escalatedAt: Date | null;

  @Column({ name: 'escalated_from_contractor_id', type: 'uuid', nullable: true })
  escalatedFromContractorId: string | null;

  @Column({ name: 'overdue_at', type: 'timestamptz', nullable: true })
  overdueAt: Date | null;

  @Column({ name: 'reopened_count', type: 'integer', default: 0 })
  reopenedCount: number;

  @Column({ name: 'cause_found', type: 'text', nullable: true })
  causeFound: CauseFound | null;

  @Column({ name: 'cause_note', type: 'text', nullable: true })
  causeNote: string | null;

  @Column({ type: 'text', default: '' })
  findings: string;

  @Column({ type: 'text', default: '' })
  notes: string;

  @Column({ type: 'text', default: 'USD' })
  currency: string;

  @Column({ name: 'cost_status', type: 'text', default: 'none' })
  costStatus: CostStatus;

  @Column({ name: 'cost_note', type: 'text', nullable: true })
  costNote: string | null;

  @Column({ name: 'cost_decided_at', type: 'timestamptz', nullable: true })
  costDecidedAt: Date | null;

  @Column({ name: 'cost_decided_by_user_id', type: 'uuid', nullable: true })
  costDecidedByUserId: string | null;

  @Column({ name: 'created_at', type: 'timestamptz' })
  createdAt: Date;

  @Column({ name: 'updated_at', type: 'timestamptz' })
  updatedAt: Date;
}
