import type { AccessRule } from '../../server/auth/access';
import { routeTableOf, type RouteRecord, type ScopeKind } from '../../server/auth/route-table';
import { WorkOrderScope } from '../../server/work-orders/work-order-scope';
import type { Browser } from './support/browser';
import { mountedRoutes } from './support/express-routes';
import { createWorld, type Fixtures, type Person, type SeededUser, type World, SPEC_TIMEOUT_MS } from './support/world';
import { inventoryMatrixCases, seedInventoryMatrix } from '../inventory/support/access-cases';
import { seedWorkOrderMatrix, workOrderMatrixCases } from './support/work-order-cases';

/**
 * The access matrix, generated from the route table: for every declared route and every
 * role, the status the route's rule implies — 401 signed out, 403 wrong role, 404 outside
 * scope, else the route's normal answer. A route the table lacks, or a route without a
 * case below, fails this spec.
 */
type Caller = 'anonymous' | Exclude<Person, 'bystander'>;

const CALLERS: readonly Caller[] = ['anonymous', 'tenantA', 'tenantB', 'contractorWithJob', 'contractorWithoutJob', 'managerOrg1', 'adminOrg1', 'adminOrg2'];

/** What the request is about, for scope: its organization and, for unit scope, its unit. */
interface Target {
  organizationId: string;
  unitId?: string;
  /** A record of the job dispatched to contractorWithJob's company (scope by assignment). */
  assigned?: boolean;
  /** An assigned record the unit's tenant sees too (their request); a job's photos they do not. */
  tenantSees?: boolean;
}

interface MatrixCase {
  params?: Record<string, string>;
  /** A function gives each caller its own body (a create that refuses a second of the same name). */
  body?: unknown | ((caller: Caller) => unknown);
  target?: Target;
  /** The answer for a caller the rule and scope let through. */
  ok: number;
  /** An event stream that never ends: sent with Accept: text/event-stream, only the status is read. */
  stream?: boolean;
}

const BOGUS_TOKEN = 'A'.repeat(43);
/** One caller against every route is many requests; on a busy machine that outlasts jasmine's 5 s default. */
const MATRIX_ROW_TIMEOUT_MS = 120_000;
const NEW_PASSWORD = 'a brand new passphrase';

/**
 * The request each route gets. Every route in the table needs one: add yours here, with
 * `params` for its path, a `body` that passes validation, the `target` (organization and,
 * for unit scope, unit) the request is about, and the status an allowed caller gets.
 */
function casesFor(f: Fixtures, messageId: string): Record<string, MatrixCase> {
  const bystander = { params: { userId: f.users.bystander.id }, target: { organizationId: f.org1.id, unitId: f.org1.unitA } };
  const message = { params: { messageId }, ok: 200 };
  return {
    'GET /api/health': { ok: 200 },
    'GET /api/health/ready': { ok: 200 },
    'GET /api/health/details': { ok: 200 },
    'GET /api/auth/session': { ok: 200 },
    'POST /api/auth/sign-in': { body: { email: 'nobody@example.com', password: 'not a password' }, ok: 401 },
    'POST /api/auth/sign-out': { ok: 204 },
    'POST /api/auth/forgot-password': { body: { email: 'nobody@example.com' }, ok: 202 },
    'POST /api/auth/reset-password': { body: { token: BOGUS_TOKEN, password: NEW_PASSWORD }, ok: 400 },
    'GET /api/profile': { ok: 200 },
    'PATCH /api/profile': { body: { temperatureUnit: 'C' }, ok: 200 },
    'POST /api/profile/password': { body: { currentPassword: 'not my password', newPassword: NEW_PASSWORD }, ok: 400 },
    'POST /api/profile/email': { body: { email: 'elsewhere@example.com', currentPassword: 'not my password' }, ok: 400 },
    'GET /api/users': { ok: 200 },
    'GET /api/users/:userId': { ...bystander, ok: 200 },
    'PATCH /api/users/:userId': { ...bystander, body: { role: 'tenant', unitId: f.org1.unitA }, ok: 200 },
    'POST /api/users/:userId/deactivate': { ...bystander, ok: 200 },
    'POST /api/users/:userId/reactivate': { ...bystander, ok: 200 },
    'GET /api/invitations': { ok: 200 },
    'GET /api/invitations/unit-options': { ok: 200 },
    'POST /api/invitations': { body: { email: 'invitee@example.com', displayName: 'New Tenant', role: 'tenant', unitId: f.org1.unitA }, target: { organizationId: f.org1.id }, ok: 201 },
    'DELETE /api/invitations/:invitationId': { params: { invitationId: f.invitation.id }, target: { organizationId: f.org1.id }, ok: 204 },
    'POST /api/invitations/preview': { body: { token: BOGUS_TOKEN }, ok: 400 },
    'POST /api/invitations/accept': { body: { token: BOGUS_TOKEN, password: NEW_PASSWORD }, ok: 400 },
    'GET /api/audit-log': { ok: 200 },
    'GET /api/dev/inbox': { ok: 200 },
    'GET /api/dev/inbox/:messageId': message,
    'GET /api/dev/inbox/:messageId/raw': message,
    'GET /dev/inbox': { ok: 200 },
    'GET /dev/inbox/:messageId': message,
    'GET /dev/inbox/:messageId/html': message,
    'GET /api/fleet': { ok: 200 },
    'GET /api/reports': { ok: 200 },
    'GET /api/reports/:table.csv': { params: { table: 'spend-by-property' }, ok: 200 },
    'GET /api/appliances/:id': { params: { id: f.org1.applianceA }, target: { organizationId: f.org1.id, unitId: f.org1.unitA }, ok: 200 },
    'GET /api/appliances/:id/history': { params: { id: f.org1.applianceA }, target: { organizationId: f.org1.id, unitId: f.org1.unitA, assigned: true }, ok: 200 },
    // Without Accept: text/event-stream the live feed answers 406 instead of streaming.
    'GET /api/events': { ok: 406 },
  };
}

