import { DecimalPipe } from '@angular/common';
import { ChangeDetectionStrategy, Component, effect, ElementRef, inject, input, viewChild } from '@angular/core';
import { AbstractControl, NonNullableFormBuilder, ReactiveFormsModule, ValidationErrors, Validators } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatInputModule } from '@angular/material/input';
import type { PressureUnit } from '@shared/domain/pressure-units';

import { normalizeInstant } from '@shared/api/parse-instant';
import { BenchState } from '../bench-state';

function utcInstantValidator(control: AbstractControl<string>): ValidationErrors | null {
  return control.value === '' || normalizeInstant(control.value) !== null ? null : { utcInstant: true };
}

/** The Pin step: type the time and pressure printed at the crossing just clicked; the pins so far, with delete. */
@Component({
  selector: 'isl-pin-step',
  imports: [DecimalPipe, ReactiveFormsModule, MatFormFieldModule, MatInputModule, MatButtonModule, MatIconModule],
  templateUrl: './pin-step.html',
  styleUrl: './pin-step.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class PinStep {
  protected readonly state = inject(BenchState);

  /** The chart form's printed unit, the unit pins are typed in. */
  readonly pressureUnit = input.required<PressureUnit>();

  private readonly timeInput = viewChild<ElementRef<HTMLInputElement>>('timeInput');

  constructor() {
    // Focus goes to the time field as soon as a crossing is picked, so the volunteer types at once; Enter saves.
    effect(() => {
      if (this.state.pendingPin()) this.timeInput()?.nativeElement.focus();
    });
  }

  protected readonly form = inject(NonNullableFormBuilder).group({
    time: ['', [Validators.required, utcInstantValidator]],
    pressure: ['', [Validators.required, Validators.pattern(/^-?\d+(\.\d+)?$/)]],
  });

  protected savePin(): void {
    const time = normalizeInstant(this.form.controls.time.value);
    const pressure = Number(this.form.controls.pressure.value);
    if (this.form.invalid || time === null || !Number.isFinite(pressure)) {
      this.form.markAllAsTouched();
      return;
    }
    this.state.savePin(time, pressure);
    // The time usually changes between crossings, the pressure line less often; keep both to edit.
    this.form.markAsUntouched();
  }

  protected deletePin(index: number): void {
    this.state.deletePin(index);
  }

  protected cancelPin(): void {
    this.state.cancelPin();
  }
}
