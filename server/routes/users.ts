import { ChangeUserRequest, UserIdParams, UserQuery } from '../../shared/api/users';
import { ADMIN_ONLY } from '../auth/access';
import { RouteGroup } from '../auth/route-table';
import type { usersController } from '../controllers/users';
import { validate } from '../middleware/validate';

/** User management of an organization: administrators only. */
export function usersRoutes(controller: ReturnType<typeof usersController>): RouteGroup {
  const rule = (summary: string) => ({ access: ADMIN_ONLY, scope: 'organization' as const, summary });
  return new RouteGroup('/api/users')
    .get('/', rule("list the organization's users"), validate({ query: UserQuery }), controller.list)
    .get('/:userId', rule('one user'), validate({ params: UserIdParams }), controller.get)
    .patch('/:userId', rule("change a user's role, unit or admin flag"), validate({ params: UserIdParams, body: ChangeUserRequest }), controller.change)
    .post('/:userId/deactivate', rule('deactivate a user and end their sessions'), validate({ params: UserIdParams }), controller.deactivate)
    .post('/:userId/reactivate', rule('reactivate a user'), validate({ params: UserIdParams }), controller.reactivate);
}
