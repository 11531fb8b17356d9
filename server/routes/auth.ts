import { ForgotPasswordRequest, ResetPasswordRequest, SignInRequest } from '../../shared/api/auth';
import type { Limiters } from '../auth/rate-limits';
import { RouteGroup } from '../auth/route-table';
import type { authController } from '../controllers/auth';
import { validate } from '../middleware/validate';

/** Sign-in and password reset. All public: they are how one becomes signed in. */
export function authRoutes(controller: ReturnType<typeof authController>, limiters: Limiters): RouteGroup {
  return new RouteGroup('/api/auth')
    .get('/session', { access: 'public', scope: 'self', summary: 'who is signed in (null if nobody); issues the CSRF cookie' }, controller.session)
    .post('/sign-in', { access: 'public', scope: 'none', summary: 'sign in with e-mail and password' }, ...limiters.signIn, validate({ body: SignInRequest }), controller.signIn)
    .post('/sign-out', { access: 'public', scope: 'self', summary: 'end the session' }, controller.signOut)
    .post('/forgot-password', { access: 'public', scope: 'none', summary: 'e-mail a reset link if the account exists' }, ...limiters.resetRequest, validate({ body: ForgotPasswordRequest }), controller.forgotPassword)
    .post('/reset-password', { access: 'public', scope: 'none', summary: 'set a new password with a reset link' }, ...limiters.tokenUse, validate({ body: ResetPasswordRequest }), controller.resetPassword);
}
