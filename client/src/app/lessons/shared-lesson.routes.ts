import { Routes } from '@angular/router';

export const sharedLessonRoutes: Routes = [
  { path: ':token', title: 'Lesson · Isallo', loadComponent: () => import('./shared-lesson-page/shared-lesson-page').then((m) => m.SharedLessonPage) },
];
