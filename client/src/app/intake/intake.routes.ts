import { Routes } from '@angular/router';

import { intakeRunningGuard } from './intake-running-guard';

export const intakeRoutes: Routes = [
  { path: '', title: 'Intake · Isallo', canDeactivate: [intakeRunningGuard], loadComponent: () => import('./intake-page/intake-page').then((m) => m.IntakePage) },
  { path: 'batches/:batchId', title: 'Intake batch · Isallo', loadComponent: () => import('./batch-page/batch-page').then((m) => m.BatchPage) },
];
