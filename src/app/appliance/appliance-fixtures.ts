/** Test data for the appliance specs: one invented appliance with an open warming trend. Never imported by the app. */
import type { ApplianceDetail, IncidentWithFindings } from '../../../shared/api/appliances';
import type { ApplianceHistory } from '../../../shared/api/telemetry';

export function openIncident(extra: Partial<IncidentWithFindings> = {}): IncidentWithFindings {
  return {
    id: 'i-open', level: 'appliance', lane: 'repair', kind: 'warming-trend', kinds: ['warming-trend'], organizationId: 'o1', propertyId: 'p1', unitId: 'u1', applianceId: 'a1',
    startedAt: '2026-03-02T05:00:00.000Z', openedAt: '2026-03-02T09:00:00.000Z', closedAt: null, severity: 'watch', topCause: 'condenser-airflow',
    probableCauses: [{ code: 'door-seal', confidence: 0.2 }, { code: 'condenser-airflow', confidence: 0.55 }], minutesAbove4c: 0, propertyIncidentId: null, applianceIds: [],
    findings: [
      { id: 'f1', kind: 'warming-trend', compartment: 'fresh_food', startedAt: '2026-03-02T05:00:00.000Z', detectedAt: '2026-03-02T09:00:00.000Z', endedAt: null, severity: 'watch', summary: 'fresh food warming 0.2 °C/h', forecastCrossingAt: '2026-03-02T21:00:00.000Z' },
    ],
    ...extra,
  };
}

export function sampleDetail(extra: Partial<ApplianceDetail> = {}): ApplianceDetail {
  const open = openIncident();
  const closed = openIncident({ id: 'i-old', kind: 'over-temperature', severity: 'urgent', topCause: 'evaporator-fan', startedAt: '2025-11-02T08:00:00.000Z', openedAt: '2025-11-02T10:00:00.000Z', closedAt: '2025-11-03T10:00:00.000Z', findings: [] });
  return {
    id: 'a1', style: 'top-freezer', model: 'TF-18 (demo)', serial: 'SN-0042', installedOn: '2018-03-02', warrantyEndsOn: '2019-03-02', underWarranty: false, archivedAt: null,
    place: { organizationId: 'o1', propertyId: 'p1', propertyName: 'Birch Court', address: '12 Example Avenue, Riverton IL 60000', timeZone: 'America/New_York', unitId: 'u1', unitLabel: '4B' },
    sensors: [{ id: 's-birch-4b', deviceId: 'cw-birch-4b', intervalSeconds: 300, lastSeenAt: '2026-03-02T14:55:00.000Z' }],
    life: { lifeClass: 'refrigerator', expectedYears: 13, ageYears: 8, lifeFraction: 0.62, source: 'NAHB / Bank of America Home Equity, Study of Life Expectancy of Home Components (2007)' },
    repairOrReplace: {
      verdict: 'weigh', summary: 'Past half of its expected life (8.0 of about 13 years): replace rather than repair if the repair would cost $600 (half the price of a new unit) or more.',
      replaceAtCents: 60_000, repairsLastYearCents: 42_000, currency: 'USD', rule: { repairShareOfNewPrice: 0.5, pastLifeShare: 0.5, newUnitPriceCents: { refrigerator: 120_000 }, currency: 'USD' },
    },
    now: { health: 'drifting', since: '2026-03-02T09:00:00.000Z', lastReadingAt: '2026-03-02T14:55:00.000Z', freshFoodC: 3.6, freezerC: -16.2 },
    normal: { ready: true, probes: { fresh_food: { baselineC: 2.6, spreadC: 0.3, levelC: 3.4 }, freezer: { baselineC: -18.1, spreadC: 0.5, levelC: -16.5 } }, cyclePeriodMinutes: 42, defrostIntervalHours: 10, defrostDurationMinutes: 28, doorOpeningsPerDay: 14 },
    defrosts: [{ at: '2026-03-02T04:10:00.000Z', probe: 'freezer' }, { at: '2026-03-02T14:10:00.000Z', probe: 'freezer' }],
    openIncident: open,
    forecast: { probe: 'fresh_food', fromAt: '2026-03-02T14:55:00.000Z', fromC: 3.6, crossingAt: '2026-03-02T21:00:00.000Z', limitC: 4.444 },
    incidents: [open, closed],
    serviceHistory: [
      { workOrderId: 'w1', state: 'verified', contractorName: 'Northwind Repair (demo)', dispatchedAt: '2025-11-02T12:00:00.000Z', completedAt: '2025-11-03T09:00:00.000Z', causeFound: 'evaporator-fan', findings: 'fan motor seized', parts: [{ name: 'Evaporator fan motor', quantity: 1, unitCostCents: 8950 }], labourMinutes: 57, totalCents: 18_225, currency: 'USD' },
    ],
    ...extra,
  };
}

export function sampleHistory(fromMs: number, toMs: number): ApplianceHistory {
  const points = (base: number): [number, number][] => Array.from({ length: 10 }, (_, i) => [fromMs + ((toMs - fromMs) * i) / 9, base + i * 0.1]);
  return {
    applianceId: 'a1', from: new Date(fromMs).toISOString(), to: new Date(toMs).toISOString(), resolution: 'rollup', source: 'rollup_5m', bucketMs: 300_000,
    probes: { fresh_food: { points: points(3), envelope: null }, freezer: { points: points(-18), envelope: null } },
    sensor: { lastSeenAt: new Date(toMs).toISOString(), intervalSeconds: 300, silent: false },
  };
}
