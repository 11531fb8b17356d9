import { Column, CreateDateColumn, Entity, PrimaryGeneratedColumn } from 'typeorm';

/** Labour on a work order: time and hourly rate (integer cents). */
@Entity({ name: 'work_order_labour' })
export class WorkOrderLabour {
  @PrimaryGeneratedColumn('uuid')
  id: string;

  @Column({ name: 'work_order_id', type: 'uuid' })
  workOrderId: string;

  @Column({ type: 'integer' })
  minutes: number;

  @Column({ name: 'hourly_rate_cents', type: 'integer' })
  hourlyRateCents: number;

  @Column({ type: 'text' })
  currency: string;

  @Column({ name: 'technician_user_id', type: 'uuid', nullable: true })
  technicianUserId: string | null;

  @CreateDateColumn({ name: 'created_at', type: 'timestamptz' })
  createdAt: Date;
}
