import sharp from 'sharp';
import type { Browser } from './browser';
import type { World } from './world';

/**
 * The work-order loop's rows of the access matrix (spec/auth/access-matrix.spec.ts).
 * contractorWithJob's company gets jobs on appliances of unit A, one job per state-changing
 * route, so each route is called once in the state it expects and its answer does not hang
 * on the order jasmine runs the callers in. Manager routes that change a record act on
 * records in a settled state (a cancelled request, a job with no cost yet): the rules and
 * scope are checked before the state, so every allowed caller gets the same conflict.
 */
export interface WorkOrderMatrixCase {
  params?: Record<string, string>;
  /** A function gives each caller its own body (a create that refuses a second of the same name). */
  body?: unknown | ((caller: string) => unknown);
  target?: { organizationId: string; unitId?: string; assigned?: boolean; tenantSees?: boolean };
  ok: number;
}

export interface WorkOrderMatrixSeed {
  organizationId: string;
  unitA: string;
  propertyId: string;
  contractorId: string;
  idleContractorId: string;
  /** A company with nobody in it: the coverage case names it, so a declined job passed to the backup reaches no matrix person. */
  spareContractorId: string;
  idleMemberId: string;
  /** The job on appliance A, left on site: records, reads and attachments go here. */
  onSite: { workOrderId: string; requestId: string; attachmentId: string };
  dispatched: string;
  toDecline: string;
  accepted: string;
  scheduled: string;
  toComplete: string;
  cancelledRequestId: string;
  incidentId: string;
}

async function one(world: World, sql: string, params: unknown[]): Promise<string> {
  const [row] = await world.db.dataSource.query(sql, params);
  return row.id;
}

function ok(res: { status: number; body: unknown }, what: string, expected = 200) {
  if (res.status !== expected) throw new Error(`matrix seed: ${what} answered ${res.status} ${JSON.stringify(res.body).slice(0, 200)}`);
  return res.body as Record<string, any>;
}

const VISIT = { startAt: '2026-03-03T15:00:00.000Z', endAt: '2026-03-03T17:00:00.000Z' };

/** A request on a fresh appliance of unit A, dispatched to the contractor's company. */
async function dispatchedJob(world: World, manager: Browser, contractorId: string, title: string): Promise<{ workOrderId: string; requestId: string }> {
  const { org1 } = world.fixtures;
  const applianceId = await one(world, `INSERT INTO appliance (unit_id, style) VALUES ($1, 'top-freezer') RETURNING id`, [org1.unitA]);
  return dispatchOn(manager, applianceId, contractorId, title);
}

async function dispatchOn(manager: Browser, applianceId: string, contractorId: string, title: string): Promise<{ workOrderId: string; requestId: string }> {
  const request = ok(await manager.post('/api/service-requests', { applianceId, title }), `open ${title}`, 201);
  const dispatched = ok(await manager.post(`/api/service-requests/${request.id}/dispatch`, { contractorId }), `dispatch ${title}`);
  return { workOrderId: dispatched.workOrder.id, requestId: request.id };
}

async function contractorCompany(world: World, name: string, memberId: string): Promise<string> {
  const id = await one(world, `INSERT INTO contractor (organization_id, name, email, phone) VALUES ($1, $2, $3, '555-0142') RETURNING id`, [
    world.fixtures.org1.id,
    name,
    `${name.toLowerCase().replace(/\W+/g, '.')}@example.com`,
  ]);
  await world.db.dataSource.query(`INSERT INTO contractor_member (contractor_id, user_id) VALUES ($1, $2)`, [id, memberId]);
  return id;
}

async function walk(tech: Browser, workOrderId: string, steps: ('accept' | 'schedule' | 'arrive')[]): Promise<void> {
  const bodies = { accept: {}, schedule: VISIT, arrive: { notes: '' } };
  for (const step of steps) ok(await tech.post(`/api/work-orders/${workOrderId}/${step}`, bodies[step]), `${step} ${workOrderId}`);
}

async function photo(tech: Browser, workOrderId: string): Promise<string> {
  const png = await sharp({ create: { width: 8, height: 8, channels: 3, background: '#336699' } }).png().toBuffer();
  const res = await tech.agent.post(`/api/work-orders/${workOrderId}/attachments`).set('X-XSRF-TOKEN', tech.csrfToken).field('kind', 'before').attach('file', png, 'plate.png');
  return ok(res, 'upload a photo', 201).id;
}

