import { Routes } from '@angular/router';

/** Pages a mailed link or the sign-in page opens, outside the shell and without sign-in. */
export const invitationRoutes: Routes = [
  { path: ':token', title: 'Join Isallo', loadComponent: () => import('./accept-invitation-page/accept-invitation-page').then((m) => m.AcceptInvitationPage) },
];
export const forgotPasswordRoutes: Routes = [
  { path: '', title: 'Forgotten password · Isallo', loadComponent: () => import('./forgot-password-page/forgot-password-page').then((m) => m.ForgotPasswordPage) },
];
export const resetPasswordRoutes: Routes = [
  { path: ':token', title: 'New password · Isallo', loadComponent: () => import('./reset-password-page/reset-password-page').then((m) => m.ResetPasswordPage) },
];
/** The signed-in person's own account, inside the shell. */
export const accountRoutes: Routes = [
  { path: '', title: 'Your account · Isallo', loadComponent: () => import('./account-page/account-page').then((m) => m.AccountPage) },
];
