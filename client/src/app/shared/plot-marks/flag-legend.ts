import { ChangeDetectionStrategy, Component, computed, input } from '@angular/core';
import type { SeriesFlag } from '@shared/api/series';
import { SERIES_FLAG_MEANINGS, SERIES_FLAG_WORDS } from '@shared/api/series-flag-words';

import { gapBracketPath } from './gap-brackets';
import { flagMarkPath, MARKED_FLAGS, type MarkedFlag } from './flag-marks';

interface LegendEntry {
  key: string;
  word: string;
  meaning: string;
  kind: 'line' | 'band' | 'gap' | MarkedFlag;
  /** The swatch's path data for a flag mark. */
  path: string;
}

/** The legend's swatches, drawn with the same marks as the plot (16 × 12 units each). */
const MARK_PATHS: Record<MarkedFlag, string> = {
  interpolated: flagMarkPath('interpolated', 8, 6, 3.5),
  suspect: flagMarkPath('suspect', 8, 6, 3.5),
  off_scale: flagMarkPath('off_scale', 8, 6, 3.5),
};
const GAP_PATH = gapBracketPath({ x: -1, y: 6 }, { x: 17, y: 6 }, 0.7);

/** What the plot's line, band, gap brackets and flag marks mean, in words. */
@Component({
  selector: 'isl-flag-legend',
  template: `
    <ul class="legend" data-testid="flag-legend" aria-label="Legend">
      @for (entry of entries(); track entry.key) {
        <li class="entry" [attr.data-flag]="entry.key" [title]="entry.meaning">
          <svg class="swatch" viewBox="0 0 16 12" aria-hidden="true">
            @switch (entry.kind) {
              @case ('line') { <path class="line" d="M0,8 L5,4 L10,7 L16,3" /> }
              @case ('band') { <rect class="band" x="0" y="2" width="16" height="8" /> }
              @case ('gap') { <path class="gap" [attr.d]="gapPath" /> }
              @default { <path [class]="'flag flag-' + entry.kind" [attr.d]="entry.path" /> }
            }
          </svg>
          {{ entry.word }}
        </li>
      }
    </ul>
  `,
  styles: `
    @use '../plot-marks/plot-marks' as marks;
    @include marks.plot-marks;
    .legend { display: flex; flex-wrap: wrap; gap: 4px 16px; list-style: none; margin: 4px 0 0; padding: 0; font: var(--mat-sys-body-small); color: var(--mat-sys-on-surface-variant); }
    .entry { display: inline-flex; align-items: center; gap: 6px; }
    .swatch { width: 20px; height: 15px; overflow: visible; }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class FlagLegend {
  /** The flags to explain (the plot passes the ones it shows); the line is always explained. */
  readonly flags = input<readonly SeriesFlag[]>(['interpolated', 'suspect', 'off_scale', 'gap']);
  /** Whether the plot draws an uncertainty band. */
  readonly hasBand = input(true);

  protected readonly gapPath = GAP_PATH;

  protected readonly entries = computed((): LegendEntry[] => {
    const entries: LegendEntry[] = [{ key: 'line', word: 'station pressure', meaning: 'the corrected station series', kind: 'line', path: '' }];
    if (this.hasBand()) entries.push({ key: 'band', word: '± one standard uncertainty', meaning: 'the band of one standard uncertainty around the line', kind: 'band', path: '' });
    for (const flag of MARKED_FLAGS) {
      if (this.flags().includes(flag)) entries.push({ key: flag, word: SERIES_FLAG_WORDS[flag], meaning: SERIES_FLAG_MEANINGS[flag], kind: flag, path: MARK_PATHS[flag] });
    }
    if (this.flags().includes('gap')) entries.push({ key: 'gap', word: SERIES_FLAG_WORDS.gap, meaning: SERIES_FLAG_MEANINGS.gap, kind: 'gap', path: '' });
    return entries;
  });
}