function insertIncident(world: World): Promise<string> {
  const { org1 } = world.fixtures;
  return one(
    world,
    `INSERT INTO incident (organization_id, property_id, unit_id, appliance_id, level, engine_incident_id, lane, kind, kinds, started_at, opened_at, severity, probable_causes, updated_at)
     VALUES ($1, $2, $3, $4, 'appliance', 'matrix-incident', 'repair', 'warming-trend', ARRAY['warming-trend'], now(), now(), 'watch', '[]', now()) RETURNING id`,
    [org1.id, org1.propertyId, org1.unitA, org1.applianceA],
  );
}

export async function seedWorkOrderMatrix(world: World): Promise<WorkOrderMatrixSeed> {
  const { org1, users } = world.fixtures;
  const manager = await world.signedIn('adminOrg1');
  const contractorId = await contractorCompany(world, 'Matrix Cold Repair', users.contractorWithJob.id);
  const idleContractorId = await contractorCompany(world, 'Idle Fridge Works', users.contractorWithoutJob.id);
  const spareContractorId = await one(world, `INSERT INTO contractor (organization_id, name, email, phone) VALUES ($1, 'Spare Cold Co', 'spare@example.com', '555-0144') RETURNING id`, [org1.id]);
  const tech = await world.signedIn('contractorWithJob');

  const onSite = await dispatchOn(manager, org1.applianceA, contractorId, 'Matrix: on site');
  await walk(tech, onSite.workOrderId, ['accept', 'schedule', 'arrive']);
  const attachmentId = await photo(tech, onSite.workOrderId);
  const job = (title: string) => dispatchedJob(world, manager, contractorId, title);
  const dispatched = (await job('Matrix: to accept')).workOrderId;
  const toDecline = (await job('Matrix: to decline')).workOrderId;
  const accepted = (await job('Matrix: to schedule')).workOrderId;
  await walk(tech, accepted, ['accept']);
  const scheduled = (await job('Matrix: to arrive')).workOrderId;
  await walk(tech, scheduled, ['accept', 'schedule']);
  const toComplete = (await job('Matrix: to complete')).workOrderId;
  await walk(tech, toComplete, ['accept', 'schedule', 'arrive']);

  const cancelled = await job('Matrix: cancelled');
  ok(await manager.post(`/api/service-requests/${cancelled.requestId}/cancel`, { reason: 'opened by mistake' }), 'cancel');
  return {
    organizationId: org1.id,
    unitA: org1.unitA,
    propertyId: org1.propertyId,
    contractorId,
    idleContractorId,
    spareContractorId,
    idleMemberId: users.contractorWithoutJob.id,
    onSite: { ...onSite, attachmentId },
    dispatched,
    toDecline,
    accepted,
    scheduled,
    toComplete,
    cancelledRequestId: cancelled.requestId,
    incidentId: await insertIncident(world),
  };
}

/** Conflict: the record is in a state the action does not apply to. */
const SETTLED = 409;

