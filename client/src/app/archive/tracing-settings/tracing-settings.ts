import { ChangeDetectionStrategy, Component, DestroyRef, effect, inject, input, signal } from '@angular/core';
import { takeUntilDestroyed } from '@angular/core/rxjs-interop';
import { FormsModule } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatInputModule } from '@angular/material/input';
import { MatSelectModule } from '@angular/material/select';
import type { TracePriorityInput } from '@shared/api/desk';

import { ApiError } from '../../core/http/api-error';
import { TracingApi } from '../tracing-api';

/**
 * A station's tracing setting (one line per chart, or two for a cross-trace) and a queue priority for the station,
 * or, on a scan page, for the scan and its box. Priorities are higher first; charts of equal priority go oldest first.
 */
@Component({
  selector: 'isl-tracing-settings',
  imports: [FormsModule, MatButtonModule, MatFormFieldModule, MatInputModule, MatSelectModule],
  template: `
    <div class="settings" data-testid="tracing-settings">
      @if (scope() === 'station') {
        <mat-form-field>
          <mat-label>Ink lines per chart</mat-label>
          <mat-select [value]="inkLinesRequired()" (valueChange)="saveInkLinesRequired($event)" data-testid="tracing-lines-required">
            <mat-option [value]="1">One</mat-option>
            <mat-option [value]="2">Two (cross-trace)</mat-option>
          </mat-select>
        </mat-form-field>
      }
      <div class="priority">
        <mat-form-field>
          <mat-label>Queue priority ({{ scope() === 'station' ? 'station' : 'this scan' }})</mat-label>
          <input matInput type="number" min="-100" max="100" step="1" [ngModel]="priority()" (ngModelChange)="priority.set($event)" data-testid="tracing-priority" />
        </mat-form-field>
        <button mat-stroked-button type="button" (click)="savePriority(scope())" data-testid="tracing-priority-save">Set</button>
        @if (scope() === 'scan' && box()) {
          <button mat-stroked-button type="button" (click)="savePriority('box')" data-testid="tracing-box-priority-save">Set for box {{ box() }}</button>
        }
      </div>
      @if (message(); as message) {
        <p class="isl-muted" role="status">{{ message }}</p>
      }
    </div>
  `,
  styles: `
    .settings { display: flex; flex-direction: column; gap: 4px; padding-top: 12px; }
    .priority { display: flex; flex-wrap: wrap; align-items: baseline; gap: 8px; }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class TracingSettings {
  private readonly tracingApi = inject(TracingApi);
  private readonly destroyRef = inject(DestroyRef);

  readonly scope = input<'station' | 'scan'>('station');
  readonly stationId = input<string | null>(null);
  readonly scanId = input<string | null>(null);
  readonly collection = input('');
  readonly box = input('');

  protected readonly inkLinesRequired = signal<1 | 2>(1);
  protected readonly priority = signal(0);
  protected readonly message = signal<string | null>(null);

  constructor() {
    effect(() => {
      const stationId = this.stationId();
      if (this.scope() !== 'station' || !stationId) return;
      this.tracingApi
        .stationTracing(stationId)
        .pipe(takeUntilDestroyed(this.destroyRef))
        .subscribe({ next: (setting) => this.inkLinesRequired.set(setting.inkLinesRequired), error: (error: unknown) => this.fail(error) });
    });
  }

  protected saveInkLinesRequired(value: 1 | 2): void {
    const stationId = this.stationId();
    if (!stationId) return;
    this.tracingApi
      .setStationTracing(stationId, value)
      .pipe(takeUntilDestroyed(this.destroyRef))
      .subscribe({
        next: (setting) => {
          this.inkLinesRequired.set(setting.inkLinesRequired);
          this.message.set(setting.inkLinesRequired === 2 ? 'Each chart now needs two independent lines.' : 'Each chart now needs one line.');
        },
        error: (error: unknown) => this.fail(error),
      });
  }

  protected savePriority(scope: 'station' | 'scan' | 'box'): void {
    const input: TracePriorityInput =
      scope === 'station'
        ? { scope, stationId: this.stationId() ?? undefined, priority: Number(this.priority()) }
        : scope === 'scan'
          ? { scope, scanId: this.scanId() ?? undefined, priority: Number(this.priority()) }
          : { scope, collection: this.collection(), box: this.box(), priority: Number(this.priority()) };
    this.tracingApi
      .setPriority(input)
      .pipe(takeUntilDestroyed(this.destroyRef))
      .subscribe({ next: (saved) => this.message.set(`Queue priority ${saved.priority} set.`), error: (error: unknown) => this.fail(error) });
  }

  private fail(error: unknown): void {
    this.message.set(error instanceof ApiError ? error.message : 'The setting was not saved.');
  }
}
