import type { Routes } from '@angular/router';

export const LOGGER_FILE_ROUTES: Routes = [
  { path: '', loadComponent: () => import('./logger-files-page').then((m) => m.LoggerFilesPage) },
  { path: ':loggerFileId', title: 'Logger file · Chillwarden', loadComponent: () => import('./logger-file-detail').then((m) => m.LoggerFileDetail) },
];
