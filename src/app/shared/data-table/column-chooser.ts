import { ChangeDetectionStrategy, Component, input } from '@angular/core';
import { MatButtonModule } from '@angular/material/button';
import { MatCheckboxModule } from '@angular/material/checkbox';
import { MatIconModule } from '@angular/material/icon';
import { MatMenuModule } from '@angular/material/menu';
import type { ColumnChoice } from './column-choice';

/** A menu of checkboxes choosing the table's columns; the choice is remembered (ColumnChoice). */
@Component({
  selector: 'cw-column-chooser',
  imports: [MatButtonModule, MatCheckboxModule, MatIconModule, MatMenuModule],
  template: `
    <button mat-stroked-button type="button" [matMenuTriggerFor]="menu" aria-label="Choose columns">
      <mat-icon aria-hidden="true">view_column</mat-icon>
      Columns
    </button>
    <mat-menu #menu="matMenu" class="cw-column-menu">
      @for (column of choice().all; track column.id) {
        <button mat-menu-item type="button" role="menuitemcheckbox" [attr.aria-checked]="choice().isShown(column.id)" (click)="$event.stopPropagation(); choice().toggle(column.id)">
          <mat-checkbox [checked]="choice().isShown(column.id)" (click)="$event.preventDefault()" tabindex="-1" aria-hidden="true" />
          {{ column.label }}
        </button>
      }
    </mat-menu>
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class ColumnChooser {
  readonly choice = input.required<ColumnChoice>();
}
