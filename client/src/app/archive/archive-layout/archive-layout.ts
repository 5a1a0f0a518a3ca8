import { ChangeDetectionStrategy, Component } from '@angular/core';
import { MatIconModule } from '@angular/material/icon';
import { MatTabsModule } from '@angular/material/tabs';
import { RouterLink, RouterLinkActive, RouterOutlet } from '@angular/router';

interface ArchiveTab {
  path: string;
  label: string;
  icon: string;
  testId: string;
  /** The catalogue sits at the area's root, so only an exact match makes it active. */
  exact: boolean;
}

const TABS: readonly ArchiveTab[] = [
  { path: '/archive', label: 'Catalogue', icon: 'table_rows', testId: 'archive-tab-catalogue', exact: true },
  { path: '/archive/review', label: 'Review', icon: 'fact_check', testId: 'archive-tab-review', exact: false },
  { path: '/archive/intake', label: 'Intake', icon: 'move_to_inbox', testId: 'archive-tab-intake', exact: false },
  { path: '/archive/stations', label: 'Stations', icon: 'location_on', testId: 'archive-tab-stations', exact: false },
  { path: '/archive/chart-forms', label: 'Chart forms', icon: 'grid_on', testId: 'archive-tab-chart-forms', exact: false },
];

/** The Archive's tabs (catalogue, review, intake, registers) above the page of the chosen one. */
@Component({
  selector: 'isl-archive-layout',
  imports: [MatTabsModule, MatIconModule, RouterLink, RouterLinkActive, RouterOutlet],
  template: `
    <nav mat-tab-nav-bar [tabPanel]="panel" class="tabs" aria-label="Archive">
      @for (tab of tabs; track tab.path) {
        <a
          mat-tab-link
          [routerLink]="tab.path"
          routerLinkActive
          #link="routerLinkActive"
          [routerLinkActiveOptions]="{ exact: tab.exact }"
          [active]="link.isActive"
          [attr.data-testid]="tab.testId"
        >
          <mat-icon class="icon">{{ tab.icon }}</mat-icon>{{ tab.label }}
        </a>
      }
    </nav>
    <mat-tab-nav-panel #panel>
      <router-outlet />
    </mat-tab-nav-panel>
  `,
  styles: `
    .tabs { padding: 0 16px; --mat-tab-container-height: 40px; }
    .icon { margin-right: 6px; font-size: 20px; width: 20px; height: 20px; }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class ArchiveLayout {
  protected readonly tabs = TABS;
}
