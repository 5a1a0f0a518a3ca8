import { DecimalPipe } from '@angular/common';
import { ChangeDetectionStrategy, Component, computed, effect, ElementRef, inject, input, untracked, viewChild } from '@angular/core';
import { toSignal } from '@angular/core/rxjs-interop';
import { AbstractControl, NonNullableFormBuilder, ReactiveFormsModule, ValidationErrors, Validators } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatInputModule } from '@angular/material/input';
import { MatSlideToggleModule } from '@angular/material/slide-toggle';
import type { ChartForm } from '@shared/domain/chart-form';
import type { PinsCheck } from '@shared/domain/pin-check';
import { prefillPin, stepPressureLine, stepTimeLine } from '@shared/domain/pin-prefill';
import type { PressureUnit } from '@shared/domain/pressure-units';
import type { StationTimeStandard } from '@shared/domain/station-time';

import { normalizeInstant, parseInstantMs } from '@shared/api/parse-instant';
import { BenchState } from '../bench-state';
import { toRegistrationPins } from '../registration-pins';
import { PinTimeLines, type StationClock } from './pin-time-lines';

const HOUR_MS = 3_600_000;

function utcInstantValidator(control: AbstractControl<string>): ValidationErrors | null {
  return control.value === '' || normalizeInstant(control.value) !== null ? null : { utcInstant: true };
}

/** An instant in the form the time field takes: "2026-05-05 00:00". */
function typedUtc(ms: number): string {
  const iso = new Date(ms).toISOString();
  return `${iso.slice(0, 10)} ${iso.slice(11, 16)}`;
}

/** "+0.2", "−3": a residual with its sign, for the pin list. */
function signed(value: number, digits: number): string {
  const text = Math.abs(value).toFixed(digits);
  if (Number(text) === 0) return (0).toFixed(digits);
  return `${value > 0 ? '+' : '−'}${text}`;
}

/** What the Pin step needs of the scan to read a click: its size, dpi and chart start. */
export interface PinScan {
  widthPx: number;
  heightPx: number;
  dpi: number | null;
  chartStart: string | null;
}

/**
 * The Pin step: after a click on a printed crossing, the time and pressure come pre-filled from the nearest
 * printed lines (read through the pins so far); the volunteer checks them, steps them with the arrow keys or
 * picks a nearby time line, or types over them, and Enter saves. The pins so far, with delete.
 */
