import { provideHttpClient, withInterceptors } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting, type TestRequest } from '@angular/common/http/testing';
import { TestBed } from '@angular/core/testing';
import { TestbedHarnessEnvironment } from '@angular/cdk/testing/testbed';
import { MatButtonHarness } from '@angular/material/button/testing';
import { MatMenuHarness } from '@angular/material/menu/testing';
import { MatPaginatorHarness } from '@angular/material/paginator/testing';
import { MatSortHarness } from '@angular/material/sort/testing';
import { MatTableHarness } from '@angular/material/table/testing';
import { provideRouter } from '@angular/router';
import type { InvitationSummary, Page, UserSummary } from '../../../shared/api/users';
import { settle } from '../../testing/form-fields';
import { Session } from '../core/auth/session';
import { apiErrorInterceptor } from '../core/http/api-error.interceptor';
import { UsersPage } from './users-page';

function user(n: number, extra: Partial<UserSummary> = {}): UserSummary {
  return { id: `u${n}`, email: `person${n}@example.com`, displayName: `Person ${n}`, role: 'tenant', isAdmin: false, phone: '', unit: { id: 'unit1', label: '1A', propertyName: 'Cedar Row' }, deactivatedAt: null, createdAt: '2026-01-01T00:00:00.000Z', ...extra };
}

function page(items: UserSummary[], total = items.length, pageIndex = 0): Page<UserSummary> {
  return { items, total, page: pageIndex, pageSize: 25 };
}

const invitation: InvitationSummary = {
  id: 'i1',
  email: 'waiting@example.com',
  displayName: 'Waiting Person',
  role: 'contractor',
  isAdmin: false,
  unit: null,
  invitedBy: 'Pat Admin',
  status: 'pending',
  createdAt: '2026-03-01T00:00:00.000Z',
  expiresAt: '2026-03-08T00:00:00.000Z',
};

describe('UsersPage', () => {
  let backend: HttpTestingController;

  beforeEach(() => {
    TestBed.configureTestingModule({ providers: [provideRouter([]), provideHttpClient(withInterceptors([apiErrorInterceptor])), provideHttpClientTesting()] });
    backend = TestBed.inject(HttpTestingController);
    TestBed.inject(Session).set({ id: 'admin', email: 'pat@example.com', displayName: 'Pat Admin', role: 'manager', isAdmin: true, organizationId: 'o1', unitId: null, temperatureUnit: 'F', timeZone: null });
  });

  afterEach(() => backend.verify());

  const listCall = (): TestRequest => backend.expectOne((req) => req.url === '/api/users');

  async function render(first: Page<UserSummary>) {
    const fixture = TestBed.createComponent(UsersPage);
    fixture.detectChanges();
    const call = listCall();
    expect(call.request.params.get('page')).toBe('0');
    expect(call.request.params.get('status')).toBe('active');
    call.flush(first);
    backend.expectOne('/api/invitations').flush([invitation, { ...invitation, id: 'i2', email: 'done@example.com', status: 'accepted' }]);
    await settle(fixture);
    return { fixture, loader: TestbedHarnessEnvironment.loader(fixture), documentLoader: TestbedHarnessEnvironment.documentRootLoader(fixture) };
  }

  it('lists people and the invitations still waiting', async () => {
    const { loader } = await render(page([user(1), user(2, { role: 'manager', isAdmin: true, unit: null }), user(3, { id: 'admin', displayName: 'Pat Admin' })]));
    const [people, invitations] = await loader.getAllHarnesses(MatTableHarness);
    const rows = await people.getCellTextByColumnName();
    expect(rows['displayName'].text).toEqual(['Person 1', 'Person 2', 'Pat Admin (you)']);
    expect(rows['role'].text).toEqual(['Tenant', 'Manager · admin', 'Tenant']);
    expect(rows['unit'].text).toEqual(['Cedar Row · 1A', '—', 'Cedar Row · 1A']);
    const waiting = await invitations.getCellTextByColumnName();
    expect(waiting['email'].text).toEqual(['Waiting Person · waiting@example.com']);
  });

  it('asks the server for the next page and for a new sort order', async () => {
    const { fixture, loader } = await render(page([user(1)], 60));
    await (await loader.getHarness(MatPaginatorHarness)).goToNextPage();
    const next = listCall();
    expect(next.request.params.get('page')).toBe('1');
    next.flush(page([user(26)], 60, 1));
    await settle(fixture);

    const sort = await loader.getHarness(MatSortHarness);
    const [emailHeader] = await sort.getSortHeaders({ label: 'E-mail' });
    await emailHeader.click();
    const sorted = listCall();
    expect(sorted.request.params.get('sort')).toBe('email');
    expect(sorted.request.params.get('page')).toBe('0');
    sorted.flush(page([user(1)], 60));
    await settle(fixture);
  });

  it('deactivates someone from the row menu, then refreshes the list', async () => {
    const { fixture, loader } = await render(page([user(1)]));
    await (await loader.getHarness(MatMenuHarness.with({ triggerText: 'more_vert' }))).clickItem({ text: /Deactivate/ });
    const call = backend.expectOne('/api/users/u1/deactivate');
    expect(call.request.method).toBe('POST');
    call.flush(user(1, { deactivatedAt: '2026-03-02T00:00:00.000Z' }));
    await settle(fixture);
    listCall().flush(page([]));
    await settle(fixture);
  });

  it('offers no actions on your own row', async () => {
    const { loader } = await render(page([user(3, { id: 'admin', displayName: 'Pat Admin' })]));
    expect(await loader.getAllHarnesses(MatMenuHarness)).toEqual([]);
  });

  it('withdraws a waiting invitation', async () => {
    const { fixture, loader } = await render(page([user(1)]));
    await (await loader.getHarness(MatButtonHarness.with({ text: 'Withdraw' }))).click();
    backend.expectOne((req) => req.method === 'DELETE' && req.url === '/api/invitations/i1').flush(null, { status: 204, statusText: 'No Content' });
    await settle(fixture);
    backend.expectOne('/api/invitations').flush([]);
    await settle(fixture);
  });
});
