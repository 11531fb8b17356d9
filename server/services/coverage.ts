/**
 * The coverage table: which contractor is dispatched, as primary and as backup, for a
 * property and appliance style. A row without a style covers the property's other styles.
 */
import type { DataSource, EntityManager } from 'typeorm';
import type { CoverageRank, CoverageView, SetCoverageRequest } from '../../shared/api/work-orders';
import type { ApplianceStyle } from '../../shared/domain';
import type { Actor } from '../auth/actor';
import { Coverage } from '../entities/coverage';
import { badRequest, notFound } from '../errors';
import type { WorkOrderScope } from '../work-orders/work-order-scope';

type Db = DataSource | EntityManager;

export interface CoveringContractor {
  contractorId: string;
  name: string;
}

export class CoverageService {
  constructor(
    private readonly dataSource: DataSource,
    private readonly scope: WorkOrderScope,
  ) {}

  async list(actor: Actor, propertyId?: string): Promise<CoverageView[]> {
    const rows: Record<string, unknown>[] = await this.dataSource.query(
      `SELECT cv.id, cv.property_id, p.name AS property_name, cv.appliance_style, cv.rank, cv.contractor_id, c.name AS contractor_name
         FROM coverage cv JOIN property p ON p.id = cv.property_id JOIN contractor c ON c.id = cv.contractor_id
        WHERE cv.organization_id = $1 AND ($2::uuid IS NULL OR cv.property_id = $2)
        ORDER BY p.name, cv.appliance_style NULLS LAST, cv.rank DESC`,
      [actor.organizationId, propertyId ?? null],
    );
    return rows.map((row) => ({
      id: row.id as string,
      propertyId: row.property_id as string,
      propertyName: row.property_name as string,
      applianceStyle: (row.appliance_style as ApplianceStyle | null) ?? null,
      rank: row.rank as CoverageRank,
      contractorId: row.contractor_id as string,
      contractorName: row.contractor_name as string,
    }));
  }

  /** Fills (or with a null contractor, clears) one slot of the table. */
  async set(actor: Actor, change: SetCoverageRequest): Promise<CoverageView[]> {
    if (!(await this.scope.canReadProperty(actor, change.propertyId))) throw notFound('property');
    await this.dataSource.transaction(async (db) => {
      await db.query(`DELETE FROM coverage WHERE property_id = $1 AND appliance_style IS NOT DISTINCT FROM $2 AND rank = $3`, [change.propertyId, change.applianceStyle, change.rank]);
      if (!change.contractorId) return;
      const [contractor] = await db.query(`SELECT id FROM contractor WHERE id = $1 AND organization_id = $2 AND archived_at IS NULL`, [change.contractorId, actor.organizationId]);
      if (!contractor) throw notFound('contractor');
      const other = change.rank === 'primary' ? 'backup' : 'primary';
      const [clash] = await db.query(`SELECT 1 FROM coverage WHERE property_id = $1 AND appliance_style IS NOT DISTINCT FROM $2 AND rank = $3 AND contractor_id = $4`, [change.propertyId, change.applianceStyle, other, change.contractorId]);
      if (clash) throw badRequest('the primary and the backup must be different contractors');
      await db.getRepository(Coverage).insert({ organizationId: actor.organizationId as string, propertyId: change.propertyId, applianceStyle: change.applianceStyle, rank: change.rank, contractorId: change.contractorId });
    });
    return this.list(actor, change.propertyId);
  }

  /** The contractor for a slot: the style's own row first, then the property-wide row. */
  async covering(db: Db, propertyId: string, style: ApplianceStyle | null, rank: CoverageRank): Promise<CoveringContractor | null> {
    const [row] = await db.query(
      `SELECT c.id, c.name FROM coverage cv JOIN contractor c ON c.id = cv.contractor_id
        WHERE cv.property_id = $1 AND cv.rank = $2 AND c.archived_at IS NULL AND (cv.appliance_style = $3 OR cv.appliance_style IS NULL)
        ORDER BY cv.appliance_style NULLS LAST LIMIT 1`,
      [propertyId, rank, style],
    );
    return row ? { contractorId: row.id, name: row.name } : null;
  }
}
