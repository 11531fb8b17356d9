import { ChangeDetectionStrategy, Component, computed, inject } from '@angular/core';
import { MatIconModule } from '@angular/material/icon';
import { LiveEvents } from './live-events';

const LABELS = {
  idle: { text: 'Not live', icon: 'pause_circle' },
  connecting: { text: 'Connecting…', icon: 'sync' },
  open: { text: 'Live', icon: 'sensors' },
  reconnecting: { text: 'Reconnecting…', icon: 'sync_problem' },
} as const;

/** Whether the page is receiving live updates, announced politely to screen readers. */
@Component({
  selector: 'cw-live-status',
  imports: [MatIconModule],
  template: `<span class="live" [class]="'live ' + live.status()" role="status" aria-live="polite" [attr.title]="title()">
    <mat-icon aria-hidden="true">{{ label().icon }}</mat-icon><span>{{ label().text }}</span>
  </span>`,
  styleUrl: './live-status.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class LiveStatus {
  protected readonly live = inject(LiveEvents);
  protected readonly label = computed(() => LABELS[this.live.status()]);
  protected readonly title = computed(() =>
    this.live.status() === 'open' ? 'Changes appear here as they happen' : this.live.status() === 'reconnecting' ? 'The live feed dropped; trying again' : '',
  );
}
