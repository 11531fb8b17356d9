import { TestbedHarnessEnvironment } from '@angular/cdk/testing/testbed';
import { ChangeDetectionStrategy, Component } from '@angular/core';
import { TestBed } from '@angular/core/testing';
import { ReactiveFormsModule } from '@angular/forms';
import { MatFormFieldHarness } from '@angular/material/form-field/testing';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatInputHarness } from '@angular/material/input/testing';
import { MatSelectHarness } from '@angular/material/select/testing';
import { MatSelectModule } from '@angular/material/select';
import type { ArchiveFilter } from '../../../shared/api/inventory';
import { ListFilterBar } from './list-filter-bar';
import { ListFilters } from './list-filters';

@Component({
  imports: [ListFilterBar, MatFormFieldModule, MatSelectModule, ReactiveFormsModule],
  template: `
    <cw-list-filter-bar [form]="filters.form" searchLabel="Search device id" noun="sensors" archivedWord="Retired">
      <mat-form-field>
        <mat-label>Colour</mat-label>
        <mat-select [formControl]="filters.form.controls.colour">
          <mat-option value="">Any colour</mat-option>
          <mat-option value="blue">Blue</mat-option>
        </mat-select>
      </mat-form-field>
    </cw-list-filter-bar>
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
class Host {
  readonly filters = new ListFilters({ q: '', colour: '', status: 'active' as ArchiveFilter });
}

describe('ListFilterBar', () => {
  async function render() {
    const fixture = TestBed.createComponent(Host);
    fixture.detectChanges();
    await fixture.whenStable();
    return { filters: fixture.componentInstance.filters, loader: TestbedHarnessEnvironment.loader(fixture) };
  }

  it('labels the search and the status select, with the projected filter between them', async () => {
    const { loader } = await render();
    const labels = await Promise.all((await loader.getAllHarnesses(MatFormFieldHarness)).map((field) => field.getLabel()));
    expect(labels).toEqual(['Search device id', 'Colour', 'Show']);
  });

  it('writes the search into the form', async () => {
    const { filters, loader } = await render();
    await (await loader.getHarness(MatInputHarness.with({ selector: '[formControlName="q"]' }))).setValue('cw-00');
    expect(filters.form.controls.q.value).toBe('cw-00');
  });

  it('offers active, archived (by the list\'s word) and all records, and writes the choice into the form', async () => {
    const { filters, loader } = await render();
    const status = await loader.getHarness(MatSelectHarness.with({ selector: '[formControlName="status"]' }));
    expect(await status.getValueText()).toBe('Active sensors');
    await status.open();
    expect(await Promise.all((await status.getOptions()).map((option) => option.getText()))).toEqual(['Active sensors', 'Retired sensors', 'All sensors']);
    await status.clickOptions({ text: 'Retired sensors' });
    expect(filters.form.controls.status.value).toBe('archived');
    expect(filters.atDefaults()).toBeFalse();
  });
});
