import { Column, CreateDateColumn, Entity, PrimaryGeneratedColumn } from 'typeorm';
import type { AttachmentKind } from '../../shared/api/work-orders';

/**
 * A photo or PDF of a work order or a tenant's report. The file lives in object storage
 * under a random key; the name the uploader gave is kept for display only.
 */
@Entity({ name: 'attachment' })
export class Attachment {
  @PrimaryGeneratedColumn('uuid')
  id: string;

  @Column({ name: 'organization_id', type: 'uuid' })
  organizationId: string;

  @Column({ name: 'work_order_id', type: 'uuid', nullable: true })
  workOrderId: string | null;

  @Column({ name: 'tenant_report_id', type: 'uuid', nullable: true })
  tenantReportId: string | null;

  @Column({ type: 'text' })
  kind: AttachmentKind;

  @Column({ name: 'object_key', type: 'text', unique: true })
  objectKey: string;

  @Column({ name: 'thumbnail_key', type: 'text', nullable: true })
  thumbnailKey: string | null;

  /** As sniffed from the content, never as the client claimed. */
  @Column({ name: 'content_type', type: 'text' })
  contentType: string;

  @Column({ name: 'size_bytes', type: 'integer' })
  sizeBytes: number;

  @Column({ type: 'integer', nullable: true })
  width: number | null;

  @Column({ type: 'integer', nullable: true })
  height: number | null;

  @Column({ name: 'display_name', type: 'text', default: '' })
  displayName: string;

  @Column({ name: 'uploaded_by_user_id', type: 'uuid', nullable: true })
  uploadedByUserId: string | null;

  @CreateDateColumn({ name: 'created_at', type: 'timestamptz' })
  createdAt: Date;
}
