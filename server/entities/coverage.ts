import { Column, CreateDateColumn, Entity, PrimaryGeneratedColumn } from 'typeorm';
import type { CoverageRank } from '../../shared/api/work-orders';
import type { ApplianceStyle } from '../../shared/domain';

/** Who is dispatched for a property and appliance style: a primary and a backup. */
@Entity({ name: 'coverage' })
export class Coverage {
  @PrimaryGeneratedColumn('uuid')
  id: string;

  @Column({ name: 'organization_id', type: 'uuid' })
  organizationId: string;

  @Column({ name: 'contractor_id', type: 'uuid' })
  contractorId: string;

  @Column({ name: 'property_id', type: 'uuid' })
  propertyId: string;

  /** Null covers every style of the property that has no row of its own. */
  @Column({ name: 'appliance_style', type: 'text', nullable: true })
  applianceStyle: ApplianceStyle | null;

  @Column({ type: 'text' })
  rank: CoverageRank;

  @CreateDateColumn({ name: 'created_at', type: 'timestamptz' })
  createdAt: Date;
}
