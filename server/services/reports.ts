/**
 * The manager's reports: incidents per 100 appliances per month, response times,
 * first-visit fixes, spend, appliances past their expected life and top causes, for a
 * range of days and optionally one property, all within the manager's organization.
 */
import type { DataSource } from 'typeorm';
import { ageYears, expectedLifeYears } from '../../shared/api/fleet-constants';
import { REPORT_LIST_LIMIT } from '../../shared/api/reports-constants';
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
  ReportTable,
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

  /**
   * The report; with `sections`, only those are computed (a CSV download needs one) and the
   * others are left empty.
   */
  async report(actor: Actor, query: ReportQuery, sections: readonly ReportSection[] = REPORT_SECTIONS): Promise<ReportView> {
    const { organizationId, ...range } = await this.rangeFor(actor, query);
    const params = [organizationId, range.from, range.to, range.timeZone, range.propertyId];
    const run = (sql: string) => this.dataSource.query(sql, params) as Promise<Row[]>;
    const rangeEndMs = Date.parse(`${range.to}T00:00:00Z`);
    const parts = await Promise.all(sections.map((section) => LOADERS[section](run, rangeEndMs)));
    const view: ReportView = Object.assign(emptyReport(range), ...parts);
    return { ...view, rowCounts: { spendByAppliance: view.spendByAppliance.length, pastLife: view.pastLife.length } };
  }

  /** The report for the page: the appliance tables cut to their first REPORT_LIST_LIMIT rows. */
  async summary(actor: Actor, query: ReportQuery): Promise<ReportView> {
    const view = await this.report(actor, query);
    return { ...view, spendByAppliance: view.spendByAppliance.slice(0, REPORT_LIST_LIMIT), pastLife: view.pastLife.slice(0, REPORT_LIST_LIMIT) };
  }
}

type Run = (sql: string) => Promise<Row[]>;

export const REPORT_SECTIONS = ['incidentRate', 'responseTimes', 'spendByProperty', 'spendByAppliance', 'pastLife', 'topCauses'] as const;
export type ReportSection = (typeof REPORT_SECTIONS)[number];

/** The section each CSV table is written from. */
export const TABLE_SECTION: Readonly<Record<ReportTable, ReportSection>> = {
  'incident-rate': 'incidentRate',
  'response-times': 'responseTimes',
  'spend-by-property': 'spendByProperty',
  'spend-by-appliance': 'spendByAppliance',
  'past-life': 'pastLife',
  'top-causes': 'topCauses',
};

function emptyReport(range: ReportRange): ReportView {
  const none = { meanMinutes: null, count: 0 };
  return {
    range,
    incidentRate: [],
    responseTimes: { requests: 0, toDispatch: none, toRepair: none, toVerified: none },
    firstVisitFix: { fixedFirstVisit: 0, judged: 0, rate: null },
    spendByProperty: [],
    spendByAppliance: [],
    pastLife: [],
    topCauses: [],
    rowCounts: { spendByAppliance: 0, pastLife: 0 },
  };
}

function responseFigures(times: Row): Pick<ReportView, 'responseTimes' | 'firstVisitFix'> {
  const judged = num(times.judged);
  return {
    responseTimes: {
      requests: num(times.requests),
      toDispatch: duration(times.dispatched, times.dispatch_minutes),
      toRepair: duration(times.completed, times.repair_minutes),
      toVerified: duration(times.verified, times.verified_minutes),
    },
    firstVisitFix: { fixedFirstVisit: num(times.fixed_first_visit), judged, rate: judged ? round(num(times.fixed_first_visit) / judged, 4) : null },
  };
}

const LOADERS: Record<ReportSection, (run: Run, rangeEndMs: number) => Promise<Partial<ReportView>>> = {
  incidentRate: async (run) => ({ incidentRate: (await run(INCIDENT_RATE_SQL)).map(incidentMonth) }),
  responseTimes: async (run) => responseFigures((await run(RESPONSE_TIMES_SQL))[0]),
  spendByProperty: async (run) => ({ spendByProperty: (await run(SPEND_BY_PROPERTY_SQL)).map(propertySpend) }),
  spendByAppliance: async (run) => ({ spendByAppliance: (await run(SPEND_BY_APPLIANCE_SQL)).map(applianceSpend) }),
  pastLife: async (run, rangeEndMs) => ({
    pastLife: (await run(PAST_LIFE_SQL)).map((row) => pastLife(row, rangeEndMs)).filter((row): row is PastLifeAppliance => row !== null),
  }),
  topCauses: async (run) => ({ topCauses: (await run(TOP_CAUSES_SQL)).map(causeFigures) }),
};
