import type { Routes } from '@angular/router';

export const REQUEST_ROUTES: Routes = [
  { path: '', pathMatch: 'full', title: 'Service requests · Chillwarden', loadComponent: () => import('./requests-page').then((m) => m.RequestsPage) },
  { path: ':requestId', title: 'Service request · Chillwarden', loadComponent: () => import('./request-page').then((m) => m.RequestPage) },
];
