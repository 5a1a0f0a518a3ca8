import { ChangeDetectionStrategy, Component, inject } from '@angular/core';
import { MatButtonModule } from '@angular/material/button';
import { MatIconModule } from '@angular/material/icon';

import { BenchState } from '../bench-state';

/** The Ink step: knots are clicked along the pen line; this shows their count and undoes the last one. */
@Component({
  selector: 'isl-ink-step',
  imports: [MatButtonModule, MatIconModule],
  template: `
    <section aria-labelledby="ink-heading">
      <h2 id="ink-heading" class="heading">Ink</h2>
      <p class="isl-muted">Click along the pen line from left to right; each click places a knot.</p>
      <p class="count"><span class="swatch"></span><span data-testid="knot-count" [attr.data-count]="state.knotCount()">{{ state.knotCount() }}</span> knots</p>
      <button mat-stroked-button type="button" (click)="undoKnot()" [disabled]="state.knotCount() === 0" data-testid="undo-knot">
        <mat-icon>undo</mat-icon>
        Undo last knot
      </button>
    </section>
  `,
  styles: `
    .heading { font: var(--mat-sys-title-medium); margin: 0 0 4px; }
    .count { display: flex; align-items: center; gap: 6px; font: var(--mat-sys-body-medium); }
    .swatch { width: 18px; height: 3px; border-radius: 2px; background: var(--isl-ink-cyan); }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class InkStep {
  protected readonly state = inject(BenchState);

  protected undoKnot(): void {
    this.state.undoKnot();
  }
}
