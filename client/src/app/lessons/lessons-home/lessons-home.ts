import { ChangeDetectionStrategy, Component } from '@angular/core';
import { MatButtonModule } from '@angular/material/button';
import { MatIconModule } from '@angular/material/icon';
import { MatTabsModule } from '@angular/material/tabs';
import { RouterLink } from '@angular/router';

import { LessonList } from '../lesson-list/lesson-list';

/** The teacher's home: their lessons, the ones they share (with links and expiry), and other teachers' to copy. */
@Component({
  selector: 'isl-lessons-home',
  imports: [MatButtonModule, MatIconModule, MatTabsModule, RouterLink, LessonList],
  template: `
    <section class="isl-page">
      <div class="head">
        <h1 class="title">Lessons</h1>
        <a mat-flat-button routerLink="/lessons/new" data-testid="lesson-new">
          <mat-icon>add</mat-icon>
          New lesson
        </a>
      </div>
      <mat-tab-group animationDuration="0ms" mat-stretch-tabs="false">
        <mat-tab label="My lessons"><ng-template matTabContent><isl-lesson-list scope="mine" /></ng-template></mat-tab>
        <mat-tab label="Shared"><ng-template matTabContent><isl-lesson-list scope="shared" /></ng-template></mat-tab>
        <mat-tab label="By other teachers"><ng-template matTabContent><isl-lesson-list scope="others" /></ng-template></mat-tab>
      </mat-tab-group>
    </section>
  `,
  styles: `
    .head { display: flex; align-items: center; gap: 16px; justify-content: space-between; }
    .title { font: var(--mat-sys-headline-small); margin: 0 0 8px; }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class LessonsHome {}
