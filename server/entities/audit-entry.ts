import { Column, Entity, PrimaryGeneratedColumn } from 'typeorm';
import type { AuditAction } from '../../shared/api/users';

/**
 * One line of the audit log. Ids are plain values, not foreign keys, so the log outlives
 * the users and records it mentions.
 */
@Entity({ name: 'audit_log' })
export class AuditEntry {
  @PrimaryGeneratedColumn({ type: 'bigint' })
  id: string;

  @Column({ type: 'timestamptz' })
  at: Date;

  @Column({ name: 'organization_id', type: 'uuid', nullable: true })
  organizationId: string | null;

  @Column({ name: 'actor_user_id', type: 'uuid', nullable: true })
  actorUserId: string | null;

  /** The actor's e-mail at the time, kept because the account may change or go. */
  @Column({ name: 'actor_email', type: 'text', nullable: true })
  actorEmail: string | null;

  @Column({ type: 'text' })
  action: AuditAction;

  @Column({ name: 'target_type', type: 'text', nullable: true })
  targetType: string | null;

  @Column({ name: 'target_id', type: 'text', nullable: true })
  targetId: string | null;

  @Column({ type: 'text', nullable: true })
  ip: string | null;

  @Column({ type: 'jsonb', default: {} })
  detail: Record<string, unknown>;
}
