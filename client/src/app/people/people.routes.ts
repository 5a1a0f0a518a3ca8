import { Routes } from '@angular/router';

export const peopleRoutes: Routes = [
  { path: '', title: 'People · Isallo', loadComponent: () => import('./people-page/people-page').then((m) => m.PeoplePage) },
];
