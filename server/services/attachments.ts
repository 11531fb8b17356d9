/**
 * Photos and PDFs of work orders and tenant reports: checked by content, stored under
 * random keys in object storage, and streamed back through the server only to people
 * who may see the work order or the request (managers of the organization, the
 * contractor doing the job, the unit's tenants for their own reports).
 */
import type { Response } from 'express';
import type { Logger } from 'pino';
import type { DataSource, EntityManager } from 'typeorm';
import type { AttachmentKind, AttachmentView } from '../../shared/api/work-orders';
import type { Actor } from '../auth/actor';
import type { Clock } from '../auth/clock';
import { badRequest, conflict, notFound } from '../errors';
import type { ObjectStore } from '../storage/object-store';
import { inspect, prepare, type PreparedUpload } from '../storage/uploads';
import { recordChange } from '../work-orders/log';
import { isWorkable } from '../work-orders/states';
import { attachmentViewOf } from '../work-orders/views';
import type { WorkOrderScope } from '../work-orders/work-order-scope';
import type { WorkOrderCore } from '../work-orders/core';
import { AfterCommit } from '../work-orders/after-commit';

export interface UploadedFile {
  buffer: Buffer;
  originalname: string;
  size: number;
}

export interface AttachmentsDeps {
  dataSource: DataSource;
  clock: Clock;
  scope: WorkOrderScope;
  store: ObjectStore;
  core: WorkOrderCore;
  logger: Logger;
}

type Owner = { workOrderId: string } | { tenantReportId: string };

export class AttachmentsService {
  constructor(private readonly deps: AttachmentsDeps) {}

  /** Checks every file and puts it (and its thumbnail) in storage; nothing is stored if one is refused. */
  async stage(files: UploadedFile[], organizationId: string): Promise<PreparedUpload[]> {
    const inspected = [];
    for (const file of files) inspected.push(await inspect(file));
    const prepared = await Promise.all(inspected.map((upload) => prepare(upload, organizationId)));
    const stored: PreparedUpload[] = [];
    try {
      for (const upload of prepared) {
        await this.deps.store.put(upload.objectKey, upload.buffer, upload.contentType);
        if (upload.thumbnail) await this.deps.store.put(upload.thumbnail.key, upload.thumbnail.buffer, 'image/webp');
        stored.push(upload);
      }
    } catch (error) {
      await this.discard(stored);
      throw error;
    }
    return prepared;
  }

  /** Removes staged files whose database rows were never written (best effort). */
  async discard(uploads: PreparedUpload[]): Promise<void> {
    for (const upload of uploads) {
      await this.deps.store.delete(upload.objectKey).catch(() => undefined);
      if (upload.thumbnail) await this.deps.store.delete(upload.thumbnail.key).catch(() => undefined);
    }
  }

  /** Rows for staged files, in the caller's transaction. */
  async insertRows(db: EntityManager, uploads: PreparedUpload[], owner: Owner, organizationId: string, kind: AttachmentKind, uploader: Actor): Promise<string[]> {
    const ids: string[] = [];
    for (const upload of uploads) {
      const [row] = await db.query(
        `INSERT INTO attachment (organization_id, work_order_id, tenant_report_id, kind, object_key, thumbnail_key, content_type, size_bytes, width, height, display_name, uploaded_by_user_id)
         VALUES ($1, $2, $3, $4, $5, $6, $7, $8, $9, $10, $11, $12) RETURNING id`,
        [
          organizationId,
          'workOrderId' in owner ? owner.workOrderId : null,
          'tenantReportId' in owner ? owner.tenantReportId : null,
          kind,
          upload.objectKey,
          upload.thumbnail?.key ?? null,
          upload.contentType,
          upload.sizeBytes,
          upload.width,
          upload.height,
          upload.displayName,
          uploader.id,
        ],
      );
      ids.push(row.id);
    }
    return ids;
  }

  /** A photo or invoice on a work order, by the contractor doing it or a manager. */
  async addToWorkOrder(actor: Actor, workOrderId: string, file: UploadedFile | undefined, kind: AttachmentKind): Promise<AttachmentView> {
    // Scope first: someone outside the job learns nothing, not even that a file is missing.
    const place = await this.deps.scope.requireWorkOrder(actor, workOrderId);
    if (!file) throw badRequest('no file in the field "file"');
    const [wo] = await this.deps.dataSource.query(`SELECT state FROM work_order WHERE id = $1`, [workOrderId]);
    if (!isWorkable(wo.state)) throw conflict(`a work order that is ${wo.state} takes no more photos`);
    const staged = await this.stage([file], place.organizationId);
    const after = new AfterCommit();
    try {
      const [id] = await this.deps.dataSource.transaction(async (db) => {
        const ids = await this.insertRows(db, staged, { workOrderId }, place.organizationId, kind, actor);
        await recordChange(db, { workOrderId, at: this.deps.clock.now(), actor, type: 'attachment-added', detail: { attachmentId: ids[0], kind } });
        this.deps.core.announce({ db, now: this.deps.clock.now(), actor, after }, workOrderId, 'attachment-added');
        return ids;
      });
      await after.run(this.deps.logger);
      const [row] = await this.deps.dataSource.query(`SELECT * FROM attachment WHERE id = $1`, [id]);
      return attachmentViewOf(row);
    } catch (error) {
      await this.discard(staged);
      throw error;
    }
  }

  /** Streams the file (or its thumbnail) to someone allowed to see its work order or request. */
  async stream(actor: Actor, attachmentId: string, variant: 'original' | 'thumbnail', res: Response): Promise<void> {
    const row = await this.requireVisible(actor, attachmentId);
    const key = variant === 'thumbnail' ? row.thumbnail_key : row.object_key;
    if (!key) throw notFound('thumbnail');
    const object = await this.deps.store.get(key);
    if (!object) throw notFound('file');
    res.setHeader('Content-Type', variant === 'thumbnail' ? 'image/webp' : row.content_type);
    if (object.contentLength !== null) res.setHeader('Content-Length', String(object.contentLength));
    res.setHeader('X-Content-Type-Options', 'nosniff');
    res.setHeader('Cache-Control', 'private, max-age=300');
    res.setHeader('Content-Security-Policy', "default-src 'none'; style-src 'unsafe-inline'; sandbox");
    const disposition = row.content_type === 'application/pdf' && variant === 'original' ? 'attachment' : 'inline';
    res.setHeader('Content-Disposition', `${disposition}; filename*=UTF-8''${encodeURIComponent(row.display_name || `file-${row.id}`)}`);
    await new Promise<void>((resolve, reject) => {
      object.body.on('error', reject);
      res.on('finish', resolve);
      res.on('close', resolve);
      object.body.pipe(res);
    });
  }

  private async requireVisible(actor: Actor, attachmentId: string): Promise<Record<string, string>> {
    const [row] = await this.deps.dataSource.query(
      `SELECT a.*, t.service_request_id AS report_request_id FROM attachment a LEFT JOIN tenant_report t ON t.id = a.tenant_report_id WHERE a.id = $1`,
      [attachmentId],
    );
    if (!row) throw notFound('attachment');
    try {
      if (row.work_order_id) await this.deps.scope.requireWorkOrder(actor, row.work_order_id);
      else await this.deps.scope.requireRequest(actor, row.report_request_id);
    } catch {
      throw notFound('attachment');
    }
    return row;
  }
}
