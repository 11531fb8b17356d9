import { Column, Entity, PrimaryColumn } from 'typeorm';
import type { ApplianceStyle, Health } from '../../shared/domain';
import type { IncidentTrackerState } from '../detection/incidents';
import type { EngineState } from '../detection/state';

/** The live monitor's memory of one appliance, so a restart resumes without re-reading. */
@Entity({ name: 'appliance_monitor' })
export class ApplianceMonitor {
  @PrimaryColumn({ name: 'appliance_id', type: 'uuid' })
  applianceId: string;

  @Column({ type: 'text' })
  style: ApplianceStyle;

  @Column({ name: 'engine_state', type: 'jsonb' })
  engineState: EngineState;

  @Column({ name: 'tracker_state', type: 'jsonb' })
  trackerState: IncidentTrackerState;

  @Column({ type: 'text' })
  health: Health;

  @Column({ name: 'health_since', type: 'timestamptz' })
  healthSince: Date;

  @Column({ name: 'last_reading_at', type: 'timestamptz', nullable: true })
  lastReadingAt: Date | null;

  @Column({ name: 'fresh_food_c', type: 'real', nullable: true })
  freshFoodC: number | null;

  @Column({ name: 'freezer_c', type: 'real', nullable: true })
  freezerC: number | null;

  @Column({ name: 'updated_at', type: 'timestamptz' })
  updatedAt: Date;
}
