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
  emptyStateRoute('incidents', ['manager'], {
    title: 'Incidents',
    lead: 'Episodes of trouble on an appliance, from the first finding to recovery.',
    icon: 'device_thermostat',
    heading: 'No incidents',
    message: 'When an appliance warms away from its own normal, an incident opens here with the probable failed part.',
  }),
  emptyStateRoute('requests', ['manager'], {
    title: 'Service requests',
    lead: 'Requests for repair, opened by the monitor or by a tenant.',
    icon: 'assignment',
    heading: 'No service requests',
    message: 'Requests open here when an incident needs a technician or a tenant reports a problem.',
  }),
  {
    path: 'work-orders/:workOrderId',
    title: 'Work order · Chillwarden',
    canMatch: [roleGuard('manager', 'contractor')],
    loadComponent: () => import('./work-order/work-order-page').then((m) => m.WorkOrderPage),
  },
  emptyStateRoute('work-orders', ['manager'], {
    title: 'Work orders',
    lead: 'Jobs dispatched to contractors, from dispatch to a repair verified by telemetry.',
    icon: 'build',
    heading: 'No work orders',
    message: 'A work order is dispatched to the contractor who covers the building when a request needs a visit.',
  }),
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
