import { Column, Entity, PrimaryGeneratedColumn } from 'typeorm';
import type { IncidentLane, IncidentLevel } from '../../shared/api/monitor';
import type { CauseCode, FindingKind, Severity } from '../../shared/domain';
import type { ProbableCause } from '../detection/types';

/** One episode of trouble: on an appliance, or (a power loss) on a whole property. */
@Entity({ name: 'incident' })
export class IncidentRecord {
  @PrimaryGeneratedColumn('uuid')
  id: string;

  @Column({ name: 'organization_id', type: 'uuid' })
  organizationId: string;

  @Column({ name: 'property_id', type: 'uuid' })
  propertyId: string;

  @Column({ name: 'unit_id', type: 'uuid', nullable: true })
  unitId: string | null;

  @Column({ name: 'appliance_id', type: 'uuid', nullable: true })
  applianceId: string | null;

  @Column({ type: 'text' })
  level: IncidentLevel;

  /** The id the incident tracker (or the power-loss correlation) gave it. */
  @Column({ name: 'engine_incident_id', type: 'text' })
  engineIncidentId: string;

  @Column({ type: 'text' })
  lane: IncidentLane;

  @Column({ type: 'text' })
  kind: FindingKind;

  @Column({ type: 'text', array: true, default: () => `'{}'` })
  kinds: FindingKind[];

  @Column({ name: 'started_at', type: 'timestamptz' })
  startedAt: Date;

  @Column({ name: 'opened_at', type: 'timestamptz' })
  openedAt: Date;

  @Column({ name: 'closed_at', type: 'timestamptz', nullable: true })
  closedAt: Date | null;

  @Column({ type: 'text' })
  severity: Severity;

  @Column({ name: 'top_cause', type: 'text', nullable: true })
  topCause: CauseCode | null;

  @Column({ name: 'probable_causes', type: 'jsonb', default: () => `'[]'` })
  probableCauses: ProbableCause[];

  @Column({ name: 'minutes_above_4c', type: 'integer', default: 0 })
  minutesAbove4c: number;

  /** Set on a unit incident that a property's power loss explains. */
  @Column({ name: 'property_incident_id', type: 'uuid', nullable: true })
  propertyIncidentId: string | null;

  @Column({ name: 'appliance_ids', type: 'uuid', array: true, default: () => `'{}'` })
  applianceIds: string[];

  @Column({ name: 'updated_at', type: 'timestamptz' })
  updatedAt: Date;
}
