import { Injectable, inject } from '@angular/core';
import { MatDialog } from '@angular/material/dialog';
import { type Observable, firstValueFrom } from 'rxjs';
import type { ServiceRequestView } from '../../../shared/api/service-requests';
import type { ContractorView, Priority } from '../../../shared/api/work-orders';
import { ActionDialog, type ActionDialogData, type ActionDialogResult } from './action-dialog';
import { RequestApi } from './request-api';

/** The covering contractor: the server picks the property's primary for the appliance style. */
export const COVERING = '';

/** Each manager action on a request: its confirmation dialog, then the call it leads to (or null when called off). */
@Injectable()
export class RequestActions {
  private readonly dialog = inject(MatDialog);
  private readonly api = inject(RequestApi);

  async dispatch(request: ServiceRequestView, contractors: readonly ContractorView[]): Promise<Observable<ServiceRequestView> | null> {
    const answer = await this.ask({
      title: 'Dispatch a technician',
      message: `Send "${request.title}" to a contractor. They get the diagnosis, the access windows and the cautions by e-mail.`,
      confirmLabel: 'Dispatch',
      choice: {
        label: 'Contractor',
        value: COVERING,
        options: [{ value: COVERING, label: 'The contractor covering this property' }, ...contractors.filter((c) => !c.archivedAt).map((c) => ({ value: c.id, label: c.name }))],
        hint: 'Pick one by hand when nobody covers the property or the covering one cannot come.',
      },
    });
    return answer ? this.api.dispatch(request.id, answer.choice || undefined) : null;
  }

  async cancel(request: ServiceRequestView): Promise<Observable<ServiceRequestView> | null> {
    const answer = await this.ask({
      title: 'Cancel the request',
      message: 'Its active work order is cancelled too, and the contractor is told. The tenant sees the request as cancelled.',
      confirmLabel: 'Cancel the request',
      reason: { label: 'Reason (the contractor and the log see it)' },
    });
    return answer ? this.api.cancel(request.id, answer.reason) : null;
  }

  async merge(request: ServiceRequestView, others: readonly ServiceRequestView[]): Promise<Observable<ServiceRequestView> | null> {
    const answer = await this.ask({
      title: 'Merge into another request',
      message: 'Its tenant reports and symptoms move to the chosen request, its work order is cancelled, and it closes as merged.',
      confirmLabel: 'Merge',
      choice: { label: 'Into the request', value: others[0]?.id ?? '', options: others.map((r) => ({ value: r.id, label: `${r.title} · ${r.place.unitLabel ?? 'whole property'}` })) },
    });
    return answer ? this.api.merge(request.id, answer.choice) : null;
  }

  async reprioritise(request: ServiceRequestView): Promise<Observable<ServiceRequestView> | null> {
    const next: Priority = request.priority === 'urgent' ? 'routine' : 'urgent';
    const answer = await this.ask({
      title: `Make it ${next}`,
      message: `The request becomes ${next}; an active work order gets the ${next} due time, counted from its dispatch.`,
      confirmLabel: `Make it ${next}`,
    });
    return answer ? this.api.reprioritise(request.id, next) : null;
  }

  private ask(data: ActionDialogData): Promise<ActionDialogResult | undefined> {
    return firstValueFrom(this.dialog.open<ActionDialog, ActionDialogData, ActionDialogResult>(ActionDialog, { data, width: '480px', maxWidth: '95vw', autoFocus: 'first-tabbable' }).afterClosed());
  }
}
