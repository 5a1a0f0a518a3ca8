import { DatePipe, DecimalPipe } from '@angular/common';
import { ChangeDetectionStrategy, Component, computed, input } from '@angular/core';
import { clockInWords, instrumentInWords } from '@shared/api/correction-words';
import type { ReviewCorrections as Corrections } from '@shared/api/review';

const MARK_KIND_WORDS = { time_mark: 'time mark', chart_on: 'chart on', chart_off: 'chart off' } as const;

/**
 * The corrections a handed-in line had applied, said in plain words as the Proof step says them, with each
 * mark's and check reading's residual, so the archivist can see what moved the line and how well it held.
 */
@Component({
  selector: 'isl-review-corrections',
  imports: [DatePipe, DecimalPipe],
  templateUrl: './review-corrections.html',
  styles: `
    table td, table th { padding: 2px 8px; text-align: right; }
    table td:first-child, table th:first-child { text-align: left; }
    .left-out { color: var(--mat-sys-error); }
    /* The words are shared with the Proof checklist, which writes them in lower case. */
    p::first-letter { text-transform: uppercase; }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class ReviewCorrections {
  readonly corrections = input.required<Corrections>();

  protected readonly markKindWords = MARK_KIND_WORDS;
  protected readonly clockWords = computed(() => {
    const clock = this.corrections().clock;
    return clock ? clockInWords(clock) : null;
  });
  protected readonly instrumentWords = computed(() => {
    const instrument = this.corrections().instrument;
    return instrument ? instrumentInWords(instrument) : null;
  });
  /** Check readings the instrument fit could not use, and why. */
  protected readonly unusedReadings = computed(() =>
    this.corrections().checkReadingUses.flatMap((use, index) =>
      use === 'used' ? [] : [`check reading ${index + 1} ${use === 'outlier' ? 'left out: contradicts the others' : 'is not on traced ink'}`],
    ),
  );
}
