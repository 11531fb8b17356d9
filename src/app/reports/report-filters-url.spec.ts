import { convertToParamMap } from '@angular/router';
import { dateOfIso, filtersFromParams, isIsoDate, isoDateOf, paramsFromFilters } from './report-filters-url';
import { ALDER_ID } from './reports-fixtures';

describe('report filters in the URL', () => {
  it('reads a range and a property, and writes them back', () => {
    const filters = filtersFromParams(convertToParamMap({ from: '2025-12-01', to: '2026-02-28', property: ALDER_ID }));
    expect(filters).toEqual({ from: '2025-12-01', to: '2026-02-28', propertyId: ALDER_ID });
    expect(paramsFromFilters(filters)).toEqual({ from: '2025-12-01', to: '2026-02-28', property: ALDER_ID });
  });

  it('drops a bad date, a backwards range and a property that is not an id', () => {
    expect(filtersFromParams(convertToParamMap({ from: '2026-02-30', to: '2026-03-01' }))).toEqual({ from: null, to: null, propertyId: null });
    expect(filtersFromParams(convertToParamMap({ from: '2026-03-01', to: '2026-02-01' }))).toEqual({ from: null, to: null, propertyId: null });
    expect(filtersFromParams(convertToParamMap({ from: '2026-01-01', property: 'alder' }))).toEqual({ from: null, to: null, propertyId: null });
  });

  it('turns picker dates into calendar dates and back without a time-zone shift', () => {
    expect(isIsoDate('2024-02-29')).toBeTrue();
    expect(isIsoDate('2025-02-29')).toBeFalse();
    expect(isoDateOf(new Date(2026, 0, 31))).toBe('2026-01-31');
    expect(isoDateOf(dateOfIso('2025-12-01'))).toBe('2025-12-01');
  });
});
