import { AcceptInvitationRequest, InspectInvitationRequest } from '../../shared/api/auth';
import { InvitationIdParams, InviteRequest } from '../../shared/api/users';
import type { Limiters } from '../auth/rate-limits';
import { RouteGroup } from '../auth/route-table';
import type { invitationsController } from '../controllers/invitations';
import { validate } from '../middleware/validate';

/**
 * Managers invite (only an admin may invite a manager: the service checks); the invitee,
 * not yet signed in, previews and accepts with the link's token in the request body.
 */
export function invitationsRoutes(controller: ReturnType<typeof invitationsController>, limiters: Limiters): RouteGroup {
  const managers = (summary: string) => ({ access: ['manager'] as const, scope: 'organization' as const, summary });
  return new RouteGroup('/api/invitations')
    .get('/', managers("the organization's invitations"), controller.list)
    .get('/unit-options', managers('units a tenant can be invited to'), controller.unitOptions)
    .post('/', managers('invite someone by e-mail'), validate({ body: InviteRequest }), controller.create)
    .delete('/:invitationId', managers('withdraw an invitation'), validate({ params: InvitationIdParams }), controller.revoke)
    .post('/preview', { access: 'public', scope: 'none', summary: 'what an invitation link is for' }, ...limiters.tokenUse, validate({ body: InspectInvitationRequest }), controller.preview)
    .post('/accept', { access: 'public', scope: 'none', summary: 'accept an invitation and set a password' }, ...limiters.tokenUse, validate({ body: AcceptInvitationRequest }), controller.accept);
}
