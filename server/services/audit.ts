import type { DataSource, Repository } from 'typeorm';
import type { AuditAction, AuditEntry as AuditEntryView, AuditQuery, Page } from '../../shared/api/users';
import type { Actor } from '../auth/actor';
import type { Clock } from '../auth/clock';
import { AuditEntry } from '../entities/audit-entry';
import { forbidden } from '../errors';

export interface AuditRecord {
  action: AuditAction;
  actor?: Actor | null;
  /** Defaults to the actor's organization. */
  organizationId?: string | null;
  targetType?: string;
  targetId?: string;
  ip?: string | null;
  /** Never a password or a token: ids, roles, e-mail addresses. */
  detail?: Record<string, unknown>;
}

/** The audit log: sign-ins, role changes, deactivations, invitations and data exports. */
export class AuditService {
  private readonly entries: Repository<AuditEntry>;

  constructor(
    dataSource: DataSource,
    private readonly clock: Clock,
  ) {
    this.entries = dataSource.getRepository(AuditEntry);
  }

  async record(record: AuditRecord): Promise<void> {
    const entry: Partial<AuditEntry> = {
      at: this.clock.now(),
      action: record.action,
      organizationId: record.organizationId ?? record.actor?.organizationId ?? null,
      actorUserId: record.actor?.id ?? null,
      actorEmail: record.actor?.email ?? null,
      targetType: record.targetType ?? null,
      targetId: record.targetId ?? null,
      ip: record.ip ?? null,
      detail: record.detail ?? {},
    };
    await this.entries.save(this.entries.create(entry));
  }

  /** An admin reads their own organization's log, newest first. */
  async list(actor: Actor, query: AuditQuery): Promise<Page<AuditEntryView>> {
    if (actor.role !== 'manager' || !actor.isAdmin || !actor.organizationId) throw forbidden('Only an administrator reads the audit log.');
    const where = { organizationId: actor.organizationId, ...(query.action ? { action: query.action } : {}) };
    const [rows, total] = await this.entries.findAndCount({
      where,
      order: { at: 'DESC', id: 'DESC' },
      skip: query.page * query.pageSize,
      take: query.pageSize,
    });
    return { items: rows.map(toView), total, page: query.page, pageSize: query.pageSize };
  }
}

function toView(row: AuditEntry): AuditEntryView {
  return {
    id: String(row.id),
    at: row.at.toISOString(),
    action: row.action,
    actorEmail: row.actorEmail,
    targetType: row.targetType,
    targetId: row.targetId,
    ip: row.ip,
    detail: row.detail,
  };
}
