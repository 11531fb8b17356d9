import { Column, Entity, PrimaryGeneratedColumn } from 'typeorm';
import type { WorkOrderState } from '../../shared/api/work-orders';

/** One change of a work order, with who made it and when (null user: the system). */
@Entity({ name: 'work_order_event' })
export class WorkOrderEvent {
  @PrimaryGeneratedColumn({ type: 'bigint' })
  id: string;

  @Column({ name: 'work_order_id', type: 'uuid' })
  workOrderId: string;

  @Column({ type: 'timestamptz' })
  at: Date;

  @Column({ name: 'actor_user_id', type: 'uuid', nullable: true })
  actorUserId: string | null;

  @Column({ name: 'actor_kind', type: 'text' })
  actorKind: 'user' | 'system';

  @Column({ type: 'text' })
  type: string;

  @Column({ name: 'from_state', type: 'text', nullable: true })
  fromState: WorkOrderState | null;

  @Column({ name: 'to_state', type: 'text', nullable: true })
  toState: WorkOrderState | null;

  @Column({ type: 'jsonb', default: () => `'{}'` })
  detail: Record<string, unknown>;
}
