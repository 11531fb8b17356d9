import { ChangeDetectionStrategy, Component, inject, input, model, signal } from '@angular/core';
import { takeUntilDestroyed } from '@angular/core/rxjs-interop';
import { FormControl, ReactiveFormsModule } from '@angular/forms';
import { MatAutocompleteModule, type MatAutocompleteSelectedEvent } from '@angular/material/autocomplete';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatInputModule } from '@angular/material/input';
import { catchError, debounceTime, distinctUntilChanged, map, of, startWith, switchMap, tap } from 'rxjs';
import type { ApplianceView } from '../../../shared/api/inventory';
import { ApplianceInventoryApi } from './appliance-inventory-api';
import { STYLE_LABELS, placeLabel } from './labels';
import { errorMessage } from './messages';

export function applianceLabel(appliance: ApplianceView): string {
  return `${placeLabel(appliance.propertyName, appliance.unitLabel)} — ${STYLE_LABELS[appliance.style]}${appliance.model ? ` ${appliance.model}` : ''}`;
}

/** Finds an active appliance of the organization by property, unit, model, serial or sensor. */
@Component({
  selector: 'cw-appliance-picker',
  imports: [MatAutocompleteModule, MatFormFieldModule, MatIconModule, MatInputModule, ReactiveFormsModule],
  template: `
    <mat-form-field appearance="outline" class="field">
      <mat-label>{{ label() }}</mat-label>
      <input matInput type="search" [formControl]="text" [matAutocomplete]="options" autocomplete="off" />
      <mat-icon matSuffix aria-hidden="true">search</mat-icon>
      <mat-autocomplete #options="matAutocomplete" (optionSelected)="choose($event)" [displayWith]="display">
        @for (appliance of matches(); track appliance.id) {
          <mat-option [value]="appliance" [disabled]="excludeId() === appliance.id">{{ labelOf(appliance) }}</mat-option>
        } @empty {
          <mat-option disabled>{{ status() }}</mat-option>
        }
      </mat-autocomplete>
      <mat-hint>{{ selected() ? 'Chosen: ' + labelOf(selected()!) : 'Type a property, unit, model or serial' }}</mat-hint>
    </mat-form-field>
  `,
  styles: `
    .field {
      width: 100%;
    }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class AppliancePicker {
  private readonly api = inject(ApplianceInventoryApi);

  readonly label = input('Appliance');
  /** An appliance that may not be chosen (the one a sensor already sits in). */
  readonly excludeId = input<string | null>(null);
  readonly selected = model<ApplianceView | null>(null);

  protected readonly text = new FormControl<string | ApplianceView>('', { nonNullable: true });
  protected readonly matches = signal<ApplianceView[]>([]);
  protected readonly status = signal('Searching…');
  protected readonly labelOf = applianceLabel;
  protected readonly display = (value: ApplianceView | string | null) => (value && typeof value === 'object' ? applianceLabel(value) : (value ?? ''));

  constructor() {
    this.text.valueChanges
      .pipe(
        startWith(''),
        map((value) => (typeof value === 'string' ? value.trim() : null)),
        tap((value) => value !== null && this.selected() && this.selected.set(null)),
        debounceTime(250),
        distinctUntilChanged(),
        switchMap((q) => {
          if (q === null) return of(null);
          this.status.set('Searching…');
          return this.api.list({ q: q || undefined, pageSize: 20, sort: 'property' }).pipe(
            map((page) => ({ items: page.items, error: null as string | null })),
            catchError((error: unknown) => of({ items: [] as ApplianceView[], error: errorMessage(error) })),
          );
        }),
        takeUntilDestroyed(),
      )
      .subscribe((result) => {
        if (!result) return;
        this.matches.set(result.items);
        this.status.set(result.error ?? 'No appliance matches');
      });
  }

  protected choose(event: MatAutocompleteSelectedEvent): void {
    this.selected.set(event.option.value as ApplianceView);
  }
}
