import { Column, CreateDateColumn, Entity, OneToMany, PrimaryGeneratedColumn } from 'typeorm';
import type { Property } from './property';
import type { User } from './user';

/** A property-management company or landlord: the boundary of every manager's scope. */
@Entity({ name: 'organization' })
export class Organization {
  @PrimaryGeneratedColumn('uuid')
  id: string;

  @Column({ type: 'text' })
  name: string;

  @CreateDateColumn({ name: 'created_at', type: 'timestamptz' })
  createdAt: Date;

  @OneToMany('Property', (property: Property) => property.organization)
  properties: Property[];

  @OneToMany('User', (user: User) => user.organization)
  users: User[];
}
