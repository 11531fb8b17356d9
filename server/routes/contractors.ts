import { z } from 'zod';
import {
  ContractorIdParams,
  ContractorMemberRequest,
  CoverageQuery,
  CreateContractorRequest,
  SetCoverageRequest,
  UpdateContractorRequest,
} from '../../shared/api/work-orders';
import { RouteGroup, type RouteRule } from '../auth/route-table';
import type { contractorsController, coverageController } from '../controllers/contractors';
import { validate } from '../middleware/validate';

const manager = (summary: string): RouteRule => ({ access: ['manager'], scope: 'organization', summary });

/** Contractor companies and their people: managers of the organization. */
export function contractorsRoutes(controller: ReturnType<typeof contractorsController>): RouteGroup {
  const withId = (body?: Parameters<typeof validate>[0]['body']) => validate({ params: ContractorIdParams, body });
  return new RouteGroup('/api/contractors')
    .get('/', manager("the organization's contractors"), controller.list)
    .post('/', manager('add a contractor company'), validate({ body: CreateContractorRequest }), controller.create)
    // Before '/:contractorId', which would take "people" for an id.
    .get('/people', manager("the organization's contractor users, who can be added as members"), controller.people)
    .get('/:contractorId', manager('one contractor'), withId(), controller.get)
    .patch('/:contractorId', manager('change or archive a contractor'), withId(UpdateContractorRequest), controller.update)
    .post('/:contractorId/members', manager('a contractor user works for this company'), withId(ContractorMemberRequest), controller.addMember)
    .delete('/:contractorId/members/:userId', manager('a contractor user no longer works for it'), validate({ params: ContractorIdParams.extend({ userId: z.uuid() }) }), controller.removeMember);
}

/** The coverage table: contractor × property × appliance style, primary and backup. */
export function coverageRoutes(controller: ReturnType<typeof coverageController>): RouteGroup {
  return new RouteGroup('/api/coverage')
    .get('/', manager('the coverage table'), validate({ query: CoverageQuery }), controller.list)
    .put('/', manager('fill or clear one slot of the coverage table'), validate({ body: SetCoverageRequest }), controller.set);
}
