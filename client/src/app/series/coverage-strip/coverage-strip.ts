import { ChangeDetectionStrategy, Component, computed, input, output } from '@angular/core';
import type { StationCoverage } from '@shared/api/series-query';

import { coverageCells } from './coverage-cells';

const WIDTH = 960;
const LEFT = 56;
const RIGHT = 16;

/** Where a station has data, month by month, before any date is typed; a click on a month shows it. */
@Component({
  selector: 'isl-coverage-strip',
  template: `
    <div class="strip-row">
      <svg class="strip" [attr.viewBox]="'0 0 ' + width + ' 22'" role="list" aria-label="Months with data" data-testid="coverage-strip">
        <rect class="track" [attr.x]="left" y="6" [attr.width]="width - left - right" height="10" />
        @for (cell of cells(); track cell.month) {
          <rect
            role="listitem"
            [class]="'cell ' + cell.kind"
            [attr.data-month]="cell.month"
            [attr.x]="cell.x"
            y="3"
            [attr.width]="cell.width"
            height="16"
            [attr.fill-opacity]="cell.kind === 'data' ? 0.35 + 0.65 * cell.fullness : 1"
            (click)="monthChosen.emit([cell.fromMs, cell.toMs])"
          >
            <title>{{ cell.title }}</title>
          </rect>
        }
      </svg>
    </div>
    <p class="summary" data-testid="coverage-summary">{{ summary() }}</p>
  `,
  styles: `
    :host { display: block; }
    .strip { width: 100%; height: auto; display: block; }
    .track { fill: var(--mat-sys-surface-container-high); }
    .cell { cursor: pointer; }
    .cell.data { fill: var(--mat-sys-primary); }
    .cell.charts { fill: none; stroke: var(--mat-sys-outline); stroke-dasharray: 2 1; }
    .summary { margin: 2px 0 0; font: var(--mat-sys-body-small); color: var(--mat-sys-on-surface-variant); }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class CoverageStrip {
  readonly coverage = input.required<StationCoverage>();
  readonly monthChosen = output<[number, number]>();

  protected readonly width = WIDTH;
  protected readonly left = LEFT;
  protected readonly right = RIGHT;
  protected readonly cells = computed(() => coverageCells(this.coverage().months, LEFT, WIDTH - RIGHT));
  protected readonly summary = computed(() => {
    const coverage = this.coverage();
    const withData = coverage.months.filter((month) => month.pointCount > 0).length;
    if (coverage.first === null || coverage.last === null) {
      return coverage.chartCount > 0 ? `No points in the series yet; ${coverage.chartCount} charts are in the archive.` : 'Nothing is recorded for this station yet.';
    }
    return `${coverage.pointCount.toLocaleString('en')} points in ${withData} ${withData === 1 ? 'month' : 'months'}, ${coverage.first.slice(0, 10)} to ${coverage.last.slice(0, 10)}, from ${coverage.chartCount} charts · series version ${coverage.version}`;
  });
}
