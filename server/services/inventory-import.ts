import { randomUUID } from 'node:crypto';
import type { Logger } from 'pino';
import type { DataSource, EntityManager } from 'typeorm';
import type { ImportCounts, ImportJob, ImportPreview } from '../../shared/api/inventory';
import type { Actor } from '../auth/actor';
import { HttpError, notFound } from '../errors';
import { readInventoryCsv } from './import-csv';
import { planImport, serialKey, unitKey, type ImportPlan, type InventorySnapshot } from './import-plan';
import { lockPropertyNames, organizationOf } from './inventory-support';

/** Rows per INSERT statement; the progress bar moves once per batch. */
export const IMPORT_BATCH_SIZE = 250;
const PREVIEW_SAMPLE_ROWS = 50;
/** Finished imports are answered for an hour, then forgotten. */
const FINISHED_JOB_TTL_MS = 60 * 60_000;

const today = () => new Date().toISOString().slice(0, 10);

async function loadSnapshot(manager: EntityManager, organizationId: string): Promise<InventorySnapshot> {
  const properties: { id: string; name: string }[] = await manager.query(
    `SELECT id, name FROM property WHERE organization_id = $1 AND archived_at IS NULL`,
    [organizationId],
  );
  const units: { id: string; property_id: string; label: string; archived: boolean }[] = await manager.query(
    `SELECT u.id, u.property_id, u.label, u.archived_at IS NOT NULL AS archived
       FROM unit u JOIN property p ON p.id = u.property_id WHERE p.organization_id = $1 AND p.archived_at IS NULL`,
    [organizationId],
  );
  const serials: { unit_id: string; serial: string }[] = await manager.query(
    `SELECT a.unit_id, a.serial FROM appliance a JOIN unit u ON u.id = a.unit_id JOIN property p ON p.id = u.property_id
      WHERE p.organization_id = $1 AND a.archived_at IS NULL AND a.serial <> ''`,
    [organizationId],
  );
  return {
    properties: new Map(properties.map((p) => [p.name.toLowerCase(), p])),
    units: new Map(units.map((u) => [unitKey(u.property_id, u.label), { id: u.id, archived: u.archived }])),
    serials: new Set(serials.map((s) => serialKey(s.unit_id, s.serial))),
  };
}

function creations(plan: ImportPlan): ImportCounts {
  return { properties: plan.properties.length, units: plan.units.length, appliances: plan.appliances.length };
}

/** Thrown inside the write transaction so it rolls back; the job reports it. */
class ImportRejected extends Error {}

interface JobEntry {
  organizationId: string;
  job: ImportJob;
}

/**
 * The inventory CSV import: a preview that writes nothing, then an all-or-nothing write in
 * one transaction, run in the background so the client can show its progress.
 */
export class InventoryImportService {
  private readonly jobs = new Map<string, JobEntry>();

  constructor(
    private readonly dataSource: DataSource,
    private readonly logger: Logger,
  ) {}

  async preview(actor: Actor, fileName: string, text: string): Promise<ImportPreview> {
    const organizationId = organizationOf(actor);
    const read = readInventoryCsv(text);
    if (!read.ok) return { fileName, rows: 0, create: { properties: 0, units: 0, appliances: 0 }, existing: { properties: 0, units: 0, appliances: 0 }, errors: [read.error], sample: [], ok: false };
    const plan = planImport(read.rows, await loadSnapshot(this.dataSource.manager, organizationId), today());
    return {
      fileName,
      rows: read.rows.length,
      create: creations(plan),
      existing: plan.existing,
      errors: plan.errors,
      sample: plan.rows.slice(0, PREVIEW_SAMPLE_ROWS),
      ok: plan.errors.length === 0,
    };
  }

  /** Checks the file again (the inventory may have changed since the preview) and starts writing it. */
  async start(actor: Actor, fileName: string, text: string): Promise<ImportJob> {
    const preview = await this.preview(actor, fileName, text);
    if (!preview.ok) {
      const count = preview.errors.length;
      throw new HttpError(400, `the file has ${count} problem${count > 1 ? 's' : ''}; nothing was imported`, preview.errors);
    }
    const organizationId = organizationOf(actor);
    const total = preview.create.properties + preview.create.units + preview.create.appliances;
    const job: ImportJob = { id: randomUUID(), fileName, state: 'running', processed: 0, total, created: null, error: null, startedAt: new Date().toISOString(), finishedAt: null };
    this.forgetFinished();
    this.jobs.set(job.id, { organizationId, job });
    void this.run(job, organizationId, text);
    return { ...job };
  }

