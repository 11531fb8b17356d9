import { Column, CreateDateColumn, Entity, JoinColumn, ManyToOne, OneToMany, PrimaryGeneratedColumn } from 'typeorm';
import type { Organization } from './organization';
import type { Unit } from './unit';

/** A building or site, with its address and the time zone its dates are shown in. */
@Entity({ name: 'property' })
export class Property {
  @PrimaryGeneratedColumn('uuid')
  id: string;

  @Column({ name: 'organization_id', type: 'uuid' })
  organizationId: string;

  @ManyToOne('Organization', (organization: Organization) => organization.properties, { onDelete: 'CASCADE' })
  @JoinColumn({ name: 'organization_id' })
  organization: Organization;

  @Column({ type: 'text' })
  name: string;

  @Column({ name: 'address_line1', type: 'text' })
  addressLine1: string;

  @Column({ name: 'address_line2', type: 'text', nullable: true })
  addressLine2: string | null;

  @Column({ type: 'text' })
  city: string;

  @Column({ type: 'text', default: '' })
  region: string;

  @Column({ name: 'postal_code', type: 'text', default: '' })
  postalCode: string;

  @Column({ type: 'text', default: 'US' })
  country: string;

  @Column({ name: 'time_zone', type: 'text' })
  timeZone: string;

  @Column({ name: 'archived_at', type: 'timestamptz', nullable: true })
  archivedAt: Date | null;

  @CreateDateColumn({ name: 'created_at', type: 'timestamptz' })
  createdAt: Date;

  @OneToMany('Unit', (unit: Unit) => unit.property)
  units: Unit[];
}
