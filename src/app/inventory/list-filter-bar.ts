import { ChangeDetectionStrategy, Component, input } from '@angular/core';
import { FormGroup, ReactiveFormsModule } from '@angular/forms';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatInputModule } from '@angular/material/input';
import { MatSelectModule } from '@angular/material/select';

/**
 * The filter form of an inventory list: the search first, the list's own filters (projected)
 * next, then which records to show. The form is a ListFilters' (q and status controls).
 */
@Component({
  selector: 'cw-list-filter-bar',
  imports: [MatFormFieldModule, MatIconModule, MatInputModule, MatSelectModule, ReactiveFormsModule],
  templateUrl: './list-filter-bar.html',
  styleUrl: './list-filter-bar.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class ListFilterBar {
  readonly form = input.required<FormGroup>();
  readonly searchLabel = input.required<string>();
  /** The records in the plural, e.g. "properties": "Active properties", "All properties". */
  readonly noun = input.required<string>();
  /** What the archived ones are called ("Retired sensors"). */
  readonly archivedWord = input('Archived');
}
