import { Routes } from '@angular/router';

export const peopleRoutes: Routes = [
  { path: '', title: 'People · Isallo', loadComponent: () => import('./people-page/people-page').then((m) => m.PeoplePage) },
  { path: 'changes', title: 'People change log · Isallo', loadComponent: () => import('./people-changes-page/people-changes-page').then((m) => m.PeopleChangesPage) },
  { path: 'mails', title: 'Captured mails · Isallo', loadComponent: () => import('./captured-mails-page/captured-mails-page').then((m) => m.CapturedMailsPage) },
];
