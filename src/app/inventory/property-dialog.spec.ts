import { TestbedHarnessEnvironment } from '@angular/cdk/testing/testbed';
import type { HttpTestingController } from '@angular/common/http/testing';
import { Component, inject } from '@angular/core';
import { TestBed } from '@angular/core/testing';
import { MatButtonHarness } from '@angular/material/button/testing';
import { MatDialog } from '@angular/material/dialog';
import { MatInputHarness } from '@angular/material/input/testing';
import type { PropertyView } from '../../../shared/api/inventory';
import { PropertyDialog } from './property-dialog';
import { configureSpec, property, settle } from './testing';

@Component({ template: '' })
class Opener {
  readonly dialog = inject(MatDialog);
  closedWith: PropertyView | undefined;
  open(data: PropertyView | null): void {
    this.dialog.open(PropertyDialog, { data }).afterClosed().subscribe((saved) => (this.closedWith = saved));
  }
}

describe('PropertyDialog', () => {
  let backend: HttpTestingController;

  beforeEach(() => (backend = configureSpec()));
  afterEach(() => backend.verify());

  async function open(data: PropertyView | null) {
    const fixture = TestBed.createComponent(Opener);
    fixture.componentInstance.open(data);
    await settle(fixture);
    const root = TestbedHarnessEnvironment.documentRootLoader(fixture);
    const input = (name: string) => root.getHarness(MatInputHarness.with({ selector: `[formControlName="${name}"]` }));
    return { fixture, root, input };
  }

  it('adds a property with its address and time zone', async () => {
    const { fixture, root, input } = await open(null);
    await (await input('name')).setValue('Harbor View');
    await (await input('addressLine1')).setValue('8 Example Pier');
    await (await input('city')).setValue('Bayport');
    await (await input('timeZone')).setValue('America/Los_Angeles');
    await (await root.getHarness(MatButtonHarness.with({ text: 'Add property' }))).click();
    const call = backend.expectOne('/api/inventory/properties');
    expect(call.request.method).toBe('POST');
    expect(call.request.body).toEqual(jasmine.objectContaining({ name: 'Harbor View', addressLine1: '8 Example Pier', city: 'Bayport', country: 'US', timeZone: 'America/Los_Angeles', addressLine2: null }));
    call.flush(property(9, { name: 'Harbor View' }));
    // afterClosed emits once the closing animation has run.
    for (let i = 0; i < 50 && !fixture.componentInstance.closedWith; i++) await settle(fixture);
    expect(fixture.componentInstance.closedWith?.name).toBe('Harbor View');
  });

  it('refuses a time zone the browser does not know, before asking the server', async () => {
    const { fixture, root, input } = await open(null);
    await (await input('name')).setValue('Harbor View');
    await (await input('addressLine1')).setValue('8 Example Pier');
    await (await input('city')).setValue('Bayport');
    await (await input('timeZone')).setValue('Mars/Olympus');
    await (await root.getHarness(MatButtonHarness.with({ text: 'Add property' }))).click();
    await settle(fixture);
    backend.expectNone('/api/inventory/properties');
    expect(document.body.textContent).toContain('Choose a time zone from the list.');
  });

  it('sends only what changed when editing, and shows a conflict from the server', async () => {
    const { fixture, root, input } = await open(property(1));
    await (await input('city')).setValue('Shelbyville');
    await (await root.getHarness(MatButtonHarness.with({ text: 'Save' }))).click();
    const call = backend.expectOne('/api/inventory/properties/p1');
    expect(call.request.method).toBe('PATCH');
    expect(call.request.body).toEqual({ city: 'Shelbyville' });
    call.flush({ error: 'a property named "Linden Court 1" already exists' }, { status: 409, statusText: 'Conflict' });
    await settle(fixture);
    expect(document.body.textContent).toContain('A property named "Linden Court 1" already exists');
    expect(fixture.componentInstance.closedWith).toBeUndefined();
  });
});
