import { Routes } from '@angular/router';

export const deskRoutes: Routes = [
  { path: '', title: 'Desk · Isallo', loadComponent: () => import('./desk-page/desk-page').then((m) => m.DeskPage) },
];
