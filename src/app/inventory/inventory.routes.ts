import type { Routes } from '@angular/router';

/** Child routes of /inventory; each section loads with its tab. */
export const INVENTORY_ROUTES: Routes = [
  {
    path: '',
    loadComponent: () => import('./inventory-page').then((m) => m.InventoryPage),
    children: [
      { path: '', pathMatch: 'full', redirectTo: 'properties' },
      { path: 'properties', title: 'Properties · Inventory · Chillwarden', loadComponent: () => import('./property-list').then((m) => m.PropertyList) },
      {
        path: 'properties/:propertyId',
        title: 'Property · Inventory · Chillwarden',
        loadComponent: () => import('./property-detail').then((m) => m.PropertyDetail),
      },
      { path: 'appliances', title: 'Appliances · Inventory · Chillwarden', loadComponent: () => import('./appliance-list').then((m) => m.ApplianceList) },
      { path: 'sensors', title: 'Sensors · Inventory · Chillwarden', loadComponent: () => import('./sensor-list').then((m) => m.SensorList) },
      { path: 'sensors/:sensorId', title: 'Sensor · Inventory · Chillwarden', loadComponent: () => import('./sensor-detail').then((m) => m.SensorDetail) },
      { path: 'contractors', title: 'Contractors · Inventory · Chillwarden', loadComponent: () => import('./contractor-list').then((m) => m.ContractorList) },
      { path: 'coverage', title: 'Coverage · Inventory · Chillwarden', loadComponent: () => import('./coverage-editor').then((m) => m.CoverageEditor) },
      { path: 'import', title: 'Import · Inventory · Chillwarden', loadComponent: () => import('./inventory-import').then((m) => m.InventoryImport) },
    ],
  },
];
