import { ChangeDetectionStrategy, Component, input } from '@angular/core';
import { MatIconModule } from '@angular/material/icon';
import { MatProgressBarModule } from '@angular/material/progress-bar';

/**
 * The line under an inventory view's toolbar: a progress bar while it fetches (the line keeps
 * its height, so the table does not jump) and the fetch's error, announced.
 */
@Component({
  selector: 'cw-list-status',
  imports: [MatIconModule, MatProgressBarModule],
  templateUrl: './list-status.html',
  styleUrl: './list-status.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class ListStatus {
  readonly loading = input.required<boolean>();
  readonly error = input<string | null>(null);
  /** What the progress bar tells a screen reader, e.g. "Loading properties". */
  readonly loadingLabel = input.required<string>();
}
