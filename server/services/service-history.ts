/**
 * The appliance page's service history and repair rule, read from the work-order loop's
 * tables: work orders of the appliance's service requests with their parts and labour
 * (totals as the work-order view computes them), and the organization's settings row.
 */
import type { DataSource } from 'typeorm';
import { DEFAULT_REPAIR_RULE, RepairRuleSchema, type RepairRuleSettings, type ServiceHistoryEntry } from '../../shared/api/appliances';
import type { RepairRuleSource, ServiceHistorySource } from './appliances';

const HISTORY_LIMIT = 50;

type Row = Record<string, unknown>;

export class WorkOrderServiceHistory implements ServiceHistorySource {
  constructor(private readonly db: DataSource) {}

  async forAppliance(applianceId: string): Promise<ServiceHistoryEntry[]> {
    const orders: Row[] = await this.db.query(
      `SELECT w.id, w.state, c.name AS contractor_name, w.dispatched_at, w.completed_at, w.cause_found, w.findings, w.currency
         FROM work_order w JOIN service_request r ON r.id = w.service_request_id JOIN contractor c ON c.id = w.contractor_id
        WHERE r.appliance_id = $1 ORDER BY w.dispatched_at DESC LIMIT $2`,
      [applianceId, HISTORY_LIMIT],
    );
    if (!orders.length) return [];
    const ids = orders.map((order) => order.id);
    const [parts, labour]: [Row[], Row[]] = await Promise.all([
      this.db.query(`SELECT work_order_id, name, quantity, unit_cost_cents FROM work_order_part WHERE work_order_id = ANY($1::uuid[]) ORDER BY created_at`, [ids]),
      this.db.query(`SELECT work_order_id, minutes, hourly_rate_cents FROM work_order_labour WHERE work_order_id = ANY($1::uuid[])`, [ids]),
    ]);
    return orders.map((order) => {
      const own = parts.filter((part) => part.work_order_id === order.id).map((part) => ({ name: part.name as string, quantity: Number(part.quantity), unitCostCents: Number(part.unit_cost_cents) }));
      const ownLabour = labour.filter((entry) => entry.work_order_id === order.id);
      const partsCents = own.reduce((sum, part) => sum + part.quantity * part.unitCostCents, 0);
      // As the work-order view: each labour entry's minutes × hourly rate / 60, rounded to the cent.
      const labourCents = ownLabour.reduce((sum, entry) => sum + Math.round((Number(entry.minutes) * Number(entry.hourly_rate_cents)) / 60), 0);
      return {
        workOrderId: order.id as string,
        state: order.state as string,
        contractorName: order.contractor_name as string,
        dispatchedAt: (order.dispatched_at as Date).toISOString(),
        completedAt: (order.completed_at as Date | null)?.toISOString() ?? null,
        causeFound: (order.cause_found as ServiceHistoryEntry['causeFound']) ?? null,
        findings: order.findings as string,
        parts: own,
        labourMinutes: ownLabour.reduce((sum, entry) => sum + Number(entry.minutes), 0),
        totalCents: partsCents + labourCents,
        currency: order.currency as string,
      };
    });
  }
}

/** The organization's `repairOrReplace` setting (org_settings), over the defaults. */
export class OrgSettingsRepairRule implements RepairRuleSource {
  constructor(private readonly db: DataSource) {}

  async forOrganization(organizationId: string): Promise<RepairRuleSettings> {
    const [row] = await this.db.query(`SELECT settings->'repairOrReplace' AS rule, settings->>'currency' AS currency FROM org_settings WHERE organization_id = $1`, [organizationId]);
    const currency = typeof row?.currency === 'string' ? row.currency : DEFAULT_REPAIR_RULE.currency;
    const parsed = RepairRuleSchema.partial().safeParse(row?.rule ?? {});
    return { ...DEFAULT_REPAIR_RULE, currency, ...(parsed.success ? parsed.data : {}) };
  }
}
