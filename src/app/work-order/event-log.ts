import { ChangeDetectionStrategy, Component, computed, input } from '@angular/core';
import { MatCardModule } from '@angular/material/card';
import { MatIconModule } from '@angular/material/icon';
import type { WorkOrderEventView } from '../../../shared/api/work-orders';
import { ZonedDatePipe } from '../fleet/zoned-date';
import { eventDetail, eventLabel } from './work-order-words';

/** Who did what and when on the job, newest first. */
@Component({
  selector: 'cw-event-log',
  imports: [MatCardModule, MatIconModule, ZonedDatePipe],
  templateUrl: './event-log.html',
  styleUrl: './event-log.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class EventLog {
  readonly events = input.required<WorkOrderEventView[]>();
  readonly timeZone = input<string | null>(null);

  protected readonly rows = computed(() =>
    [...this.events()].reverse().map((event) => ({
      at: event.at,
      label: eventLabel(event),
      detail: eventDetail(event, this.timeZone()),
      who: event.actor ? event.actor.displayName : 'Chillwarden',
    })),
  );
}
