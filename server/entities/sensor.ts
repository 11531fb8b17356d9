import { Column, CreateDateColumn, Entity, JoinColumn, ManyToOne, PrimaryGeneratedColumn } from 'typeorm';
import type { Appliance } from './appliance';

/** The device in an appliance, with its probes; it signs in to the broker with its own secret. */
@Entity({ name: 'sensor' })
export class Sensor {
  @PrimaryGeneratedColumn('uuid')
  id: string;

  /** The id the device reports and signs in with (MQTT client id and user name). */
  @Column({ name: 'device_id', type: 'text', unique: true })
  deviceId: string;

  @Column({ name: 'appliance_id', type: 'uuid', nullable: true })
  applianceId: string | null;

  @ManyToOne('Appliance', (appliance: Appliance) => appliance.sensors, { onDelete: 'SET NULL', nullable: true })
  @JoinColumn({ name: 'appliance_id' })
  appliance: Appliance | null;

  /** Hash of the device secret; the secret itself is shown once at pairing and never stored. */
  @Column({ name: 'secret_hash', type: 'text' })
  secretHash: string;

  @Column({ name: 'interval_seconds', type: 'integer', default: 300 })
  intervalSeconds: number;

  /** The newest reading's own time. */
  @Column({ name: 'last_seen_at', type: 'timestamptz', nullable: true })
  lastSeenAt: Date | null;

  /** When the ingest last stored a reading of it (receipt, not reading time). */
  @Column({ name: 'last_heard_at', type: 'timestamptz', nullable: true })
  lastHeardAt: Date | null;

  @Column({ name: 'archived_at', type: 'timestamptz', nullable: true })
  archivedAt: Date | null;

  @CreateDateColumn({ name: 'created_at', type: 'timestamptz' })
  createdAt: Date;
}
