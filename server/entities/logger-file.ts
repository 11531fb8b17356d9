import { Column, Entity, PrimaryGeneratedColumn } from 'typeorm';
import type { LoggerAnalysis, LoggerChart } from '../../shared/api/logger-files';
import type { ApplianceStyle } from '../../shared/domain';

/**
 * A logger file a manager uploaded: its text (to attach it to an appliance's history later),
 * the engine's analysis and the downsampled chart. One row per content per organization.
 */
@Entity({ name: 'logger_file' })
export class LoggerFile {
  @PrimaryGeneratedColumn('uuid')
  id: string;

  @Column({ name: 'organization_id', type: 'uuid' })
  organizationId: string;

  @Column({ name: 'uploaded_by_user_id', type: 'uuid', nullable: true })
  uploadedByUserId: string | null;

  @Column({ name: 'file_name', type: 'text' })
  fileName: string;

  @Column({ name: 'size_bytes', type: 'integer' })
  sizeBytes: number;

  @Column({ name: 'content_sha256', type: 'text' })
  contentSha256: string;

  @Column({ type: 'text', select: false })
  content: string;

  @Column({ type: 'text' })
  style: ApplianceStyle;

  @Column({ type: 'integer' })
  readings: number;

  @Column({ name: 'first_at', type: 'timestamptz', nullable: true })
  firstAt: Date | null;

  @Column({ name: 'last_at', type: 'timestamptz', nullable: true })
  lastAt: Date | null;

  @Column({ type: 'jsonb' })
  analysis: LoggerAnalysis;

  @Column({ type: 'jsonb' })
  chart: LoggerChart;

  @Column({ name: 'attached_appliance_id', type: 'uuid', nullable: true })
  attachedApplianceId: string | null;

  @Column({ name: 'attached_at', type: 'timestamptz', nullable: true })
  attachedAt: Date | null;

  @Column({ name: 'attached_by_user_id', type: 'uuid', nullable: true })
  attachedByUserId: string | null;

  @Column({ name: 'attached_readings', type: 'integer', nullable: true })
  attachedReadings: number | null;

  @Column({ name: 'uploaded_at', type: 'timestamptz' })
  uploadedAt: Date;
}
