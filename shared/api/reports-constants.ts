/**
 * Values of the manager's reports that the web client needs at run time, without zod (the
 * request schemas and response types are in reports.ts).
 */

/** The tables a report can be downloaded as: `GET /api/reports/<table>.csv`. */
export const REPORT_TABLES = ['incident-rate', 'response-times', 'spend-by-property', 'spend-by-appliance', 'past-life', 'top-causes'] as const;
export type ReportTable = (typeof REPORT_TABLES)[number];

/** The longest range one report covers, so the month series stays bounded. */
export const MAX_REPORT_MONTHS = 60;
/** Without a range, the report covers this many calendar months up to today (this one included). */
export const DEFAULT_REPORT_MONTHS = 12;

/** The JSON report lists at most this many appliances per table; the CSV download has them all. */
export const REPORT_LIST_LIMIT = 50;
