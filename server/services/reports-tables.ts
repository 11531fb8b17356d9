/**
 * Each report table as rows for a CSV download. Money columns are integer cents with
 * their currency beside them, as stored, so a spreadsheet sums them without rounding.
 */
import type { ReportTable, ReportView, SpendFigures } from '../../shared/api/reports';
import type { CsvTable, CsvValue } from './reports-csv';

const SPEND_HEADER = ['currency', 'parts_cents', 'labour_cents', 'approved_cents', 'pending_cents', 'other_cents', 'total_cents', 'work_orders'];

function spendCells(row: SpendFigures): CsvValue[] {
  return [row.currency, row.partsCents, row.labourCents, row.approvedCents, row.pendingCents, row.otherCents, row.totalCents, row.workOrders];
}

/** One spend column per currency present, so each cause stays one row. */
function topCauses(view: ReportView): CsvTable {
  const currencies = [...new Set(view.topCauses.flatMap((row) => row.spend.map((money) => money.currency)))].sort();
  return {
    header: ['cause', 'requests', 'found_on_site', ...currencies.map((currency) => `spend_cents_${currency.toLowerCase()}`)],
    rows: view.topCauses.map((row) => [
      row.cause,
      row.requests,
      row.foundOnSite,
      ...currencies.map((currency) => row.spend.find((money) => money.currency === currency)?.cents ?? 0),
    ]),
  };
}

const TABLES: Record<ReportTable, (view: ReportView) => CsvTable> = {
  'incident-rate': (view) => ({
    header: ['month', 'incidents', 'appliances_in_service', 'incidents_per_100_appliances'],
    rows: view.incidentRate.map((row) => [row.month, row.incidents, row.appliancesInService, row.per100Appliances]),
  }),
  'response-times': (view) => {
    const { responseTimes: times, firstVisitFix: fix } = view;
    return {
      header: ['measure', 'mean_minutes', 'count', 'of'],
      rows: [
        ['opened to dispatched', times.toDispatch.meanMinutes, times.toDispatch.count, times.requests],
        ['opened to completed', times.toRepair.meanMinutes, times.toRepair.count, times.requests],
        ['opened to verified', times.toVerified.meanMinutes, times.toVerified.count, times.requests],
        ['first-visit fix rate', fix.rate, fix.fixedFirstVisit, fix.judged],
      ],
    };
  },
  'spend-by-property': (view) => ({
    header: ['property_id', 'property', ...SPEND_HEADER],
    rows: view.spendByProperty.map((row) => [row.propertyId, row.propertyName, ...spendCells(row)]),
  }),
  'spend-by-appliance': (view) => ({
    header: ['appliance_id', 'property', 'unit', 'style', 'model', ...SPEND_HEADER],
    rows: view.spendByAppliance.map((row) => [row.applianceId, row.propertyName, row.unitLabel, row.style, row.model, ...spendCells(row)]),
  }),
  'past-life': (view) => ({
    header: ['appliance_id', 'property', 'unit', 'style', 'model', 'installed_on', 'age_years', 'expected_life_years', 'incidents_in_range'],
    rows: view.pastLife.map((row) => [row.applianceId, row.propertyName, row.unitLabel, row.style, row.model, row.installedOn, row.ageYears, row.expectedYears, row.incidents]),
  }),
  'top-causes': topCauses,
};

export function reportTable(view: ReportView, table: ReportTable): CsvTable {
  return TABLES[table](view);
}
