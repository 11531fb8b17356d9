/**
 * The manager's reports: incidents per 100 appliances per month, response times,
 * first-visit fixes, spend, appliances past their expected life and top causes, for a
 * range of days and optionally one property, all within the manager's organization.
 */
import type { DataSource } from 'typeorm';
import { ageYears, expectedLifeYears } from '../../shared/api/fleet-constants';
import type {
  ApplianceSpend,
  CauseFigures,
  DurationFigure,
  IncidentRateMonth,
  Money,
  PastLifeAppliance,
  PropertySpend,
  ReportCause,
  ReportQuery,
  ReportRange,
  ReportView,
  SpendFigures,
} from '../../shared/api/reports';
import type { ApplianceStyle } from '../../shared/domain';
import type { Actor } from '../auth/actor';
import type { Clock } from '../auth/clock';
import { forbidden, notFound } from '../errors';
import { resolveRange } from './reports-range';
import { INCIDENT_RATE_SQL, PAST_LIFE_SQL, RESPONSE_TIMES_SQL, SPEND_BY_APPLIANCE_SQL, SPEND_BY_PROPERTY_SQL, TOP_CAUSES_SQL } from './reports-queries';

type Row = Record<string, unknown>;

const num = (value: unknown) => Number(value ?? 0);
const round = (value: number, places: number) => Math.round(value * 10 ** places) / 10 ** places;

function incidentMonth(row: Row): IncidentRateMonth {
  const incidents = num(row.incidents);
  const inService = num(row.appliances_in_service);
  return { month: String(row.month), incidents, appliancesInService: inService, per100Appliances: inService ? round((incidents * 100) / inService, 2) : null };
}

function duration(count: unknown, minutes: unknown): DurationFigure {
  return { count: num(count), meanMinutes: minutes === null || minutes === undefined ? null : num(minutes) };
}

function spendFigures(row: Row): SpendFigures {
  return {
    currency: String(row.currency),
    partsCents: num(row.parts_cents),
    labourCents: num(row.labour_cents),
    approvedCents: num(row.approved_cents),
    pendingCents: num(row.pending_cents),
    otherCents: num(row.other_cents),
    totalCents: num(row.total_cents),
    workOrders: num(row.work_orders),
  };
}

function propertySpend(row: Row): PropertySpend {
  return { propertyId: String(row.property_id), propertyName: String(row.property_name), ...spendFigures(row) };
}

function applianceSpend(row: Row): ApplianceSpend {
  return {
    applianceId: String(row.appliance_id),
    propertyId: String(row.property_id),
    propertyName: String(row.property_name),
    unitLabel: String(row.unit_label),
    style: row.style as ApplianceStyle,
    model: String(row.model ?? ''),
    ...spendFigures(row),
  };
}

/** Age as the appliance page computes it (shared ageYears), at the end of the range. */
function pastLife(row: Row, rangeEndMs: number): PastLifeAppliance | null {
  const style = row.style as ApplianceStyle;
  const installedOn = String(row.installed_on);
  const age = ageYears(installedOn, rangeEndMs);
  const expectedYears = expectedLifeYears(style);
  if (age === null || age <= expectedYears) return null;
  return {
    applianceId: String(row.appliance_id),
    propertyId: String(row.property_id),
    propertyName: String(row.property_name),
    unitLabel: String(row.unit_label),
    style,
    model: String(row.model ?? ''),
    installedOn,
    ageYears: age,
    expectedYears,
    incidents: num(row.incidents),
  };
}

function causeFigures(row: Row): CauseFigures {
  const spend = (row.spend as { currency: string; cents: number }[]).map((money): Money => ({ currency: money.currency, cents: num(money.cents) }));
  return { cause: row.cause as ReportCause, requests: num(row.requests), foundOnSite: num(row.found_on_site), spend };
}

export class ReportsService {
  constructor(
    private readonly dataSource: DataSource,
    private readonly clock: Clock,
  ) {}

  /** The range the query means for this manager; 404 for a property outside their organization. */
  async rangeFor(actor: Actor, query: ReportQuery): Promise<ReportRange & { organizationId: string }> {
    if (actor.role !== 'manager' || !actor.organizationId) throw forbidden('only managers read reports');
    const range = resolveRange(query, actor.timeZone, this.clock.now().getTime());
    if (range.propertyId) {
      const found = await this.dataSource.query(`SELECT 1 FROM property WHERE id = $1 AND organization_id = $2`, [range.propertyId, actor.organizationId]);
      if (!found.length) throw notFound('property');
    }
    return { ...range, organizationId: actor.organizationId };
  }

  async report(actor: Actor, query: ReportQuery): Promise<ReportView> {
    const { organizationId, ...range } = await this.rangeFor(actor, query);
    const params = [organizationId, range.from, range.to, range.timeZone, range.propertyId];
    const run = (sql: string) => this.dataSource.query(sql, params) as Promise<Row[]>;
    const [rate, [times], byProperty, byAppliance, old, causes] = await Promise.all([
      run(INCIDENT_RATE_SQL),
      run(RESPONSE_TIMES_SQL),
      run(SPEND_BY_PROPERTY_SQL),
      run(SPEND_BY_APPLIANCE_SQL),
      run(PAST_LIFE_SQL),
      run(TOP_CAUSES_SQL),
    ]);
    const rangeEndMs = Date.parse(`${range.to}T00:00:00Z`);
    const judged = num(times.judged);
    return {
      range,
      incidentRate: rate.map(incidentMonth),
      responseTimes: {
        requests: num(times.requests),
        toDispatch: duration(times.dispatched, times.dispatch_minutes),
        toRepair: duration(times.completed, times.repair_minutes),
        toVerified: duration(times.verified, times.verified_minutes),
      },
      firstVisitFix: { fixedFirstVisit: num(times.fixed_first_visit), judged, rate: judged ? round(num(times.fixed_first_visit) / judged, 4) : null },
      spendByProperty: byProperty.map(propertySpend),
      spendByAppliance: byAppliance.map(applianceSpend),
      pastLife: old.map((row) => pastLife(row, rangeEndMs)).filter((row): row is PastLifeAppliance => row !== null),
      topCauses: causes.map(causeFigures),
    };
  }
}
