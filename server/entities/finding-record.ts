import { Column, Entity, PrimaryGeneratedColumn } from 'typeorm';
import type { Compartment, FindingKind, Severity } from '../../shared/domain';
import type { ProbableCause } from '../detection/types';

/** A finding of the detection engine as stored: upserted by appliance and engine id. */
@Entity({ name: 'finding' })
export class FindingRecord {
  @PrimaryGeneratedColumn('uuid')
  id: string;

  @Column({ name: 'organization_id', type: 'uuid' })
  organizationId: string;

  @Column({ name: 'property_id', type: 'uuid' })
  propertyId: string;

  /** Null for a property's power-loss finding. */
  @Column({ name: 'appliance_id', type: 'uuid', nullable: true })
  applianceId: string | null;

  @Column({ name: 'incident_id', type: 'uuid', nullable: true })
  incidentId: string | null;

  @Column({ name: 'engine_finding_id', type: 'text' })
  engineFindingId: string;

  @Column({ type: 'text' })
  kind: FindingKind;

  @Column({ type: 'text' })
  compartment: Compartment;

  @Column({ name: 'started_at', type: 'timestamptz' })
  startedAt: Date;

  @Column({ name: 'detected_at', type: 'timestamptz' })
  detectedAt: Date;

  @Column({ name: 'ended_at', type: 'timestamptz', nullable: true })
  endedAt: Date | null;

  @Column({ type: 'text' })
  severity: Severity;

  @Column({ name: 'probable_causes', type: 'jsonb', default: () => `'[]'` })
  probableCauses: ProbableCause[];

  @Column({ name: 'minutes_above_4c', type: 'integer', default: 0 })
  minutesAbove4c: number;

  @Column({ name: 'forecast_crossing_at', type: 'timestamptz', nullable: true })
  forecastCrossingAt: Date | null;

  @Column({ type: 'text', default: '' })
  summary: string;

  @Column({ name: 'updated_at', type: 'timestamptz' })
  updatedAt: Date;
}
