import { Routes } from '@angular/router';

export const seriesRoutes: Routes = [
  { path: '', title: 'Series · Isallo', loadComponent: () => import('./series-page/series-page').then((m) => m.SeriesPage) },
];
