import { ChangeEmailRequest, ChangePasswordRequest, UpdateProfileRequest } from '../../shared/api/auth';
import type { Limiters } from '../auth/rate-limits';
import { RouteGroup } from '../auth/route-table';
import type { profileController } from '../controllers/profile';
import { validate } from '../middleware/validate';

/** Everyone's own account: name, phone, units, time zone, e-mail, password. */
export function profileRoutes(controller: ReturnType<typeof profileController>, limiters: Limiters): RouteGroup {
  return new RouteGroup('/api/profile')
    .get('/', { access: 'signed-in', scope: 'self', summary: 'my profile' }, controller.get)
    .patch('/', { access: 'signed-in', scope: 'self', summary: 'change my name, phone, temperature unit or time zone' }, validate({ body: UpdateProfileRequest }), controller.update)
    .post('/password', { access: 'signed-in', scope: 'self', summary: 'change my password' }, ...limiters.currentPassword, validate({ body: ChangePasswordRequest }), controller.changePassword)
    .post('/email', { access: 'signed-in', scope: 'self', summary: 'change my e-mail address' }, ...limiters.currentPassword, validate({ body: ChangeEmailRequest }), controller.changeEmail);
}
