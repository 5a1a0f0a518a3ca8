import { ChangeDetectionStrategy, Component, effect, inject, input, output } from '@angular/core';
import { AbstractControl, NonNullableFormBuilder, ReactiveFormsModule, ValidationErrors, Validators } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatInputModule } from '@angular/material/input';

import { parseUtcDay } from '../series-range';

function utcDayValidator(control: AbstractControl<string>): ValidationErrors | null {
  return control.value === '' || parseUtcDay(control.value) !== null ? null : { utcDay: true };
}

function orderedDaysValidator(group: AbstractControl): ValidationErrors | null {
  const fromMs = parseUtcDay(group.get('fromDay')?.value ?? '');
  const toMs = parseUtcDay(group.get('toDay')?.value ?? '');
  return fromMs !== null && toMs !== null && toMs < fromMs ? { daysReversed: true } : null;
}

/** Typed UTC days for the detail plot; it shows the plot's range as the brush and zoom move it. */
@Component({
  selector: 'isl-series-range-form',
  imports: [ReactiveFormsModule, MatFormFieldModule, MatInputModule, MatButtonModule],
  template: `
    <form [formGroup]="form" (ngSubmit)="showDays()" class="isl-form-row">
      <mat-form-field subscriptSizing="dynamic" class="day">
        <mat-label>From (UTC day)</mat-label>
        <input matInput formControlName="fromDay" placeholder="2026-03-02" data-testid="series-from" />
        @if (form.controls.fromDay.hasError('utcDay')) {
          <mat-error>YYYY-MM-DD</mat-error>
        }
      </mat-form-field>
      <mat-form-field subscriptSizing="dynamic" class="day">
        <mat-label>To (UTC day, included)</mat-label>
        <input matInput formControlName="toDay" placeholder="2026-03-09" data-testid="series-to" />
        @if (form.controls.toDay.hasError('utcDay')) {
          <mat-error>YYYY-MM-DD</mat-error>
        }
      </mat-form-field>
      <button mat-stroked-button type="submit" data-testid="series-show">Show</button>
      @if (form.hasError('daysReversed')) {
        <span class="isl-inline-error">The last day comes before the first.</span>
      }
    </form>
  `,
  styles: `.day { width: 170px; }`,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class SeriesRangeForm {
  /** The plot's range, epoch ms, shown as its UTC days while the form is not being edited. */
  readonly viewMs = input<readonly [number, number] | null>(null);
  readonly daysChosen = output<{ fromDay: string; toDay: string }>();

  protected readonly form = inject(NonNullableFormBuilder).group(
    { fromDay: ['', [Validators.required, utcDayValidator]], toDay: ['', [Validators.required, utcDayValidator]] },
    { validators: orderedDaysValidator },
  );

  constructor() {
    effect(() => {
      const view = this.viewMs();
      if (!view || this.form.dirty) return;
      this.form.setValue({ fromDay: new Date(view[0]).toISOString().slice(0, 10), toDay: new Date(view[1]).toISOString().slice(0, 10) }, { emitEvent: false });
    });
  }

  protected showDays(): void {
    if (this.form.invalid) {
      this.form.markAllAsTouched();
      return;
    }
    this.daysChosen.emit(this.form.getRawValue());
    this.form.markAsPristine();
  }
}
