import { Routes } from '@angular/router';

export const benchRoutes: Routes = [
  { path: ':scanId', title: 'Bench · Isallo', loadComponent: () => import('./bench-page/bench-page').then((m) => m.BenchPage) },
  // The Bench always works on one scan; without one, the Desk is where to choose it.
  { path: '', pathMatch: 'full', redirectTo: '/desk' },
];
