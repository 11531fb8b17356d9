/**
 * `GET /api/reports` and `GET /api/reports/<table>.csv`: the manager's reports over a date
 * range (whole days in the manager's time zone) and optionally one property.
 */
import { z } from 'zod';
import type { ApplianceStyle, CauseCode } from '../domain';
import { REPORT_TABLES } from './reports-constants';
import type { CauseFound } from './work-orders';

export { REPORT_TABLES, type ReportTable } from './reports-constants';

const IsoDate = z.iso.date('a date as YYYY-MM-DD');

export const ReportQuery = z
  .object({
    /** First day of the range, inclusive. Default: the first day of the month eleven months ago. */
    from: IsoDate.optional(),
    /** Last day of the range, inclusive. Default: today. */
    to: IsoDate.optional(),
    propertyId: z.uuid('not a property id').optional(),
  })
  .strict()
  .refine((query) => !query.from || !query.to || query.from <= query.to, { message: 'the range ends before it starts', path: ['to'] });
export type ReportQuery = z.infer<typeof ReportQuery>;

export const ReportTableParams = z.object({ table: z.enum(REPORT_TABLES) });

export interface Money {
  currency: string;
  cents: number;
}

export interface ReportRange {
  from: string;
  to: string;
  /** The IANA zone whose calendar days and months the range and the months use. */
  timeZone: string;
  propertyId: string | null;
}

export interface IncidentRateMonth {
  /** YYYY-MM in the report's time zone. */
  month: string;
  incidents: number;
  /** Appliances in service on at least one day of the month (within the range). */
  appliancesInService: number;
  /** incidents × 100 / appliancesInService, two decimals; null with no appliance in service. */
  per100Appliances: number | null;
}

export interface DurationFigure {
  /** Mean in minutes, rounded; null when nothing reached this step. */
  meanMinutes: number | null;
  count: number;
}

export interface ResponseTimes {
  /** Requests opened in the range (the population of these figures). */
  requests: number;
  toDispatch: DurationFigure;
  toRepair: DurationFigure;
  toVerified: DurationFigure;
}

export interface FirstVisitFix {
  /** Work orders verified without ever being reopened. */
  fixedFirstVisit: number;
  /** Work orders verified or reopened: the ones whose repair has been judged. */
  judged: number;
  /** fixedFirstVisit / judged, four decimals; null when none was judged. */
  rate: number | null;
}

export interface SpendFigures {
  currency: string;
  partsCents: number;
  labourCents: number;
  /** Parts + labour of work orders whose costs the manager approved. */
  approvedCents: number;
  /** … awaiting the manager's decision. */
  pendingCents: number;
  /** … not submitted yet (job not completed) or disputed. */
  otherCents: number;
  totalCents: number;
  workOrders: number;
}

export interface PropertySpend extends SpendFigures {
  propertyId: string;
  propertyName: string;
}

export interface ApplianceSpend extends SpendFigures {
  applianceId: string;
  propertyId: string;
  propertyName: string;
  unitLabel: string;
  style: ApplianceStyle;
  model: string;
}

export interface PastLifeAppliance {
  applianceId: string;
  propertyId: string;
  propertyName: string;
  unitLabel: string;
  style: ApplianceStyle;
  model: string;
  installedOn: string;
  /** Age at the end of the range, one decimal. */
  ageYears: number;
  expectedYears: number;
  /** Incidents opened on it within the range. */
  incidents: number;
}

/** A found cause, the diagnosis' cause when no technician recorded one, or unknown. */
export type ReportCause = CauseFound | CauseCode | 'unknown';

export interface CauseFigures {
  cause: ReportCause;
  requests: number;
  /** How many of those took the cause a technician recorded (the rest: the diagnosis). */
  foundOnSite: number;
  /** Parts + labour of those requests' work orders, per currency. */
  spend: Money[];
}

export interface ReportView {
  range: ReportRange;
  incidentRate: IncidentRateMonth[];
  responseTimes: ResponseTimes;
  firstVisitFix: FirstVisitFix;
  spendByProperty: PropertySpend[];
  spendByAppliance: ApplianceSpend[];
  pastLife: PastLifeAppliance[];
  topCauses: CauseFigures[];
  /**
   * How many rows the appliance tables have in all: the JSON lists the first
   * REPORT_LIST_LIMIT of each (largest spend, oldest first), the CSV download every one.
   */
  rowCounts: { spendByAppliance: number; pastLife: number };
}

