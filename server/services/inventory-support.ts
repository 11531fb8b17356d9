import type { EntityManager } from 'typeorm';
import type { Actor } from '../auth/actor';
import { HttpError } from '../errors';
import type { ArchiveFilter } from '../../shared/api/inventory';

/**
 * The organization a manager's inventory requests act on. Routes already admit managers
 * only; this is the service's own check, so a manager without an organization reaches nothing.
 */
export function organizationOf(actor: Actor): string {
  if (actor.role !== 'manager' || !actor.organizationId) throw new HttpError(403, 'only a manager of an organization keeps an inventory');
  return actor.organizationId;
}

/** An ILIKE pattern matching `text` anywhere, with the wildcards in it taken literally. */
export function containsPattern(text: string): string {
  return `%${text.replace(/[\\%_]/g, (char) => `\\${char}`)}%`;
}

/** SQL condition on an `archived_at` column for the list filter. */
export function archiveCondition(column: string, status: ArchiveFilter): string {
  if (status === 'active') return `${column} IS NULL`;
  if (status === 'archived') return `${column} IS NOT NULL`;
  return 'TRUE';
}

export function isoOrNull(value: Date | string | null | undefined): string | null {
  if (value === null || value === undefined) return null;
  return (value instanceof Date ? value : new Date(value)).toISOString();
}

/** PostgreSQL's unique_violation, optionally on a named constraint. */
export function isUniqueViolation(error: unknown, constraint?: string): boolean {
  const pgError = (error as { driverError?: { code?: string; constraint?: string }; code?: string; constraint?: string }) ?? {};
  const code = pgError.driverError?.code ?? pgError.code;
  const name = pgError.driverError?.constraint ?? pgError.constraint;
  return code === '23505' && (constraint === undefined || name === constraint);
}

/**
 * Serialises the property-name checks of one organization (creating, renaming, restoring,
 * importing) so two concurrent transactions cannot both take the same name.
 */
export async function lockPropertyNames(manager: EntityManager, organizationId: string): Promise<void> {
  await manager.query('SELECT pg_advisory_xact_lock(hashtext($1))', [`property-names:${organizationId}`]);
}
