import { TestbedHarnessEnvironment } from '@angular/cdk/testing/testbed';
import type { HttpTestingController, TestRequest } from '@angular/common/http/testing';
import { TestBed } from '@angular/core/testing';
import { MatButtonHarness } from '@angular/material/button/testing';
import { MatDialogHarness } from '@angular/material/dialog/testing';
import { MatInputHarness } from '@angular/material/input/testing';
import { MatMenuHarness } from '@angular/material/menu/testing';
import { MatSelectHarness } from '@angular/material/select/testing';
import { MatTableHarness } from '@angular/material/table/testing';
import type { ContractorView } from '../../../shared/api/work-orders';
import { contractor } from './contractor-fixtures';
import { ContractorList } from './contractor-list';
import { configureSpec, settle } from './testing';

const sam = { userId: 'u-sam', displayName: 'Sam Fixer', email: 'sam@frostbell.example.com' };
const lee = { userId: 'u-lee', displayName: 'Lee Coil', email: 'lee@frostbell.example.com' };

describe('ContractorList', () => {
  let backend: HttpTestingController;

  beforeEach(() => (backend = configureSpec()));
  afterEach(() => backend.verify());

  const listCall = (): TestRequest => backend.expectOne((req) => req.method === 'GET' && req.url === '/api/contractors');

  async function render(first: ContractorView[] | { status: number }) {
    const fixture = TestBed.createComponent(ContractorList);
    fixture.detectChanges();
    const call = listCall();
    if ('status' in first) call.flush({ error: 'the database is not answering' }, { status: first.status, statusText: 'Server Error' });
    else call.flush(first);
    await settle(fixture);
    return { fixture, element: fixture.nativeElement as HTMLElement, loader: TestbedHarnessEnvironment.loader(fixture), root: TestbedHarnessEnvironment.documentRootLoader(fixture) };
  }

  async function closeDialogs(fixture: Parameters<typeof settle>[0], root: ReturnType<typeof TestbedHarnessEnvironment.documentRootLoader>) {
    for (let i = 0; i < 50 && (await root.getAllHarnesses(MatDialogHarness)).length; i++) await settle(fixture);
  }

  it('lists contractors with their contact and people, active ones first shown', async () => {
    const { fixture, loader } = await render([contractor(1, { members: [sam, lee] }), contractor(2, { phone: '', archivedAt: '2026-02-01T00:00:00.000Z' })]);
    const table = await loader.getHarness(MatTableHarness.with({ selector: '[aria-label="Contractors"]' }));
    let cells = await table.getCellTextByColumnName();
    expect(cells['name'].text).toEqual(['Frostbell Repairs 1']);
    expect(cells['contact'].text).toEqual(['jobs1@frostbell.example.com555-0101']);
    expect(cells['members'].text).toEqual(['Sam Fixer, Lee Coil']);
    await (await loader.getHarness(MatSelectHarness)).clickOptions({ text: 'All contractors' });
    await settle(fixture);
    cells = await table.getCellTextByColumnName();
    expect(cells['name'].text).toEqual(['Frostbell Repairs 1', 'Frostbell Repairs 2archived']);
    expect(cells['members'].text[1]).toBe('nobody yet');
  });

  it('adds a contractor through the dialog and reloads', async () => {
    const { fixture, root } = await render([contractor(1)]);
    await (await root.getHarness(MatButtonHarness.with({ text: /Add contractor/ }))).click();
    await settle(fixture);
    const input = (name: string) => root.getHarness(MatInputHarness.with({ selector: `[formControlName="${name}"]` }));
    await (await input('name')).setValue('Icicle Works');
    await (await input('email')).setValue('not an address');
    const add = await root.getHarness(MatButtonHarness.with({ text: 'Add contractor', selector: '[type="submit"]' }));
    await add.click();
    backend.expectNone('/api/contractors');
    await (await input('email')).setValue('office@icicle.example.com');
    await (await input('phone')).setValue(' 555-0177 ');
    await add.click();
    const call = backend.expectOne((req) => req.method === 'POST' && req.url === '/api/contractors');
    expect(call.request.body).toEqual({ name: 'Icicle Works', email: 'office@icicle.example.com', phone: '555-0177' });
    call.flush(contractor(3, { name: 'Icicle Works' }));
    await closeDialogs(fixture, root);
    listCall().flush([contractor(1), contractor(3, { name: 'Icicle Works' })]);
    await settle(fixture);
  });

  it("shows the server's refusal in the dialog (a name already taken)", async () => {
    const { fixture, root } = await render([contractor(1)]);
    await (await root.getHarness(MatMenuHarness.with({ selector: '[aria-label="Actions for Frostbell Repairs 1"]' }))).clickItem({ text: /Edit/ });
    await settle(fixture);
    await (await root.getHarness(MatInputHarness.with({ selector: '[formControlName="name"]' }))).setValue('Taken Name');
    await (await root.getHarness(MatButtonHarness.with({ text: 'Save' }))).click();
    const call = backend.expectOne('/api/contractors/c1');
    expect(call.request.method).toBe('PATCH');
    expect(call.request.body).toEqual({ name: 'Taken Name' });
    call.flush({ error: 'a contractor of that name exists' }, { status: 409, statusText: 'Conflict' });
    await settle(fixture);
    const dialog = await root.getHarness(MatDialogHarness);
    expect(await dialog.getText()).toContain('A contractor of that name exists');
  });

  it('archives from the row menu, says what that means and reloads', async () => {
    const { fixture, loader } = await render([contractor(1)]);
    await (await loader.getHarness(MatMenuHarness.with({ selector: '[aria-label="Actions for Frostbell Repairs 1"]' }))).clickItem({ text: /Archive/ });
    const call = backend.expectOne('/api/contractors/c1');
    expect(call.request.body).toEqual({ archived: true });
    call.flush(contractor(1, { archivedAt: '2026-03-01T00:00:00.000Z' }));
    await settle(fixture);
    listCall().flush([contractor(1, { archivedAt: '2026-03-01T00:00:00.000Z' })]);
    await settle(fixture);
    expect(document.body.textContent).toContain('Frostbell Repairs 1 is archived: no new work order goes to it.');
  });

  it('adds and removes the people of a company', async () => {
    const { fixture, root } = await render([contractor(1, { members: [sam] })]);
    await (await root.getHarness(MatMenuHarness.with({ selector: '[aria-label="Actions for Frostbell Repairs 1"]' }))).clickItem({ text: /People/ });
    backend.expectOne('/api/contractors/people').flush([sam, lee]);
    await settle(fixture);
    const picker = await root.getHarness(MatSelectHarness.with({ selector: '.add mat-select' }));
    await picker.open();
    const options = await picker.getOptions();
    expect(await Promise.all(options.map((option) => option.getText()))).toEqual(['Lee Coil · lee@frostbell.example.com']);
    await options[0].click();
    await (await root.getHarness(MatButtonHarness.with({ text: /^person_addAdd$|^Add$/ }))).click();
    const add = backend.expectOne('/api/contractors/c1/members');
    expect(add.request.body).toEqual({ userId: 'u-lee' });
    add.flush(contractor(1, { members: [lee, sam] }));
    await settle(fixture);

    await (await root.getHarness(MatButtonHarness.with({ selector: '[aria-label="Remove Sam Fixer"]' }))).click();
    const remove = backend.expectOne('/api/contractors/c1/members/u-sam');
    expect(remove.request.method).toBe('DELETE');
    remove.flush({ error: 'contractor not found' }, { status: 404, statusText: 'Not Found' });
    await settle(fixture);
    expect(await (await root.getHarness(MatDialogHarness)).getText()).toContain('Contractor not found');
    await (await root.getHarness(MatButtonHarness.with({ text: 'Done' }))).click();
    await closeDialogs(fixture, root);
    listCall().flush([contractor(1, { members: [lee, sam] })]);
    await settle(fixture);
  });

  it('says how to begin when there is no contractor, and shows a load failure', async () => {
    const { element } = await render([]);
    expect(element.textContent).toContain('No contractors yet');
    TestBed.resetTestingModule();
    backend = configureSpec();
    const failed = await render({ status: 500 });
    expect(failed.element.querySelector('[role="alert"]')?.textContent).toContain('The database is not answering');
  });
});
