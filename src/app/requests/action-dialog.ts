import { ChangeDetectionStrategy, Component, computed, inject, signal } from '@angular/core';
import { FormsModule } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MAT_DIALOG_DATA, MatDialogModule } from '@angular/material/dialog';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatInputModule } from '@angular/material/input';
import { MatSelectModule } from '@angular/material/select';
import type { FilterOption } from '../shared/data-table/table-types';

/** What a confirmation asks: a sentence, and perhaps a choice and a reason. */
export interface ActionDialogData {
  title: string;
  message: string;
  confirmLabel: string;
  choice?: { label: string; options: readonly FilterOption[]; value: string; hint?: string };
  /** A required reason, e.g. for a cancellation. */
  reason?: { label: string };
}

export interface ActionDialogResult {
  choice: string;
  reason: string;
}

/** Confirms one of the manager's actions on a request; closes with the choice and reason, or nothing. */
@Component({
  selector: 'cw-action-dialog',
  imports: [FormsModule, MatButtonModule, MatDialogModule, MatFormFieldModule, MatInputModule, MatSelectModule],
  template: `
    <h2 mat-dialog-title>{{ data.title }}</h2>
    <mat-dialog-content>
      <p>{{ data.message }}</p>
      @if (data.choice; as choice) {
        <mat-form-field appearance="outline" class="field">
          <mat-label>{{ choice.label }}</mat-label>
          <mat-select [ngModel]="picked()" (ngModelChange)="picked.set($event)">
            @for (option of choice.options; track option.value) {
              <mat-option [value]="option.value">{{ option.label }}</mat-option>
            }
          </mat-select>
          @if (choice.hint) {
            <mat-hint>{{ choice.hint }}</mat-hint>
          }
        </mat-form-field>
      }
      @if (data.reason; as reason) {
        <mat-form-field appearance="outline" class="field">
          <mat-label>{{ reason.label }}</mat-label>
          <textarea matInput required maxlength="1000" rows="3" [ngModel]="reasonText()" (ngModelChange)="reasonText.set($event)"></textarea>
        </mat-form-field>
      }
    </mat-dialog-content>
    <mat-dialog-actions align="end">
      <button mat-button type="button" mat-dialog-close>Keep as is</button>
      <button mat-flat-button type="button" [disabled]="!ready()" [mat-dialog-close]="result()">{{ data.confirmLabel }}</button>
    </mat-dialog-actions>
  `,
  styles: `
    .field {
      width: 100%;
      margin-top: 8px;
    }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class ActionDialog {
  protected readonly data = inject<ActionDialogData>(MAT_DIALOG_DATA);
  protected readonly picked = signal(this.data.choice?.value ?? '');
  protected readonly reasonText = signal('');
  protected readonly ready = computed(() => (!this.data.reason || this.reasonText().trim().length > 0) && (!this.data.choice || this.data.choice.options.some((o) => o.value === this.picked())));
  protected readonly result = computed<ActionDialogResult>(() => ({ choice: this.picked(), reason: this.reasonText().trim() }));
}
