import { DecimalPipe } from '@angular/common';
import { ChangeDetectionStrategy, Component, input } from '@angular/core';
import type { InkLineSaved } from '@shared/api/ink-lines';

/** What the server made of a handed-in trace: the registration's fit, each pin residual and the series size. */
@Component({
  selector: 'isl-hand-in-result',
  imports: [DecimalPipe],
  templateUrl: './hand-in-result.html',
  styleUrl: './hand-in-result.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class HandInResult {
  readonly saved = input.required<InkLineSaved>();
}
