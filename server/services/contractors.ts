/** Contractor companies of an organization and the contractor users who work for them. */
import type { DataSource } from 'typeorm';
import type { ContractorView, CreateContractorRequest, UpdateContractorRequest } from '../../shared/api/work-orders';
import type { Actor } from '../auth/actor';
import type { Clock } from '../auth/clock';
import { Contractor } from '../entities/contractor';
import { badRequest, conflict, notFound } from '../errors';

export class ContractorsService {
  constructor(
    private readonly dataSource: DataSource,
    private readonly clock: Clock,
  ) {}

  async list(actor: Actor): Promise<ContractorView[]> {
    const contractors = await this.dataSource.getRepository(Contractor).find({ where: { organizationId: actor.organizationId as string }, order: { name: 'ASC' } });
    return Promise.all(contractors.map((contractor) => this.viewOf(contractor)));
  }

  /** The organization's active contractor users: whom a manager may add as a company's member. */
  async people(actor: Actor): Promise<ContractorView['members']> {
    const rows: { id: string; display_name: string; email: string }[] = await this.dataSource.query(
      `SELECT id, display_name, email FROM app_user WHERE organization_id = $1 AND role = 'contractor' AND deactivated_at IS NULL ORDER BY display_name, email`,
      [actor.organizationId],
    );
    return rows.map((row) => ({ userId: row.id, displayName: row.display_name, email: row.email }));
  }

  async get(actor: Actor, contractorId: string): Promise<ContractorView> {
    return this.viewOf(await this.require(actor, contractorId));
  }

  async create(actor: Actor, request: CreateContractorRequest): Promise<ContractorView> {
    const repository = this.dataSource.getRepository(Contractor);
    try {
      const saved = await repository.save(repository.create({ organizationId: actor.organizationId as string, name: request.name, email: request.email, phone: request.phone }));
      return this.viewOf(saved);
    } catch (error) {
      if ((error as { code?: string }).code === '23505') throw conflict('a contractor of that name exists');
      throw error;
    }
  }

  async update(actor: Actor, contractorId: string, change: UpdateContractorRequest): Promise<ContractorView> {
    const contractor = await this.require(actor, contractorId);
    const { archived, ...fields } = change;
    Object.assign(contractor, fields);
    if (archived !== undefined) contractor.archivedAt = archived ? this.clock.now() : null;
    return this.viewOf(await this.dataSource.getRepository(Contractor).save(contractor));
  }

  async addMember(actor: Actor, contractorId: string, userId: string): Promise<ContractorView> {
    const contractor = await this.require(actor, contractorId);
    const [user] = await this.dataSource.query(`SELECT id FROM app_user WHERE id = $1 AND organization_id = $2 AND role = 'contractor'`, [userId, actor.organizationId]);
    if (!user) throw badRequest('only a contractor user of this organization can work for a contractor');
    await this.dataSource.query(`INSERT INTO contractor_member (contractor_id, user_id) VALUES ($1, $2) ON CONFLICT DO NOTHING`, [contractorId, userId]);
    return this.viewOf(contractor);
  }

  async removeMember(actor: Actor, contractorId: string, userId: string): Promise<ContractorView> {
    const contractor = await this.require(actor, contractorId);
    await this.dataSource.query(`DELETE FROM contractor_member WHERE contractor_id = $1 AND user_id = $2`, [contractorId, userId]);
    return this.viewOf(contractor);
  }

  private async require(actor: Actor, contractorId: string): Promise<Contractor> {
    const contractor = await this.dataSource.getRepository(Contractor).findOneBy({ id: contractorId, organizationId: actor.organizationId as string });
    if (!contractor) throw notFound('contractor');
    return contractor;
  }

  private async viewOf(contractor: Contractor): Promise<ContractorView> {
    const members: { id: string; display_name: string; email: string }[] = await this.dataSource.query(
      `SELECT u.id, u.display_name, u.email FROM contractor_member m JOIN app_user u ON u.id = m.user_id WHERE m.contractor_id = $1 ORDER BY u.display_name`,
      [contractor.id],
    );
    return {
      id: contractor.id,
      name: contractor.name,
      email: contractor.email,
      phone: contractor.phone,
      archivedAt: contractor.archivedAt?.toISOString() ?? null,
      members: members.map((m) => ({ userId: m.id, displayName: m.display_name, email: m.email })),
    };
  }
}
