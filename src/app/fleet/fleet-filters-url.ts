/** The fleet filters kept in the page's query string, so a reload or a shared link shows the same fleet. */
import type { ParamMap, Params } from '@angular/router';
import type { FleetFilters } from '../../../shared/api/fleet';
import { AGE_BANDS, type AgeBand } from '../../../shared/api/fleet-constants';
import { APPLIANCE_STYLES, HEALTH_STATES, type ApplianceStyle, type Health } from '../../../shared/domain';

const UUID = /^[0-9a-f]{8}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{12}$/i;

function listParam<T extends string>(params: ParamMap, name: string, allowed: (value: string) => value is T): T[] | undefined {
  const values = (params.get(name) ?? '')
    .split(',')
    .map((value) => value.trim())
    .filter(allowed);
  return values.length ? [...new Set(values)] : undefined;
}

const isHealth = (value: string): value is Health => (HEALTH_STATES as readonly string[]).includes(value);
const isStyle = (value: string): value is ApplianceStyle => (APPLIANCE_STYLES as readonly string[]).includes(value);
const isUuid = (value: string): value is string => UUID.test(value);

/** Unknown words in a hand-edited link are dropped rather than sent to the server. */
export function filtersFromParams(params: ParamMap): FleetFilters {
  const age = params.get('age');
  const q = params.get('q')?.trim();
  return {
    property: listParam(params, 'property', isUuid),
    health: listParam(params, 'health', isHealth),
    style: listParam(params, 'style', isStyle),
    age: age && (AGE_BANDS as readonly string[]).includes(age) ? (age as AgeBand) : undefined,
    q: q ? q.slice(0, 100) : undefined,
  };
}

export function paramsFromFilters(filters: FleetFilters): Params {
  return {
    property: filters.property?.length ? filters.property.join(',') : null,
    health: filters.health?.length ? filters.health.join(',') : null,
    style: filters.style?.length ? filters.style.join(',') : null,
    age: filters.age ?? null,
    q: filters.q?.trim() || null,
  };
}