/** Routes that are not part of the API and need no rule, with the reason. */
const OUTSIDE_THE_TABLE = new Map([['GET /{*splat}', 'the web client: index.html for every client route']]);

const keyOf = (route: { method: string; path: string }) => `${route.method.toUpperCase()} ${route.path}`;

/** Written out independently of server/auth/access.ts so a mistake there shows here. */
function roleVerdict(rule: AccessRule, user: SeededUser | null): number | null {
  if (rule === 'public') return null;
  if (!user) return 401;
  if (rule === 'signed-in') return null;
  const roles = 'roles' in rule ? rule.roles : rule;
  if (!roles.includes(user.role)) return 403;
  if ('admin' in rule && !user.isAdmin) return 403;
  return null;
}

function inScope(scope: ScopeKind, user: SeededUser | null, target: Target | undefined): boolean {
  if (!target || scope === 'none' || scope === 'self') return true;
  if (!user) return false;
  const managesTarget = user.role === 'manager' && user.organizationId === target.organizationId;
  // Only contractorWithJob's company has jobs; the other contractor reaches nothing.
  const onTheJob = !!target.assigned && user.email === 'contractorwithjob@example.com';
  const tenantOfUnit = user.role === 'tenant' && !!target.unitId && user.unitId === target.unitId;
  if (scope === 'organization') return managesTarget;
  // A unit's records: its manager, its tenant, and the contractor while a job there runs.
  if (scope === 'unit') return managesTarget || tenantOfUnit || onTheJob;
  // Assigned records (a job, its photos): the manager and the contractor on the job; the unit's
  // tenant only where the record is theirs to see (their request).
  return managesTarget || onTheJob || (tenantOfUnit && !!target.tenantSees);
}

export function expectedStatus(record: RouteRecord, user: SeededUser | null, matrixCase: MatrixCase): number {
  return roleVerdict(record.access, user) ?? (inScope(record.scope, user, matrixCase.target) ? matrixCase.ok : 404);
}

function fillPath(path: string, params: Record<string, string> = {}): string {
  return path.replace(/:(\w+)/g, (_match, name: string) => {
    if (!(name in params)) throw new Error(`no value for :${name} in the matrix case of ${path}`);
    return encodeURIComponent(params[name]);
  });
}

