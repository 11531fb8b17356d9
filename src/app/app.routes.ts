import { inject } from '@angular/core';
import type { Route, Routes } from '@angular/router';
import type { Role } from '../../shared/domain';
import { ACCOUNT_ROUTES } from './auth/account.routes';
import { roleGuard } from './core/auth/guards';
import { Session } from './core/auth/session';

interface EmptyPageData {
  title: string;
  lead: string;
  icon: string;
  heading: string;
  message: string;
  actionLabel?: string;
  actionLink?: string;
}

/** A route whose feature page is still to come: it shows a real empty state meanwhile. */
function emptyStateRoute(path: string, roles: Role[], data: EmptyPageData): Route {
  return {
    path,
    title: `${data.title} · Chillwarden`,
    canMatch: [roleGuard(...roles)],
    loadComponent: () => import('./shared/empty-state-page/empty-state-page').then((m) => m.EmptyStatePage),
    data: { ...data },
  };
}

export const routes: Routes = [
  { path: '', pathMatch: 'full', redirectTo: () => inject(Session).homePath() },
  {
    path: 'status',
    title: 'System status · Chillwarden',
    loadComponent: () => import('./status/status-page').then((m) => m.StatusPage),
  },
  ...ACCOUNT_ROUTES,
  {
    path: 'fleet',
    title: 'Fleet · Chillwarden',
    canMatch: [roleGuard('manager')],
    loadComponent: () => import('./fleet/fleet-page').then((m) => m.FleetPage),
  },
  {
    path: 'appliances/:id',
    title: 'Appliance · Chillwarden',
    canMatch: [roleGuard('manager')],
    loadComponent: () => import('./appliance/appliance-page').then((m) => m.AppliancePage),
  },
  {
    path: 'incidents',
    title: 'Incidents · Chillwarden',
    canMatch: [roleGuard('manager')],
    loadComponent: () => import('./incidents/incidents-page').then((m) => m.IncidentsPage),
  },
  {
    path: 'requests',
    canMatch: [roleGuard('manager')],
    loadChildren: () => import('./requests/requests.routes').then((m) => m.REQUEST_ROUTES),
  },
  {
    path: 'work-orders/:workOrderId',
    title: 'Work order · Chillwarden',
    canMatch: [roleGuard('manager', 'contractor')],
    loadComponent: () => import('./work-order/work-order-page').then((m) => m.WorkOrderPage),
  },
  {
    path: 'work-orders',
    pathMatch: 'full',
    title: 'Work orders · Chillwarden',
    canMatch: [roleGuard('manager')],
    loadComponent: () => import('./work-orders/work-orders-page').then((m) => m.WorkOrdersPage),
  },
  {
    path: 'inventory',
    title: 'Inventory · Chillwarden',
    canMatch: [roleGuard('manager')],
    loadChildren: () => import('./inventory/inventory.routes').then((m) => m.INVENTORY_ROUTES),
  },
  {
    path: 'logger-files',
    title: 'Logger files · Chillwarden',
    canMatch: [roleGuard('manager')],
    loadChildren: () => import('./logger-files/logger-files.routes').then((m) => m.LOGGER_FILE_ROUTES),
  },
  {
    path: 'reports',
    title: 'Reports · Chillwarden',
    canMatch: [roleGuard('manager')],
    loadComponent: () => import('./reports/reports-page').then((m) => m.ReportsPage),
  },
  {
    path: 'settings',
    title: 'Settings · Chillwarden',
    canMatch: [roleGuard('manager')],
    loadComponent: () => import('./settings/settings-page').then((m) => m.SettingsPage),
  },
  {
    path: 'jobs',
    title: 'My jobs · Chillwarden',
    canMatch: [roleGuard('contractor')],
    loadComponent: () => import('./jobs/jobs-page').then((m) => m.JobsPage),
  },
  {
    path: 'home',
    title: 'My refrigerator · Chillwarden',
    canMatch: [roleGuard('tenant')],
    loadComponent: () => import('./home/home-page').then((m) => m.HomePage),
  },
  {
    path: '**',
    title: 'Not found · Chillwarden',
    loadComponent: () => import('./not-found/not-found-page').then((m) => m.NotFoundPage),
  },
];
