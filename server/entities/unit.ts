import { Column, CreateDateColumn, Entity, JoinColumn, ManyToOne, OneToMany, PrimaryGeneratedColumn } from 'typeorm';
import type { Appliance } from './appliance';
import type { Property } from './property';

/** A dwelling in a property. */
@Entity({ name: 'unit' })
export class Unit {
  @PrimaryGeneratedColumn('uuid')
  id: string;

  @Column({ name: 'property_id', type: 'uuid' })
  propertyId: string;

  @ManyToOne('Property', (property: Property) => property.units, { onDelete: 'CASCADE' })
  @JoinColumn({ name: 'property_id' })
  property: Property;

  /** The label on the door, e.g. "4B". */
  @Column({ type: 'text' })
  label: string;

  @Column({ type: 'integer', nullable: true })
  floor: number | null;

  @Column({ name: 'archived_at', type: 'timestamptz', nullable: true })
  archivedAt: Date | null;

  @CreateDateColumn({ name: 'created_at', type: 'timestamptz' })
  createdAt: Date;

  @OneToMany('Appliance', (appliance: Appliance) => appliance.unit)
  appliances: Appliance[];
}
