import type { DataSource } from 'typeorm';
import type { Priority } from '../../shared/api/work-orders';
import type { FindingKind, Severity } from '../../shared/domain';
import { DEFAULT_ORG_SETTINGS } from '../../server/work-orders/org-settings';
import { priorityOf, titleOf } from '../../server/work-orders/request-opening';
import type { SeedContext, SeedStep } from '../context';
import { DEMO_ACCOUNTS } from '../demo-accounts';
import { HOURLY_RATE_CENTS, PARTS } from '../scenario/catalogue';
import { PAST_TROUBLE, type PastRepair, type PastTrouble } from '../scenario/past-repairs';
import type { ScenarioPlan } from '../scenario/plan';

/**
 * The paper trail of the past repairs: for each incident the monitor found in the history,
 * the service request it opened, the work order dispatched to the property's primary
 * company, accepted, visited, completed with parts and labour, verified from telemetry
 * and its cost approved by the manager. Times follow the fault's own timeline.
 */
const MINUTE_MS = 60_000;
const HOUR_MS = 3_600_000;
const DAY_MS = 86_400_000;

interface IncidentRow {
  id: string;
  organization_id: string;
  property_id: string;
  unit_id: string;
  appliance_id: string;
  kind: FindingKind;
  kinds: FindingKind[];
  severity: Severity;
  top_cause: Parameters<typeof titleOf>[0]['top_cause'];
  minutes_above_4c: number;
  opened_at: Date;
}

interface People {
  managerId: string;
  technicianId: string;
}

interface Job {
  trouble: PastTrouble;
  repair: PastRepair;
  incident: IncidentRow;
  contractorIndex: 0 | 1;
  contractorId: string;
  repairedMs: number;
}

async function firstIncident(dataSource: DataSource, applianceId: string, fromMs: number, toMs: number): Promise<IncidentRow | null> {
  const [row] = await dataSource.query(
    `SELECT * FROM incident WHERE appliance_id = $1 AND lane = 'repair' AND opened_at >= $2 AND opened_at < $3 ORDER BY opened_at LIMIT 1`,
    [applianceId, new Date(fromMs), new Date(toMs)],
  );
  return (row as IncidentRow) ?? null;
}

const at = (ms: number) => new Date(ms);

async function insertRequest(dataSource: DataSource, job: Job, closedMs: number): Promise<string> {
  const { incident } = job;
  const [row] = await dataSource.query(
    `INSERT INTO service_request (organization_id, property_id, unit_id, appliance_id, level, source, status, priority, title, incident_id, opened_at, closed_at, close_reason, first_visit_fix, updated_at)
     VALUES ($1, $2, $3, $4, 'appliance', 'monitor', 'closed', $5, $6, $7, $8, $9, 'repair verified from telemetry', true, $9) RETURNING id`,
    [incident.organization_id, incident.property_id, incident.unit_id, incident.appliance_id, priorityOf(incident), titleOf(incident), incident.id, incident.opened_at, at(closedMs)],
  );
  return row.id;
}

interface Timeline {
  dispatchedMs: number;
  acceptedMs: number;
  arrivedMs: number;
  completedMs: number;
  recoveredMs: number;
  verifiedMs: number;
}

function timelineOf(job: Job): Timeline {
  const dispatchedMs = job.incident.opened_at.getTime();
  const acceptedMs = dispatchedMs + job.repair.acceptAfterMin * MINUTE_MS;
  const completedMs = Math.max(job.repairedMs, acceptedMs + HOUR_MS);
  const arrivedMs = completedMs - job.repair.labourMinutes * MINUTE_MS;
  // The cabinet is back in its band about an hour after the repair; verified after the hold.
  const recoveredMs = completedMs + HOUR_MS;
  return { dispatchedMs, acceptedMs, arrivedMs, completedMs, recoveredMs, verifiedMs: recoveredMs + DEFAULT_ORG_SETTINGS.verificationHoldMinutes * MINUTE_MS };
}

async function insertWorkOrder(dataSource: DataSource, job: Job, requestId: string, t: Timeline, people: People): Promise<string> {
  const priority = priorityOf(job.incident) as Priority;
  const dueMs = t.dispatchedMs + DEFAULT_ORG_SETTINGS.responseMinutes[priority] * MINUTE_MS;
  const [row] = await dataSource.query(
    `INSERT INTO work_order (organization_id, service_request_id, contractor_id, state, priority, dispatch_method, dispatched_at, due_at, accepted_at,
       scheduled_start_at, scheduled_end_at, completed_at, verified_at, verification_due_at, recovered_since, cause_found, findings, notes,
       currency, cost_status, cost_decided_at, cost_decided_by_user_id, created_at, updated_at)
     VALUES ($1, $2, $3, 'verified', $4, 'coverage-primary', $5, $6, $7, $8, $9, $10, $11, $12, $13, $14, $15, $16, 'USD', 'approved', $17, $18, $5, $17) RETURNING id`,
    [
      job.incident.organization_id,
      requestId,
      job.contractorId,
      priority,
      at(t.dispatchedMs),
      at(dueMs),
      at(t.acceptedMs),
      at(t.arrivedMs),
      at(t.completedMs + 30 * MINUTE_MS),
      at(t.completedMs),
      at(t.verifiedMs),
      at(t.completedMs + DEFAULT_ORG_SETTINGS.verificationWindowMinutes * MINUTE_MS),
      at(t.recoveredMs),
      job.repair.causeFound,
      job.repair.findings,
      'Tenant was home; access through the front door.',
      at(t.verifiedMs + DAY_MS),
      people.managerId,
    ],
  );
  return row.id;
}