@Component({
  selector: 'isl-pin-step',
  imports: [DecimalPipe, ReactiveFormsModule, MatFormFieldModule, MatInputModule, MatButtonModule, MatIconModule, MatSlideToggleModule, PinTimeLines],
  templateUrl: './pin-step.html',
  styleUrl: './pin-step.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class PinStep {
  protected readonly state = inject(BenchState);

  /** The chart form's printed unit, the unit pins are typed in. */
  readonly pressureUnit = input.required<PressureUnit>();
  /** The scan's chart form; without it nothing can be pre-filled. */
  readonly form = input<ChartForm | null>(null);
  readonly scan = input<PinScan | null>(null);
  /** The station's zone and time standard, for showing the time lines as its observers read them. */
  readonly clock = input<StationClock>({ timeZone: 'UTC', timeStandard: 'utc' as StationTimeStandard });

  /** The live check of the pins against the grid fitted to them (residuals, outliers). */
  readonly check = input<PinsCheck>({ kind: 'too_few' });

  private readonly timeInput = viewChild<ElementRef<HTMLInputElement>>('timeInput');

  protected readonly entry = inject(NonNullableFormBuilder).group({
    time: ['', [Validators.required, utcInstantValidator]],
    pressure: ['', [Validators.required, Validators.pattern(/^-?\d+(\.\d+)?$/)]],
  });
  private readonly typedTime = toSignal(this.entry.controls.time.valueChanges, { initialValue: '' });

  private readonly chartStartMs = computed(() => {
    const chartStart = this.scan()?.chartStart;
    return chartStart ? Date.parse(chartStart) : null;
  });

  /** The reading pre-filled for the picked crossing; null without a crossing, a form or a scan. */
  protected readonly prefill = computed(() => {
    const crossing = this.state.pendingPin();
    const form = this.form();
    const scan = this.scan();
    const chartStartMs = this.chartStartMs();
    if (!crossing || !form || !scan || chartStartMs === null) return null;
    const pins = toRegistrationPins(this.state.pins(), chartStartMs);
    return prefillPin({ form, scanWidthPx: scan.widthPx, scanHeightPx: scan.heightPx, dpi: scan.dpi, pins, click: crossing });
  });

  /** The printed time lines near the click, as instants (epoch ms), for the list. */
  protected readonly nearbyLinesMs = computed(() => {
    const prefill = this.prefill();
    const chartStartMs = this.chartStartMs();
    return prefill && chartStartMs !== null ? prefill.nearbyHours.map((hours) => chartStartMs + hours * HOUR_MS) : [];
  });
  /** Each pin's residual as shown beside it ("+0.2 hPa · −3 min"), and whether it is off the others. */
  protected readonly pinResiduals = computed(() => {
    const check = this.check();
    if (check.kind !== 'fitted') return [];
    return check.pins.map((pin) => ({ text: `${signed(pin.pressureHpa, 1)} hPa · ${signed(pin.minutes, 0)} min`, isOutlier: pin.isOutlier }));
  });

  protected readonly checkProblem = computed(() => {
    const check = this.check();
    return check.kind === 'problem' ? check.message : null;
  });

  /** The instant in the time field, or null while it does not read as one. */
  protected readonly chosenMs = computed(() => parseInstantMs(this.typedTime()));

  constructor() {
    // A new crossing: fill in the nearest printed lines, so that Enter accepts them and typing replaces them.
    effect(() => {
      const prefill = this.prefill();
      if (!this.state.pendingPin()) return;
      untracked(() => {
        const chartStartMs = this.chartStartMs();
        if (prefill && chartStartMs !== null) {
          this.entry.setValue({ time: typedUtc(chartStartMs + prefill.hours * HOUR_MS), pressure: String(prefill.pressure) });
        }
      });
    });
    // The field appears with the crossing (and is found a render later): focus it then, its text selected.
    effect(() => {
      const field = this.timeInput()?.nativeElement;
      if (!field || !this.state.pendingPin()) return;
      field.focus();
      field.select();
    });
  }

  /** Arrow keys step the time by one printed time line, Page Up / Page Down by a day. */
  protected stepTime(event: KeyboardEvent): void {
    const form = this.form();
    const chartStartMs = this.chartStartMs();
    const chosenMs = this.chosenMs();
    const steps = { ArrowUp: 1, ArrowDown: -1, PageUp: 0, PageDown: 0 }[event.key];
    if (steps === undefined || !form || chartStartMs === null || chosenMs === null) return;
    event.preventDefault();
    const lines = steps !== 0 ? steps : (event.key === 'PageUp' ? 1 : -1) * Math.max(1, Math.round(24 / form.gridHoursStep));
    this.chooseTime(chartStartMs + stepTimeLine(form, (chosenMs - chartStartMs) / HOUR_MS, lines) * HOUR_MS);
  }

  /** Arrow keys step the pressure by one printed pressure line. */
  protected stepPressure(event: KeyboardEvent): void {
    const form = this.form();
    const pressure = Number(this.entry.controls.pressure.value);
    const steps = { ArrowUp: 1, ArrowDown: -1 }[event.key];
    if (steps === undefined || !form || this.entry.controls.pressure.value === '' || !Number.isFinite(pressure)) return;
    event.preventDefault();
    this.entry.controls.pressure.setValue(String(stepPressureLine(form, pressure, steps)));
  }

  protected chooseTime(ms: number): void {
    this.entry.controls.time.setValue(typedUtc(ms));
  }

  protected savePin(): void {
    const time = normalizeInstant(this.entry.controls.time.value);
    const pressure = Number(this.entry.controls.pressure.value);
    if (this.entry.invalid || time === null || !Number.isFinite(pressure)) {
      this.entry.markAllAsTouched();
      return;
    }
    this.state.savePin(time, pressure);
    this.entry.markAsUntouched();
  }

  protected deletePin(index: number): void {
    this.state.deletePin(index);
  }

  protected cancelPin(): void {
    this.state.cancelPin();
  }
}
