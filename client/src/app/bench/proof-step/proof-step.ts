import { ChangeDetectionStrategy, Component, computed, inject, input } from '@angular/core';
import type { SeriesPoint } from '@shared/api/series';
import type { ChartForm } from '@shared/domain/chart-form';
import type { PipelineResult } from '@shared/domain/pipeline/digitize-line';
import { digitizeWork } from '@shared/domain/pipeline/digitize-work';
import { RegistrationError } from '@shared/domain/registration';

import { PressurePlot } from '../../shared/pressure-plot/pressure-plot';
import { BenchState } from '../bench-state';
import { proofChecklist } from './proof-checklist';

/**
 * The Proof step: the corrected series the work gives, read through the same shared pipeline the server runs at
 * hand-in (the server recomputes; these numbers are only shown), with a checklist of specific warnings.
 */
@Component({
  selector: 'isl-proof-step',
  imports: [PressurePlot],
  template: `
    <section aria-labelledby="proof-heading" data-testid="proof-checklist">
      <h2 id="proof-heading" class="heading">Proof</h2>
      @if (proof(); as proof) {
        @if (proof.problem) {
          <p class="isl-inline-error" role="alert">{{ proof.problem }}</p>
        } @else {
          <ul class="checklist">
            @for (item of proof.items; track $index) {
              <li [class.is-warning]="item.isWarning" data-testid="proof-item" [attr.data-warning]="item.isWarning">{{ item.isWarning ? '⚠ ' : '✓ ' }}{{ item.text }}</li>
            }
          </ul>
          @if (proof.points.length > 1) {
            <isl-pressure-plot class="plot" [points]="proof.points" aria-label="Corrected series of this chart" data-testid="proof-plot" />
          }
        }
      }
    </section>
  `,
  styles: `
    .heading { font: var(--mat-sys-title-medium); margin: 0 0 4px; }
    .checklist { margin: 0 0 8px; padding-left: 4px; list-style: none; font: var(--mat-sys-body-medium); }
    .is-warning { color: var(--mat-sys-error); }
    .plot { display: block; width: 100%; }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class ProofStep {
  private readonly state = inject(BenchState);
  readonly form = input.required<ChartForm | null>();
  /** The scan's chart start, ISO 8601. */
  readonly chartStart = input.required<string | null>();

  protected readonly proof = computed(() => {
    const form = this.form();
    const chartStart = this.chartStart();
    const work = this.state.work();
    if (!form || !chartStart) return { problem: 'The chart form or chart start of this scan is not known yet.', items: [], points: [] };
    if (work.pins.length < 3 || work.knots.length < 2) return { problem: 'Proof needs at least three pins and two knots.', items: [], points: [] };
    let result: PipelineResult;
    try {
      result = digitizeWork(form, Date.parse(chartStart), work);
    } catch (error) {
      if (error instanceof RegistrationError) return { problem: `The pins do not register the chart: ${error.message}.`, items: [], points: [] };
      throw error;
    }
    const points: SeriesPoint[] = result.series.flatMap((p) =>
      p.pressureHpa === null ? [] : [{ time: new Date(p.timeMs).toISOString(), pressureHpa: p.pressureHpa, flag: p.flag, uncertaintyHpa: p.uncertaintyHpa, inkLineId: '' }],
    );
    return { problem: null, items: proofChecklist(work, result), points };
  });
}
