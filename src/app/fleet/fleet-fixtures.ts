/** Test data for the fleet specs: a small invented organization. Never imported by the app. */
import type { FleetAppliance, FleetOverview, FleetProperty } from '../../../shared/api/fleet';
import { emptyHealthCounts } from '../../../shared/api/fleet-constants';
import type { Health } from '../../../shared/domain';

export function fleetAppliance(id: string, health: Health, extra: Partial<FleetAppliance> = {}): FleetAppliance {
  return { id, style: 'top-freezer', health, healthSince: '2026-03-02T12:00:00.000Z', freshFoodC: 3.2, freezerC: -18.4, ageYears: 6.2, pastExpectedLife: false, openIncident: null, ...extra };
}

export function fleetProperty(id: string, name: string, units: { id: string; label: string; appliances: FleetAppliance[] }[]): FleetProperty {
  const counts = emptyHealthCounts();
  for (const unit of units) for (const appliance of unit.appliances) counts[appliance.health] += 1;
  return { id, name, city: 'Riverton', timeZone: 'America/Chicago', counts, propertyIncidents: [], units: units.map((u) => ({ ...u, floor: null })) };
}

/** Two properties: Alder House (1A warm, 2B with a fridge and a chest freezer), Birch Court (3C cold, 4D silent). */
export function sampleOverview(): FleetOverview {
  const alder = fleetProperty('p-alder', 'Alder House', [
    { id: 'u-1a', label: '1A', appliances: [fleetAppliance('a-1a', 'warm', { freshFoodC: 7.5, openIncident: { id: 'i-1', kind: 'over-temperature', severity: 'urgent', topCause: 'evaporator-fan', openedAt: '2026-03-02T08:00:00.000Z', openCount: 1 } })] },
    { id: 'u-2b', label: '2B', appliances: [fleetAppliance('a-2b-fridge', 'cold'), fleetAppliance('a-2b-chest', 'drifting', { style: 'chest-freezer', freshFoodC: null, freezerC: -15.1 })] },
  ]);
  const birch = fleetProperty('p-birch', 'Birch Court', [
    { id: 'u-3c', label: '3C', appliances: [fleetAppliance('a-3c', 'cold')] },
    { id: 'u-4d', label: '4D', appliances: [fleetAppliance('a-4d', 'silent', { freshFoodC: null, freezerC: null, pastExpectedLife: true, ageYears: 14.2 })] },
  ]);
  const counts = emptyHealthCounts();
  for (const property of [alder, birch]) for (const health of Object.keys(counts) as Health[]) counts[health] += property.counts[health];
  return {
    generatedAt: '2026-03-02T15:00:00.000Z',
    counts,
    total: 5,
    properties: [alder, birch],
    propertyOptions: [
      { id: 'p-alder', name: 'Alder House' },
      { id: 'p-birch', name: 'Birch Court' },
    ],
  };
}
