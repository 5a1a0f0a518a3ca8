import { Routes } from '@angular/router';

import { BENCH_ROLES, rolesFor } from './core/auth/areas';
import { homeRedirect } from './core/auth/home-redirect';
import { roleGuard } from './core/auth/role-guard';
import { signedInGuard } from './core/auth/signed-in-guard';
import { AppShell } from './core/layout/app-shell';

export const routes: Routes = [
  { path: 'sign-in', loadChildren: () => import('./sign-in/sign-in.routes').then((m) => m.signInRoutes) },
  // Pages a mailed link opens, and the reset request: no account or sign-in yet.
  { path: 'invitation', loadChildren: () => import('./account/account.routes').then((m) => m.invitationRoutes) },
  { path: 'forgot-password', loadChildren: () => import('./account/account.routes').then((m) => m.forgotPasswordRoutes) },
  { path: 'reset-password', loadChildren: () => import('./account/account.routes').then((m) => m.resetPasswordRoutes) },
  // A share link's page is for a class without accounts: outside the shell and its sign-in guard.
  { path: 'shared', loadChildren: () => import('./lessons/shared-lesson.routes').then((m) => m.sharedLessonRoutes) },
  {
    path: '',
    component: AppShell,
    canMatch: [signedInGuard],
    children: [
      // Home depends on the person's roles, so it is computed rather than fixed.
      { path: '', pathMatch: 'full', redirectTo: homeRedirect },
      {
        path: 'archive',
        canMatch: [roleGuard(rolesFor('archive'))],
        loadChildren: () => import('./archive/archive.routes').then((m) => m.archiveRoutes),
      },
      {
        path: 'desk',
        canMatch: [roleGuard(rolesFor('desk'))],
        loadChildren: () => import('./desk/desk.routes').then((m) => m.deskRoutes),
      },
      {
        path: 'bench',
        canMatch: [roleGuard(BENCH_ROLES)],
        loadChildren: () => import('./bench/bench.routes').then((m) => m.benchRoutes),
      },
      {
        path: 'lessons',
        canMatch: [roleGuard(rolesFor('lessons'))],
        loadChildren: () => import('./lessons/lessons.routes').then((m) => m.lessonsRoutes),
      },
      {
        path: 'series',
        canMatch: [roleGuard(rolesFor('series'))],
        loadChildren: () => import('./series/series.routes').then((m) => m.seriesRoutes),
      },
      {
        path: 'people',
        canMatch: [roleGuard(rolesFor('people'))],
        loadChildren: () => import('./people/people.routes').then((m) => m.peopleRoutes),
      },
      { path: 'account', loadChildren: () => import('./account/account.routes').then((m) => m.accountRoutes) },
      { path: 'no-area', loadComponent: () => import('./core/layout/no-area/no-area').then((m) => m.NoArea) },
    ],
  },
  // Unknown addresses (and signed-out visitors, once the shell refuses them) start over from home.
  { path: '**', redirectTo: '' },
];
