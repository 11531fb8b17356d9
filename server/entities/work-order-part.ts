import { Column, CreateDateColumn, Entity, PrimaryGeneratedColumn } from 'typeorm';

/** A part replaced on a work order; money in integer cents with its currency. */
@Entity({ name: 'work_order_part' })
export class WorkOrderPart {
  @PrimaryGeneratedColumn('uuid')
  id: string;

  @Column({ name: 'work_order_id', type: 'uuid' })
  workOrderId: string;

  @Column({ type: 'text' })
  name: string;

  @Column({ type: 'integer' })
  quantity: number;

  @Column({ name: 'unit_cost_cents', type: 'integer' })
  unitCostCents: number;

  @Column({ type: 'text' })
  currency: string;

  @Column({ name: 'recorded_by_user_id', type: 'uuid', nullable: true })
  recordedByUserId: string | null;

  @CreateDateColumn({ name: 'created_at', type: 'timestamptz' })
  createdAt: Date;
}
