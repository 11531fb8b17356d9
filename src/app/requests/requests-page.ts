import { ChangeDetectionStrategy, Component, computed, inject } from '@angular/core';
import { REQUEST_SORTS, type ServiceRequestView } from '../../../shared/api/service-requests';
import { Session } from '../core/auth/session';
import { ColumnChoice } from '../shared/data-table/column-choice';
import { ColumnChooser } from '../shared/data-table/column-chooser';
import { DataTable } from '../shared/data-table/data-table';
import { browserTimeZone, openedRange } from '../shared/data-table/date-range';
import { ExportButton } from '../shared/data-table/export-button';
import { FilterBar } from '../shared/data-table/filter-bar';
import { propertyChoices } from '../shared/data-table/property-options';
import { ServerTable } from '../shared/data-table/server-table';
import type { FilterField } from '../shared/data-table/table-types';
import { CAUSE_CHOICES, PRIORITY_CHOICES, REQUEST_SOURCE_LABELS, choices } from '../shared/data-table/table-words';
import { REQUEST_TABLE_COLUMNS } from './request-columns';

export const REQUEST_COLUMNS_KEY = 'cw.columns.requests';

/** The organization's service requests: filter, sort, page, export; a row opens the request. */
@Component({
  selector: 'cw-requests-page',
  imports: [ColumnChooser, DataTable, ExportButton, FilterBar],
  templateUrl: './requests-page.html',
  styleUrl: '../shared/data-table/table-page.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class RequestsPage {
  private readonly timeZone = inject(Session).user()?.timeZone ?? browserTimeZone();
  private readonly properties = propertyChoices();

  protected readonly table = new ServerTable<ServiceRequestView>({
    path: '/api/service-requests',
    sortKeys: REQUEST_SORTS,
    defaultSort: 'openedAt',
    defaultDir: 'desc',
    filters: { status: 'open', propertyId: '', priority: '', source: '', cause: '', from: '', to: '', q: '' },
    liveTypes: ['service-request.changed', 'work-order.changed'],
    apiFilters: ({ from, to, ...rest }) => ({ ...rest, ...openedRange(from, to, this.timeZone) }),
  });
  protected readonly columns = REQUEST_TABLE_COLUMNS;
  protected readonly choice = new ColumnChoice(REQUEST_COLUMNS_KEY, REQUEST_TABLE_COLUMNS, ['openedAt', 'title', 'property', 'unit', 'priority', 'status', 'progress', 'contractor']);
  protected readonly exportParams = () => this.table.exportParams();
  protected readonly fields = computed<FilterField[]>(() => [
    { key: 'q', label: 'Search title, unit, appliance or contractor', kind: 'search' },
    {
      key: 'status',
      label: 'Status',
      kind: 'select',
      options: [
        { value: 'open', label: 'Open' },
        { value: 'closed', label: 'Closed' },
        { value: 'cancelled', label: 'Cancelled' },
        { value: 'merged', label: 'Merged' },
        { value: 'all', label: 'Any status' },
      ],
    },
    { key: 'propertyId', label: 'Property', kind: 'select', options: this.properties() },
    { key: 'priority', label: 'Priority', kind: 'select', options: PRIORITY_CHOICES },
    { key: 'source', label: 'Opened by', kind: 'select', options: choices('Anyone', REQUEST_SOURCE_LABELS) },
    { key: 'cause', label: 'Probable cause', kind: 'select', options: CAUSE_CHOICES },
    { key: 'from', label: 'Opened from', kind: 'date-from' },
    { key: 'to', label: 'Opened to', kind: 'date-to' },
  ]);

  protected readonly link = (request: ServiceRequestView) => ['/requests', request.id];
}
