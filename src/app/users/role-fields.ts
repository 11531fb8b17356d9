import type { Role } from '../../../shared/domain';
import type { UnitOption } from '../../../shared/api/users';

export const ROLE_LABELS: Record<Role, string> = { manager: 'Manager', contractor: 'Contractor', tenant: 'Tenant' };

export const ROLE_CHOICES: readonly { value: Role; label: string; hint: string }[] = [
  { value: 'tenant', label: 'Tenant', hint: 'sees their own unit only' },
  { value: 'contractor', label: 'Contractor', hint: 'sees only the work orders dispatched to them' },
  { value: 'manager', label: 'Manager', hint: 'sees the whole organization' },
];

export function unitLabel(unit: UnitOption | { label: string; propertyName: string }): string {
  return `${unit.propertyName} · ${unit.label}`;
}