async function insertEvents(dataSource: DataSource, workOrderId: string, job: Job, t: Timeline, people: People): Promise<void> {
  const technician = job.contractorIndex === 0 ? people.technicianId : null;
  const steps: [number, string | null, string, string | null, string, Record<string, unknown>][] = [
    [t.dispatchedMs, null, 'dispatched', null, 'dispatched', { contractorId: job.contractorId, method: 'coverage-primary' }],
    [t.acceptedMs, technician, 'accepted', 'dispatched', 'accepted', {}],
    [t.acceptedMs + 5 * MINUTE_MS, technician, 'scheduled', 'accepted', 'scheduled', { start: at(t.arrivedMs).toISOString() }],
    [t.arrivedMs, technician, 'on-site', 'scheduled', 'on-site', {}],
    [t.completedMs, technician, 'completed', 'on-site', 'completed', { causeFound: job.repair.causeFound }],
    [t.verifiedMs, null, 'verified', 'completed', 'verified', { by: 'telemetry', recoveredSince: at(t.recoveredMs).toISOString() }],
  ];
  for (const [ms, actorId, type, from, to, detail] of steps) {
    await dataSource.query(
      `INSERT INTO work_order_event (work_order_id, at, actor_user_id, actor_kind, type, from_state, to_state, detail) VALUES ($1, $2, $3, $4, $5, $6, $7, $8::jsonb)`,
      [workOrderId, at(ms), actorId, actorId ? 'user' : 'system', type, from, to, JSON.stringify(detail)],
    );
  }
}

async function insertWorkDone(dataSource: DataSource, workOrderId: string, job: Job, t: Timeline, people: People): Promise<void> {
  const technician = job.contractorIndex === 0 ? people.technicianId : null;
  await dataSource.query(`INSERT INTO work_order_visit (work_order_id, arrived_at, left_at, notes, technician_user_id, created_at) VALUES ($1, $2, $3, $4, $5, $3)`, [
    workOrderId,
    at(t.arrivedMs),
    at(t.completedMs),
    'Power disconnected and outlet voltage metered before work; no sealed-system work needed.',
    technician,
  ]);
  for (const used of job.repair.parts) {
    const part = PARTS[used.part];
    await dataSource.query(`INSERT INTO work_order_part (work_order_id, name, quantity, unit_cost_cents, currency, recorded_by_user_id, created_at) VALUES ($1, $2, $3, $4, 'USD', $5, $6)`, [
      workOrderId,
      part.name,
      used.quantity,
      part.unitCostCents,
      technician,
      at(t.completedMs),
    ]);
  }
  await dataSource.query(`INSERT INTO work_order_labour (work_order_id, minutes, hourly_rate_cents, currency, technician_user_id, created_at) VALUES ($1, $2, $3, 'USD', $4, $5)`, [
    workOrderId,
    job.repair.labourMinutes,
    HOURLY_RATE_CENTS[job.contractorIndex],
    technician,
    at(t.completedMs),
  ]);
}

async function recordJob(dataSource: DataSource, job: Job, people: People): Promise<void> {
  const timeline = timelineOf(job);
  const requestId = await insertRequest(dataSource, job, timeline.verifiedMs);
  const workOrderId = await insertWorkOrder(dataSource, job, requestId, timeline, people);
  await insertEvents(dataSource, workOrderId, job, timeline, people);
  await insertWorkDone(dataSource, workOrderId, job, timeline, people);
}

function peopleOf(context: SeedContext): People {
  const userIds = context.facts.demoUserIds as Record<string, string>;
  const email = (role: string, isAdmin: boolean) => DEMO_ACCOUNTS.find((account) => account.role === role && account.isAdmin === isAdmin)?.email as string;
  return { managerId: userIds[email('manager', false)], technicianId: userIds[email('contractor', false)] };
}

export const serviceHistoryStep: SeedStep = {
  name: 'service history: requests and verified work orders with parts, labour and costs for the past incidents',
  async run(context: SeedContext): Promise<void> {
    const plan = context.facts.plan as ScenarioPlan;
    const applianceIds = context.facts.applianceIds as Record<string, string>;
    const contractorIds = context.facts.contractorIds as string[];
    const people = peopleOf(context);
    let recorded = 0;
    for (const trouble of PAST_TROUBLE) {
      if (!trouble.repair) continue;
      const startMs = plan.nowMs - trouble.startDaysAgo * DAY_MS;
      const repairedMs = startMs + trouble.lastsH * HOUR_MS;
      const incident = await firstIncident(context.dataSource, applianceIds[trouble.applianceKey], startMs, repairedMs);
      if (!incident) {
        context.log(`no incident found for the ${trouble.fault} fault of ${trouble.applianceKey}: no work order for it`);
        continue;
      }
      const property = plan.properties.find((candidate) => candidate.key === trouble.applianceKey.split('/')[0]);
      const contractorIndex = property?.primaryContractor ?? 0;
      await recordJob(context.dataSource, { trouble, repair: trouble.repair, incident, contractorIndex, contractorId: contractorIds[contractorIndex], repairedMs }, people);
      recorded++;
    }
    context.log(`${recorded} past repairs: requests closed, work orders verified, costs approved`);
  },
};
