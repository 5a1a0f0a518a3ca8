import { Routes } from '@angular/router';

import { ArchiveLayout } from './archive-layout/archive-layout';

export const archiveRoutes: Routes = [
  {
    path: '',
    component: ArchiveLayout,
    children: [
      { path: '', pathMatch: 'full', title: 'Catalogue · Isallo', loadComponent: () => import('./catalogue-page/catalogue-page').then((m) => m.CataloguePage) },
      { path: 'intake', loadChildren: () => import('../intake/intake.routes').then((m) => m.intakeRoutes) },
      { path: 'stations', title: 'Stations · Isallo', loadComponent: () => import('./stations-page/stations-page').then((m) => m.StationsPage) },
      { path: 'stations/:stationId', title: 'Station · Isallo', loadComponent: () => import('./station-page/station-page').then((m) => m.StationPage) },
      { path: 'chart-forms', title: 'Chart forms · Isallo', loadComponent: () => import('./chart-forms-page/chart-forms-page').then((m) => m.ChartFormsPage) },
      // "new" is matched before the id so a new form is not looked up as a form called "new".
      { path: 'chart-forms/new', title: 'New chart form · Isallo', loadComponent: () => import('./chart-form-page/chart-form-page').then((m) => m.ChartFormPage) },
      { path: 'chart-forms/:chartFormId', title: 'Chart form · Isallo', loadComponent: () => import('./chart-form-page/chart-form-page').then((m) => m.ChartFormPage) },
      { path: 'review', title: 'Review · Isallo', loadComponent: () => import('./review-list/review-list').then((m) => m.ReviewList) },
      { path: 'review/:inkLineId', title: 'Review an ink line · Isallo', loadComponent: () => import('./review-page/review-page').then((m) => m.ReviewPage) },
      { path: 'scans/:scanId', title: 'Scan · Isallo', loadComponent: () => import('./scan-page/scan-page').then((m) => m.ScanPage) },
    ],
  },
];
