import { Routes } from '@angular/router';

export const archiveRoutes: Routes = [
  { path: '', title: 'Archive · Isallo', loadComponent: () => import('./archive-page/archive-page').then((m) => m.ArchivePage) },
  { path: 'scans/:scanId', title: 'Scan · Isallo', loadComponent: () => import('./scan-page/scan-page').then((m) => m.ScanPage) },
];
