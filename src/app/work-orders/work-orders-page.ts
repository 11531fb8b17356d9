import { ChangeDetectionStrategy, Component, computed, inject } from '@angular/core';
import { WORK_ORDER_SORTS, WORK_ORDER_STATES, type WorkOrderSummary } from '../../../shared/api/work-orders';
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
import { PRIORITY_CHOICES, WORK_ORDER_STATE_LABELS, choices } from '../shared/data-table/table-words';
import { WORK_ORDER_TABLE_COLUMNS } from './work-order-columns';

export const WORK_ORDER_COLUMNS_KEY = 'cw.columns.work-orders';

/** The organization's work orders, soonest due first: filter, sort, page, export; a row opens the job. */
@Component({
  selector: 'cw-work-orders-page',
  imports: [ColumnChooser, DataTable, ExportButton, FilterBar],
  templateUrl: './work-orders-page.html',
  styleUrl: '../shared/data-table/table-page.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class WorkOrdersPage {
  private readonly timeZone = inject(Session).user()?.timeZone ?? browserTimeZone();
  private readonly properties = propertyChoices();

  protected readonly table = new ServerTable<WorkOrderSummary>({
    path: '/api/work-orders',
    sortKeys: WORK_ORDER_SORTS,
    defaultSort: 'dueAt',
    defaultDir: 'asc',
    filters: { status: 'open', state: '', propertyId: '', priority: '', from: '', to: '', q: '' },
    liveTypes: ['work-order.changed'],
    apiFilters: ({ from, to, ...rest }) => ({ ...rest, ...openedRange(from, to, this.timeZone) }),
  });
  protected readonly columns = WORK_ORDER_TABLE_COLUMNS;
  protected readonly choice = new ColumnChoice(WORK_ORDER_COLUMNS_KEY, WORK_ORDER_TABLE_COLUMNS, ['dueAt', 'title', 'property', 'unit', 'contractor', 'priority', 'state', 'overdue']);
  protected readonly exportParams = () => this.table.exportParams();
  protected readonly fields = computed<FilterField[]>(() => [
    { key: 'q', label: 'Search title, unit or contractor', kind: 'search' },
    {
      key: 'status',
      label: 'Status',
      kind: 'select',
      options: [
        { value: 'open', label: 'Open' },
        { value: 'overdue', label: 'Overdue' },
        { value: 'completed', label: 'Completed or verified' },
        { value: 'all', label: 'Any status' },
      ],
    },
    { key: 'state', label: 'State', kind: 'select', options: choices('Any state', WORK_ORDER_STATE_LABELS, WORK_ORDER_STATES) },
    { key: 'propertyId', label: 'Property', kind: 'select', options: this.properties() },
    { key: 'priority', label: 'Priority', kind: 'select', options: PRIORITY_CHOICES },
    { key: 'from', label: 'Dispatched from', kind: 'date-from' },
    { key: 'to', label: 'Dispatched to', kind: 'date-to' },
  ]);

  protected readonly link = (workOrder: WorkOrderSummary) => ['/work-orders', workOrder.id];
}
