import { Routes } from '@angular/router';

export const lessonsRoutes: Routes = [
  { path: '', title: 'Lessons · Isallo', loadComponent: () => import('./lessons-home/lessons-home').then((m) => m.LessonsHome) },
  { path: 'new', title: 'New lesson · Isallo', loadComponent: () => import('./new-lesson/new-lesson').then((m) => m.NewLesson) },
  { path: ':lessonId', title: 'Lesson · Isallo', loadComponent: () => import('./lesson-editor/lesson-editor').then((m) => m.LessonEditor) },
  { path: ':lessonId/handout', title: 'Handout · Isallo', loadComponent: () => import('./lesson-handout/lesson-handout').then((m) => m.LessonHandout) },
];
