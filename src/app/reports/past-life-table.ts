import { ChangeDetectionStrategy, Component, input } from '@angular/core';
import { MatTableModule } from '@angular/material/table';
import { RouterLink } from '@angular/router';
import type { PastLifeAppliance } from '../../../shared/api/reports';
import { STYLE_LABELS } from '../fleet/appliance-words';

/** Appliances older than their expected service life at the end of the range. */
@Component({
  selector: 'cw-past-life-table',
  imports: [MatTableModule, RouterLink],
  templateUrl: './past-life-table.html',
  styleUrl: './report-table.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class PastLifeTable {
  readonly rows = input.required<readonly PastLifeAppliance[]>();

  /** A method, not an index in the template: mat-table's row context is untyped. */
  protected styleLabel(row: PastLifeAppliance): string {
    return STYLE_LABELS[row.style];
  }
  protected readonly columns = ['appliance', 'property', 'installed', 'age', 'incidents'];
}
