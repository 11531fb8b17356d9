import type { Routes } from '@angular/router';
import { adminGuard, signedInGuard, signedOutGuard } from '../core/auth/guards';

/** Sign-in, password and invitation pages, the profile, and user management. */
export const ACCOUNT_ROUTES: Routes = [
  {
    path: 'sign-in',
    title: 'Sign in · Chillwarden',
    canMatch: [signedOutGuard],
    loadComponent: () => import('./sign-in-page').then((m) => m.SignInPage),
  },
  {
    path: 'forgot-password',
    title: 'Forgot your password · Chillwarden',
    loadComponent: () => import('./forgot-password-page').then((m) => m.ForgotPasswordPage),
  },
  {
    path: 'reset-password',
    title: 'Choose a new password · Chillwarden',
    loadComponent: () => import('./reset-password-page').then((m) => m.ResetPasswordPage),
  },
  {
    path: 'accept-invitation',
    title: 'Accept your invitation · Chillwarden',
    loadComponent: () => import('./accept-invitation-page').then((m) => m.AcceptInvitationPage),
  },
  {
    path: 'profile',
    title: 'Profile · Chillwarden',
    canMatch: [signedInGuard],
    loadComponent: () => import('../profile/profile-page').then((m) => m.ProfilePage),
  },
  {
    path: 'users',
    title: 'People · Chillwarden',
    canMatch: [adminGuard],
    loadComponent: () => import('../users/users-page').then((m) => m.UsersPage),
  },
];
