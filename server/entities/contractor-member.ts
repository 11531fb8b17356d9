import { CreateDateColumn, Entity, JoinColumn, ManyToOne, PrimaryColumn } from 'typeorm';
import type { Contractor } from './contractor';
import type { User } from './user';

/** A contractor user who works for a contractor company and so sees its work orders. */
@Entity({ name: 'contractor_member' })
export class ContractorMember {
  @PrimaryColumn({ name: 'contractor_id', type: 'uuid' })
  contractorId: string;

  @PrimaryColumn({ name: 'user_id', type: 'uuid' })
  userId: string;

  @ManyToOne('Contractor', (contractor: Contractor) => contractor.members, { onDelete: 'CASCADE' })
  @JoinColumn({ name: 'contractor_id' })
  contractor: Contractor;

  @ManyToOne('User', { onDelete: 'CASCADE' })
  @JoinColumn({ name: 'user_id' })
  user: User;

  @CreateDateColumn({ name: 'created_at', type: 'timestamptz' })
  createdAt: Date;
}
