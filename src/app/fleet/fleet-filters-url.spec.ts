import { convertToParamMap } from '@angular/router';
import { filtersFromParams, paramsFromFilters } from './fleet-filters-url';

describe('fleet filters in the query string', () => {
  it('round-trips every filter', () => {
    const filters = { property: ['0f8fad5b-d9cb-469f-a165-70867728950e'], health: ['warm' as const, 'no-cooling' as const], style: ['chest-freezer' as const], age: 'past-life' as const, q: '4B' };
    const params = paramsFromFilters(filters);
    expect(params).toEqual({ property: '0f8fad5b-d9cb-469f-a165-70867728950e', health: 'warm,no-cooling', style: 'chest-freezer', age: 'past-life', q: '4B' });
    expect(filtersFromParams(convertToParamMap(params))).toEqual(filters);
  });

  it('drops words a hand-edited link made up, and clears empty filters', () => {
    expect(filtersFromParams(convertToParamMap({ health: 'warm,lukewarm,warm', style: 'wine-cooler', age: 'ancient', property: 'nope', q: '  ' }))).toEqual({
      property: undefined,
      health: ['warm'],
      style: undefined,
      age: undefined,
      q: undefined,
    });
    expect(paramsFromFilters({})).toEqual({ property: null, health: null, style: null, age: null, q: null });
  });
});
