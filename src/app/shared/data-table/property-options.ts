import { inject, type Signal } from '@angular/core';
import { toSignal } from '@angular/core/rxjs-interop';
import { catchError, map, of } from 'rxjs';
import { PropertyApi } from '../../inventory/property-api';
import type { FilterOption } from './table-types';

/** The organization's properties as filter choices ("All properties" first); none if they cannot be read. */
export function propertyChoices(): Signal<FilterOption[]> {
  const all: FilterOption = { value: '', label: 'All properties' };
  return toSignal(
    inject(PropertyApi)
      .list({ pageSize: 200, sort: 'name' })
      .pipe(
        map((page) => [all, ...page.items.map((property) => ({ value: property.id, label: property.name }))]),
        catchError(() => of([all])),
      ),
    { initialValue: [all] },
  );
}