  status(actor: Actor, importId: string): ImportJob {
    const entry = this.jobs.get(importId);
    if (!entry || entry.organizationId !== organizationOf(actor)) throw notFound('import');
    return { ...entry.job };
  }

  /** Resolves when every running import has finished (for an orderly shutdown and for specs). */
  async idle(): Promise<void> {
    while ([...this.jobs.values()].some((entry) => entry.job.state === 'running')) await new Promise((resolve) => setTimeout(resolve, 20));
  }

  private async run(job: ImportJob, organizationId: string, text: string): Promise<void> {
    try {
      const created = await this.dataSource.transaction((manager) => this.write(manager, job, organizationId, text));
      Object.assign(job, { state: 'done', created, finishedAt: new Date().toISOString() });
    } catch (error) {
      const message = error instanceof ImportRejected ? error.message : 'the import failed and nothing was written; try again';
      if (!(error instanceof ImportRejected)) this.logger.error({ err: error, importId: job.id }, 'inventory import failed');
      Object.assign(job, { state: 'failed', processed: 0, error: message, finishedAt: new Date().toISOString() });
    }
  }

  private async write(manager: EntityManager, job: ImportJob, organizationId: string, text: string): Promise<ImportCounts> {
    await lockPropertyNames(manager, organizationId);
    const read = readInventoryCsv(text);
    const plan = read.ok ? planImport(read.rows, await loadSnapshot(manager, organizationId), today()) : null;
    if (!plan || plan.errors.length) throw new ImportRejected('the inventory changed since the file was checked; check it again');
    const progress = (written: number) => {
      job.processed += written;
    };
    const propertyIds = new Map(plan.existingPropertyIds);
    for (const batch of batches(plan.properties)) {
      const ids = await insertProperties(manager, organizationId, batch);
      batch.forEach((property, index) => propertyIds.set(property.key, ids[index]));
      progress(batch.length);
    }
    const unitIds = new Map(plan.existingUnitIds);
    for (const batch of batches(plan.units)) {
      const ids = await insertRows(manager, 'unit', ['property_id', 'label', 'floor'], ['uuid', 'text', 'int'], [batch.map((u) => propertyIds.get(u.propertyKey)), batch.map((u) => u.label), batch.map((u) => u.floor)]);
      batch.forEach((unit, index) => unitIds.set(unit.key, ids[index]));
      progress(batch.length);
    }
    for (const batch of batches(plan.appliances)) {
      await insertRows(manager, 'appliance', ['unit_id', 'style', 'model', 'serial', 'installed_on', 'warranty_ends_on'], ['uuid', 'text', 'text', 'text', 'date', 'date'], [
        batch.map((a) => unitIds.get(a.unitKey)),
        batch.map((a) => a.style),
        batch.map((a) => a.model),
        batch.map((a) => a.serial),
        batch.map((a) => a.installedOn),
        batch.map((a) => a.warrantyEndsOn),
      ]);
      progress(batch.length);
    }
    return creations(plan);
  }

  private forgetFinished(): void {
    const horizon = Date.now() - FINISHED_JOB_TTL_MS;
    for (const [id, { job }] of this.jobs) if (job.finishedAt && Date.parse(job.finishedAt) < horizon) this.jobs.delete(id);
  }
}

function batches<T>(items: T[]): T[][] {
  const result: T[][] = [];
  for (let i = 0; i < items.length; i += IMPORT_BATCH_SIZE) result.push(items.slice(i, i + IMPORT_BATCH_SIZE));
  return result;
}

/** One multi-row INSERT through unnest, with ids made here so no statement order is relied on. */
async function insertRows(manager: EntityManager, table: 'unit' | 'appliance', columns: string[], types: string[], values: unknown[][]): Promise<string[]> {
  const ids = values[0].map(() => randomUUID());
  const unnest = ['uuid', ...types].map((type, index) => `$${index + 1}::${type}[]`).join(', ');
  await manager.query(`INSERT INTO ${table} (id, ${columns.join(', ')}) SELECT * FROM unnest(${unnest})`, [ids, ...values]);
  return ids;
}

async function insertProperties(manager: EntityManager, organizationId: string, batch: ImportPlan['properties']): Promise<string[]> {
  const ids: string[] = [];
  for (const { input } of batch) {
    const [row] = await manager.query(
      `INSERT INTO property (organization_id, name, address_line1, address_line2, city, region, postal_code, country, time_zone)
       VALUES ($1, $2, $3, $4, $5, $6, $7, $8, $9) RETURNING id`,
      [organizationId, input.name, input.addressLine1, input.addressLine2 ?? null, input.city, input.region, input.postalCode, input.country, input.timeZone],
    );
    ids.push(row.id);
  }
  return ids;
}
