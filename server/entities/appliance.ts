import { Column, CreateDateColumn, Entity, JoinColumn, ManyToOne, OneToMany, PrimaryGeneratedColumn } from 'typeorm';
import type { ApplianceStyle } from '../../shared/domain';
import type { Sensor } from './sensor';
import type { Unit } from './unit';

/** A refrigerator or freezer the landlord supplies in a unit. */
@Entity({ name: 'appliance' })
export class Appliance {
  @PrimaryGeneratedColumn('uuid')
  id: string;

  @Column({ name: 'unit_id', type: 'uuid' })
  unitId: string;

  @ManyToOne('Unit', (unit: Unit) => unit.appliances, { onDelete: 'CASCADE' })
  @JoinColumn({ name: 'unit_id' })
  unit: Unit;

  @Column({ type: 'text' })
  style: ApplianceStyle;

  /** Model and serial are free text, as printed on the data plate. */
  @Column({ type: 'text', default: '' })
  model: string;

  @Column({ type: 'text', default: '' })
  serial: string;

  @Column({ name: 'installed_on', type: 'date', nullable: true })
  installedOn: string | null;

  @Column({ name: 'warranty_ends_on', type: 'date', nullable: true })
  warrantyEndsOn: string | null;

  @Column({ name: 'archived_at', type: 'timestamptz', nullable: true })
  archivedAt: Date | null;

  @CreateDateColumn({ name: 'created_at', type: 'timestamptz' })
  createdAt: Date;

  @OneToMany('Sensor', (sensor: Sensor) => sensor.appliance)
  sensors: Sensor[];
}
