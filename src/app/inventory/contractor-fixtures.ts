/** Invented contractor companies for the contractor and coverage specs. Only specs import this file. */
import type { ContractorView } from '../../../shared/api/work-orders';

export function contractor(n: number, extra: Partial<ContractorView> = {}): ContractorView {
  return { id: `c${n}`, name: `Frostbell Repairs ${n}`, email: `jobs${n}@frostbell.example.com`, phone: `555-010${n}`, archivedAt: null, members: [], ...extra };
}
