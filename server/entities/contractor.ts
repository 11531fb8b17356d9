import { Column, CreateDateColumn, Entity, OneToMany, PrimaryGeneratedColumn } from 'typeorm';
import type { ContractorMember } from './contractor-member';

/** A repair company the organization dispatches work orders to. */
@Entity({ name: 'contractor' })
export class Contractor {
  @PrimaryGeneratedColumn('uuid')
  id: string;

  @Column({ name: 'organization_id', type: 'uuid' })
  organizationId: string;

  @Column({ type: 'text' })
  name: string;

  /** The dispatch address: every job goes here as well as to the company's people. */
  @Column({ type: 'text' })
  email: string;

  @Column({ type: 'text', default: '' })
  phone: string;

  @Column({ name: 'archived_at', type: 'timestamptz', nullable: true })
  archivedAt: Date | null;

  @CreateDateColumn({ name: 'created_at', type: 'timestamptz' })
  createdAt: Date;

  @OneToMany('ContractorMember', (member: ContractorMember) => member.contractor)
  members: ContractorMember[];
}
