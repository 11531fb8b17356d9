/** An invented report response for the reports specs. Only specs import this file. */
import type { ReportView } from '../../../shared/api/reports';

export const ALDER_ID = '11111111-1111-4111-8111-111111111111';
export const BIRCH_ID = '22222222-2222-4222-8222-222222222222';

export function sampleReport(extra: Partial<ReportView> = {}): ReportView {
  return {
    range: { from: '2025-12-01', to: '2026-02-28', timeZone: 'UTC', propertyId: null },
    incidentRate: [
      { month: '2025-12', incidents: 1, appliancesInService: 5, per100Appliances: 20 },
      { month: '2026-01', incidents: 2, appliancesInService: 6, per100Appliances: 33.33 },
      { month: '2026-02', incidents: 0, appliancesInService: 0, per100Appliances: null },
    ],
    responseTimes: { requests: 7, toDispatch: { meanMinutes: 190, count: 6 }, toRepair: { meanMinutes: 1830, count: 4 }, toVerified: { meanMinutes: 4380, count: 2 } },
    firstVisitFix: { fixedFirstVisit: 1, judged: 3, rate: 0.3333 },
    spendByProperty: [
      { propertyId: ALDER_ID, propertyName: 'Alder House', currency: 'USD', partsCents: 17900, labourCents: 30500, approvedCents: 26900, pendingCents: 19500, otherCents: 2000, totalCents: 48400, workOrders: 3 },
    ],
    spendByAppliance: [
      {
        applianceId: 'appliance-a1',
        propertyId: ALDER_ID,
        propertyName: 'Alder House',
        unitLabel: '1A',
        style: 'top-freezer',
        model: 'TF-18',
        currency: 'USD',
        partsCents: 10900,
        labourCents: 18000,
        approvedCents: 26900,
        pendingCents: 0,
        otherCents: 2000,
        totalCents: 28900,
        workOrders: 2,
      },
    ],
    pastLife: [
      { applianceId: 'appliance-a1', propertyId: ALDER_ID, propertyName: 'Alder House', unitLabel: '1A', style: 'top-freezer', model: '', installedOn: '2010-06-01', ageYears: 15.7, expectedYears: 13, incidents: 2 },
    ],
    topCauses: [
      { cause: 'evaporator-fan', requests: 2, foundOnSite: 1, spend: [{ currency: 'USD', cents: 32900 }] },
      { cause: 'compressor-start', requests: 1, foundOnSite: 1, spend: [{ currency: 'USD', cents: 45000 }] },
      { cause: 'unknown', requests: 1, foundOnSite: 0, spend: [] },
    ],
    rowCounts: { spendByAppliance: 1, pastLife: 1 },
    ...extra,
  };
}

export function emptyReport(): ReportView {
  return sampleReport({
    incidentRate: [{ month: '2026-02', incidents: 0, appliancesInService: 4, per100Appliances: 0 }],
    responseTimes: { requests: 0, toDispatch: { meanMinutes: null, count: 0 }, toRepair: { meanMinutes: null, count: 0 }, toVerified: { meanMinutes: null, count: 0 } },
    firstVisitFix: { fixedFirstVisit: 0, judged: 0, rate: null },
    spendByProperty: [],
    spendByAppliance: [],
    pastLife: [],
    topCauses: [],
    rowCounts: { spendByAppliance: 0, pastLife: 0 },
  });
}
