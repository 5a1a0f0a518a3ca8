import { DecimalPipe } from '@angular/common';
import { ChangeDetectionStrategy, Component, computed, DestroyRef, inject, input, signal } from '@angular/core';
import { takeUntilDestroyed } from '@angular/core/rxjs-interop';
import { MatButtonModule } from '@angular/material/button';
import { MatIconModule } from '@angular/material/icon';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { FEWEST_PINS as MIN_PINS } from '@shared/domain/registration-model';

import { ApiError } from '../../core/http/api-error';
import { BenchState, type InkTool } from '../bench-state';
import { FollowInkApi } from '../follow-ink-api';
import { LOW_CONFIDENCE } from '../scan-stage/stage-marks';

/**
 * The Ink step: Follow ink finds the pen line from the pins; knots can also be clicked along the line,
 * dragged to correct them and right-clicked to delete them. Lift marks a stretch as no ink, Bridge joins a
 * short skip on purpose. Undo and Redo step through every change.
 */
@Component({
  selector: 'isl-ink-step',
  imports: [DecimalPipe, MatButtonModule, MatIconModule, MatProgressBarModule],
  template: `
    <section aria-labelledby="ink-heading">
      <h2 id="ink-heading" class="heading">Ink</h2>
      <button mat-flat-button type="button" (click)="followInk()" [disabled]="!canFollow()" data-testid="follow-ink">
        <mat-icon>timeline</mat-icon>
        Follow ink
      </button>
      @if (isFollowing()) {
        <mat-progress-bar mode="indeterminate" aria-label="Following the ink" data-testid="follow-ink-progress" />
      }
      @if (state.pins().length < minPins) {
        <p class="isl-muted">Follow ink needs at least {{ minPins }} pins.</p>
      }
      @if (followed(); as followed) {
        <p class="isl-muted" data-testid="follow-ink-result">
          Followed in {{ followed.elapsedMs / 1000 | number: '1.1-1' }} s: {{ followed.knotCount }} knots, {{ followed.doubtfulCount }} doubtful, {{ followed.gapCount }}
          gaps.
        </p>
      }
      @if (problem(); as problem) {
        <p class="isl-inline-error" role="alert" data-testid="follow-ink-problem">{{ problem }}</p>
      }
      <div class="tools" role="group" aria-label="Ink tool">
        @for (tool of tools; track tool.tool) {
          <button
            mat-stroked-button
            type="button"
            [class.is-current]="state.inkTool() === tool.tool"
            [attr.aria-pressed]="state.inkTool() === tool.tool"
            (click)="state.chooseInkTool(tool.tool)"
            [attr.data-testid]="'ink-tool-' + tool.tool"
          >
            <mat-icon>{{ tool.icon }}</mat-icon>
            {{ tool.label }} <span class="key">{{ tool.key }}</span>
          </button>
        }
      </div>
      <p class="isl-muted" data-testid="ink-tool-hint">
        @switch (state.inkTool()) {
          @case ('knot') {
            Click along the pen line to add a knot; drag a knot to correct it; right-click a knot to delete it.
          }
          @case ('lift') {
            Lift: click the knot where the ink stops, then the knot where it starts again. The stretch between is kept as a gap.
          }
          @case ('bridge') {
            Bridge: click the knots either side of a short skip. The stretch is joined, and its values are flagged interpolated.
          }
        }
        @if (state.stretchStart() !== null) {
          <strong data-testid="stretch-start">First end picked (knot {{ state.stretchStart()! + 1 }}); now the other end, or Esc.</strong>
        }
      </p>
      <p class="legend">
        <span class="swatch"></span><span data-testid="knot-count" [attr.data-count]="state.knotCount()">{{ state.knotCount() }}</span> knots
        <span class="swatch is-doubtful"></span> doubtful
        <span class="bracket">[ ]</span> gap
        <span class="swatch is-bridge"></span> bridge
      </p>
      <div class="tools">
        <button mat-stroked-button type="button" (click)="state.undo()" [disabled]="!state.canUndo()" data-testid="undo-knot">
          <mat-icon>undo</mat-icon>
          Undo <span class="key">U</span>
        </button>
        <button mat-stroked-button type="button" (click)="state.redo()" [disabled]="!state.canRedo()" data-testid="redo-knot">
          <mat-icon>redo</mat-icon>
          Redo <span class="key">⇧U</span>
        </button>
      </div>
    </section>
  `,
  styles: `
    .heading { font: var(--mat-sys-title-medium); margin: 0 0 4px; }
    .legend { display: flex; flex-wrap: wrap; align-items: center; gap: 6px; font: var(--mat-sys-body-medium); }
    .swatch { width: 18px; height: 3px; border-radius: 2px; background: var(--isl-ink-cyan); }
    .swatch.is-doubtful { background: repeating-linear-gradient(90deg, hsl(24, 100%, 50%) 0 6px, transparent 6px 9px); }
    .swatch.is-bridge { background: repeating-linear-gradient(90deg, var(--isl-ink-cyan) 0 2px, transparent 2px 5px); }
    .bracket { color: hsl(0, 80%, 48%); font-weight: 700; }
    .tools { display: flex; flex-wrap: wrap; gap: 6px; margin: 8px 0; }
    .tools .is-current { background: var(--mat-sys-secondary-container); color: var(--mat-sys-on-secondary-container); }
    .key { margin-left: 4px; padding: 0 4px; border: 1px solid currentColor; border-radius: 3px; font: var(--mat-sys-label-small); opacity: 0.75; }
    mat-progress-bar { margin: 6px 0; }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class InkStep {
  protected readonly state = inject(BenchState);
  private readonly followInkApi = inject(FollowInkApi);
  private readonly destroyRef = inject(DestroyRef);

  /** The scan on the Bench. */
  readonly scanId = input.required<string>();

  protected readonly minPins = MIN_PINS;
  protected readonly tools: readonly { tool: InkTool; label: string; icon: string; key: string }[] = [
    { tool: 'knot', label: 'Knot', icon: 'add_location', key: 'K' },
    { tool: 'lift', label: 'Lift', icon: 'format_strikethrough', key: 'L' },
    { tool: 'bridge', label: 'Bridge', icon: 'linear_scale', key: 'B' },
  ];
  protected readonly isFollowing = signal(false);
  protected readonly problem = signal<string | null>(null);
  protected readonly followed = signal<{ elapsedMs: number; knotCount: number; doubtfulCount: number; gapCount: number } | null>(null);
  protected readonly canFollow = computed(() => this.state.pins().length >= MIN_PINS && !this.isFollowing());

  /** Follows the ink from the pins (the button, or F from the Bench's shortcuts); does nothing while it cannot. */
  followInk(): void {
    if (!this.canFollow()) return;
    this.problem.set(null);
    this.followed.set(null);
    this.isFollowing.set(true);
    this.followInkApi
      .follow(this.scanId(), { pins: [...this.state.pins()] })
      .pipe(takeUntilDestroyed(this.destroyRef))
      .subscribe({
        next: (result) => {
          this.isFollowing.set(false);
          // Follow ink found no line, or only a small share of the span: say why instead of silently showing it.
          this.problem.set(result.problem ?? null);
          if (result.knots.length === 0) return;
          this.state.replaceWithFollowed(result);
          this.followed.set({
            elapsedMs: result.elapsedMs,
            knotCount: result.knots.length,
            doubtfulCount: result.knots.filter((knot) => knot.confidence < LOW_CONFIDENCE).length,
            // Gaps inside the line (the ones drawn as brackets); the bare ends before chart on and after chart off are not counted.
            gapCount: result.spans.filter((span) => span.kind === 'gap' && span.toIndex === span.fromIndex + 1).length,
          });
        },
        error: (error: unknown) => {
          this.isFollowing.set(false);
          this.problem.set(error instanceof ApiError ? error.message : 'Follow ink failed.');
        },
      });
  }

}