describe('access matrix (generated from the route table)', () => {
  let world: World;
  let records: RouteRecord[];
  let cases: Record<string, MatrixCase>;

  beforeAll(async () => {
    world = await createWorld({ workOrders: true });
    records = routeTableOf(world.app).records;
    // A message in the fake inbox, for the dev-inbox routes.
    await (await world.signedIn('adminOrg1')).post('/api/invitations', { email: 'matrix.mail@example.com', displayName: 'Matrix Mail', role: 'contractor' });
    const [messageId] = world.smtp.inbox.ids(1);
    cases = {
      ...casesFor(world.fixtures, messageId),
      ...inventoryMatrixCases(await seedInventoryMatrix(world)),
      ...workOrderMatrixCases(await seedWorkOrderMatrix(world)),
    };
  }, SPEC_TIMEOUT_MS);
  afterAll(async () => world.close(), SPEC_TIMEOUT_MS);

  it('declares every route Express answers in the route table', () => {
    const declared = new Set(records.map(keyOf));
    const undeclared = mountedRoutes(world.app).map(keyOf).filter((key) => !declared.has(key) && !OUTSIDE_THE_TABLE.has(key));
    expect(undeclared).withContext('routes mounted without a rule: mount them through RouteGroup').toEqual([]);
  });

  it('has a matrix case for every route in the table, and none for routes that are gone', () => {
    const declared = records.map(keyOf);
    expect(declared.filter((key) => !(key in cases))).withContext('add a case to casesFor()').toEqual([]);
    expect(Object.keys(cases).filter((key) => !declared.includes(key))).withContext('stale cases').toEqual([]);
    expect(new Set(declared).size).withContext('a route declared twice').toBe(declared.length);
  });

  it('states a summary for every route', () => {
    expect(records.filter((record) => record.summary.trim().length < 5).map(keyOf)).toEqual([]);
  });

  for (const caller of CALLERS) {
    it(`answers ${caller} on every route as its rule and scope say`, async () => {
      const user = caller === 'anonymous' ? null : world.fixtures.users[caller];
      const mismatches: string[] = [];
      let browser: Browser | null = null;
      for (const record of records) {
        const matrixCase = cases[keyOf(record)];
        if (!matrixCase) continue; // reported by the completeness spec
        // A fresh session after anything that may end one (sign-out).
        if (!browser) browser = user ? await world.signedIn(caller as Person) : world.browser();
        if (!user) await browser.get('/api/auth/session');
        const caseBody = typeof matrixCase.body === 'function' ? matrixCase.body(caller) : matrixCase.body;
        const body = record.method === 'get' ? undefined : (caseBody ?? {});
        const res = await browser.send(record.method, fillPath(record.path, matrixCase.params), body, { stream: matrixCase.stream });
        const expected = expectedStatus(record, user, matrixCase);
        if (res.status !== expected) mismatches.push(`${keyOf(record)}: expected ${expected}, got ${res.status} ${JSON.stringify(res.body).slice(0, 160)}`);
        if (record.path === '/api/auth/sign-out') browser = null;
      }
      expect(mismatches).toEqual([]);
    }, MATRIX_ROW_TIMEOUT_MS);
  }

  it('lets a contractor reach the unit and appliance of a job dispatched to them, and nothing else', async () => {
    const rules = new WorkOrderScope(world.db.dataSource);
    const { org1, org2 } = world.fixtures;
    const actorOf = async (caller: 'contractorWithJob' | 'contractorWithoutJob') => (await world.signedIn(caller).then((b) => b.get('/api/auth/session'))).body.user;
    const withJob = await actorOf('contractorWithJob');
    expect(await rules.canReadUnit(withJob, org1.unitA)).toBeTrue();
    expect(await rules.canReadAppliance(withJob, org1.applianceA)).toBeTrue();
    for (const unitId of [org1.unitB, org2.unitC]) expect(await rules.canReadUnit(withJob, unitId)).withContext('contractorWithJob, unit off the job').toBeFalse();
    expect(await rules.canReadAppliance(withJob, org2.applianceC)).toBeFalse();
    const withoutJob = await actorOf('contractorWithoutJob');
    for (const unitId of [org1.unitA, org1.unitB, org2.unitC]) expect(await rules.canReadUnit(withoutJob, unitId)).withContext('contractorWithoutJob unit').toBeFalse();
    for (const applianceId of [org1.applianceA, org2.applianceC]) expect(await rules.canReadAppliance(withoutJob, applianceId)).withContext('contractorWithoutJob appliance').toBeFalse();
  }, SPEC_TIMEOUT_MS);

});
