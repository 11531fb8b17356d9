import { ChangeDetectionStrategy, Component, computed, inject } from '@angular/core';
import { INCIDENT_SORTS, type IncidentListItem } from '../../../shared/api/monitor';
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
import { CAUSE_CHOICES, KIND_CHOICES, SEVERITY_CHOICES } from '../shared/data-table/table-words';
import { incidentColumns } from './incident-columns';

export const INCIDENT_COLUMNS_KEY = 'cw.columns.incidents';

/** Every incident of the organization: filter, sort, page, export; a row opens its appliance. */
@Component({
  selector: 'cw-incidents-page',
  imports: [ColumnChooser, DataTable, ExportButton, FilterBar],
  templateUrl: './incidents-page.html',
  styleUrl: '../shared/data-table/table-page.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class IncidentsPage {
  private readonly session = inject(Session);
  private readonly timeZone = this.session.user()?.timeZone ?? browserTimeZone();
  private readonly properties = propertyChoices();

  protected readonly table = new ServerTable<IncidentListItem>({
    path: '/api/incidents',
    sortKeys: INCIDENT_SORTS,
    defaultSort: 'openedAt',
    defaultDir: 'desc',
    filters: { status: 'open', propertyId: '', severity: '', kind: '', cause: '', from: '', to: '', q: '' },
    liveTypes: ['incident.opened', 'incident.updated', 'incident.closed'],
    apiFilters: ({ from, to, ...rest }) => ({ ...rest, ...openedRange(from, to, this.timeZone) }),
  });
  protected readonly columns = computed(() => incidentColumns(this.session.user()?.temperatureUnit ?? 'F'));
  protected readonly choice = new ColumnChoice(INCIDENT_COLUMNS_KEY, this.columns());
  protected readonly exportParams = () => this.table.exportParams();
  protected readonly fields = computed<FilterField[]>(() => [
    { key: 'q', label: 'Search property, unit, model or serial', kind: 'search' },
    {
      key: 'status',
      label: 'Status',
      kind: 'select',
      options: [
        { value: 'open', label: 'Open' },
        { value: 'closed', label: 'Closed' },
        { value: 'all', label: 'Open and closed' },
      ],
    },
    { key: 'propertyId', label: 'Property', kind: 'select', options: this.properties() },
    { key: 'severity', label: 'Severity', kind: 'select', options: SEVERITY_CHOICES },
    { key: 'kind', label: 'Kind', kind: 'select', options: KIND_CHOICES },
    { key: 'cause', label: 'Probable cause', kind: 'select', options: CAUSE_CHOICES },
    { key: 'from', label: 'Opened from', kind: 'date-from' },
    { key: 'to', label: 'Opened to', kind: 'date-to' },
  ]);

  /** An incident opens its appliance (a property's power loss: its first appliance). */
  protected readonly link = (incident: IncidentListItem) => {
    const applianceId = incident.applianceId ?? incident.applianceIds[0];
    return applianceId ? ['/appliances', applianceId] : null;
  };
}
