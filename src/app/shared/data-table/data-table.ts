import { ChangeDetectionStrategy, Component, computed, inject, input } from '@angular/core';
import { MatButtonModule } from '@angular/material/button';
import { MatIconModule } from '@angular/material/icon';
import { MatPaginatorModule } from '@angular/material/paginator';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { MatSortModule } from '@angular/material/sort';
import { MatTableModule } from '@angular/material/table';
import { Router, RouterLink } from '@angular/router';
import { EmptyState } from '../empty-state/empty-state';
import type { ServerTable } from './server-table';
import type { TableColumn } from './table-types';

/**
 * The table of a ServerTable: sortable headers, the paginator, the chosen columns, rows
 * that open on a click anywhere (the first cell holds a real link for the keyboard and
 * screen readers), and the loading, error and empty states. On a phone it scrolls
 * sideways with the first column kept in view.
 */
@Component({
  selector: 'cw-data-table',
  imports: [EmptyState, MatButtonModule, MatIconModule, MatPaginatorModule, MatProgressBarModule, MatSortModule, MatTableModule, RouterLink],
  templateUrl: './data-table.html',
  styleUrl: './data-table.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class DataTable<T> {
  private readonly router = inject(Router);

  readonly table = input.required<ServerTable<T>>();
  readonly columns = input.required<readonly TableColumn<T>[]>();
  /** Ids of the columns to show, in the columns' order. */
  readonly visible = input.required<readonly string[]>();
  /** What the table lists, for screen readers: "Incidents". */
  readonly label = input.required<string>();
  readonly emptyIcon = input('inbox');
  readonly emptyHeading = input.required<string>();
  readonly emptyMessage = input('');
  /** Where a row leads, as router commands; null when it leads nowhere. */
  readonly link = input.required<(row: T) => readonly unknown[] | null>();

  protected readonly shown = computed(() => this.columns().filter((column) => this.visible().includes(column.id)));
  protected readonly ids = computed(() => this.shown().map((column) => column.id));

  protected open(row: T, event: Event): void {
    const commands = this.link()(row);
    // A click on the link itself is the link's own navigation.
    if (!commands || (event.target as HTMLElement).closest('a')) return;
    void this.router.navigate([...commands]);
  }
}