export function workOrderMatrixCases(seed: WorkOrderMatrixSeed): Record<string, WorkOrderMatrixCase> {
  const org = seed.organizationId;
  const job = (workOrderId: string, body?: unknown) => ({ params: { workOrderId }, body, target: { organizationId: org, assigned: true } });
  const onSite = job(seed.onSite.workOrderId);
  const cancelled = { params: { requestId: seed.cancelledRequestId }, target: { organizationId: org } };
  const unitA = { organizationId: org, unitId: seed.unitA };
  return {
    'GET /api/service-requests': { ok: 200 },
    'GET /api/service-requests/export': { ok: 200 },
    'GET /api/service-requests/:requestId': { params: { requestId: seed.onSite.requestId }, target: { ...unitA, assigned: true, tenantSees: true }, ok: 200 },
    // Appliance A already has an open request: a second one is refused, whoever asks.
    'POST /api/service-requests': { body: { applianceId: '00000000-0000-4000-8000-000000000000', title: 'Matrix: no such appliance' }, ok: 404 },
    'POST /api/service-requests/:requestId/dispatch': { ...cancelled, body: {}, ok: SETTLED },
    'POST /api/service-requests/:requestId/cancel': { ...cancelled, body: { reason: 'again' }, ok: SETTLED },
    'POST /api/service-requests/:requestId/merge': { ...cancelled, body: { intoRequestId: seed.onSite.requestId }, ok: SETTLED },
    'PATCH /api/service-requests/:requestId': { ...cancelled, body: { priority: 'urgent' }, ok: SETTLED },
    'GET /api/work-orders': { ok: 200 },
    'GET /api/work-orders/export': { ok: 200 },
    'GET /api/work-orders/:workOrderId': { ...onSite, ok: 200 },
    'POST /api/work-orders/:workOrderId/accept': { ...job(seed.dispatched, {}), ok: 200 },
    'POST /api/work-orders/:workOrderId/decline': { ...job(seed.toDecline, { reason: 'no technician free this week' }), ok: 200 },
    'POST /api/work-orders/:workOrderId/schedule': { ...job(seed.accepted, VISIT), ok: 200 },
    'POST /api/work-orders/:workOrderId/arrive': { ...job(seed.scheduled, { notes: 'tenant let me in' }), ok: 200 },
    'POST /api/work-orders/:workOrderId/complete': { ...job(seed.toComplete, { causeFound: 'evaporator-fan', findings: 'fan motor seized; replaced' }), ok: 200 },
    'PATCH /api/work-orders/:workOrderId': { ...job(seed.onSite.workOrderId, { notes: 'matrix note' }), ok: 200 },
    'POST /api/work-orders/:workOrderId/parts': { ...job(seed.onSite.workOrderId, { name: 'Evaporator fan motor', quantity: 1, unitCostCents: 4_800 }), ok: 201 },
    'POST /api/work-orders/:workOrderId/labour': { ...job(seed.onSite.workOrderId, { minutes: 45, hourlyRateCents: 9_500 }), ok: 201 },
    // Sent as JSON, not multipart: no file, after the rules and the scope let the caller in.
    'POST /api/work-orders/:workOrderId/attachments': { ...onSite, body: {}, ok: 400 },
    // The job on site has no cost to decide and is not completed: a conflict for every manager.
    'POST /api/work-orders/:workOrderId/cost/approve': { ...job(seed.onSite.workOrderId, {}), ok: SETTLED },
    'POST /api/work-orders/:workOrderId/cost/dispute': { ...job(seed.onSite.workOrderId, { note: 'too dear' }), ok: SETTLED },
    'POST /api/work-orders/:workOrderId/verify': { ...job(seed.onSite.workOrderId, {}), ok: SETTLED },
    'GET /api/contractors': { ok: 200 },
    'POST /api/contractors': { body: (caller: string) => ({ name: `Matrix Company of ${caller}`, email: 'new.company@example.com' }), ok: 201 },
    'GET /api/contractors/people': { ok: 200 },
    'GET /api/contractors/:contractorId': { params: { contractorId: seed.contractorId }, target: { organizationId: org }, ok: 200 },
    'PATCH /api/contractors/:contractorId': { params: { contractorId: seed.contractorId }, body: { phone: '555-0143' }, target: { organizationId: org }, ok: 200 },
    'POST /api/contractors/:contractorId/members': { params: { contractorId: seed.idleContractorId }, body: { userId: seed.idleMemberId }, target: { organizationId: org }, ok: 200 },
    'DELETE /api/contractors/:contractorId/members/:userId': { params: { contractorId: seed.contractorId, userId: seed.idleMemberId }, target: { organizationId: org }, ok: 200 },
    'GET /api/coverage': { ok: 200 },
    'PUT /api/coverage': { body: { propertyId: seed.propertyId, applianceStyle: null, rank: 'backup', contractorId: seed.spareContractorId }, target: { organizationId: org }, ok: 200 },
    'GET /api/org-settings': { ok: 200 },
    'PATCH /api/org-settings': { body: { dispatchHoldMinutes: 0 }, ok: 200 },
    'GET /api/tenant/home': { ok: 200 },
    // JSON instead of the multipart form: the report field is missing.
    'POST /api/tenant/reports': { body: {}, ok: 400 },
    'GET /api/incidents': { ok: 200 },
    'GET /api/incidents/export': { ok: 200 },
    'GET /api/incidents/:incidentId': { params: { incidentId: seed.incidentId }, target: unitA, ok: 200 },
    'GET /api/attachments/:attachmentId': { params: { attachmentId: seed.onSite.attachmentId }, target: { ...unitA, assigned: true }, ok: 200 },
    'GET /api/attachments/:attachmentId/thumbnail': { params: { attachmentId: seed.onSite.attachmentId }, target: { ...unitA, assigned: true }, ok: 200 },
    'GET /api/notification-preferences': { ok: 200 },
    'PUT /api/notification-preferences': { body: { muteNonUrgent: false }, ok: 200 },
  };
}
