import { Routes } from '@angular/router';

export const signInRoutes: Routes = [
  { path: '', title: 'Sign in · Isallo', loadComponent: () => import('./sign-in-page/sign-in-page').then((m) => m.SignInPage) },
];
