import { ChangeDetectionStrategy, Component, computed, DestroyRef, effect, inject, input, signal } from '@angular/core';
import { takeUntilDestroyed, toObservable, toSignal } from '@angular/core/rxjs-interop';
import { NonNullableFormBuilder, ReactiveFormsModule, Validators } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatInputModule } from '@angular/material/input';
import { MatSelectModule } from '@angular/material/select';
import { Router, RouterLink } from '@angular/router';
import type { ChartFormSummary } from '@shared/api/chart-forms';
import { checkChartForm } from '@shared/domain/chart-form';
import { PRESSURE_UNITS } from '@shared/domain/pressure-units';
import { catchError, map, of, startWith, switchMap } from 'rxjs';

import { ChartFormsApi } from '../../core/api/chart-forms-api';
import { ApiError } from '../../core/http/api-error';
import { ChartGridDrawing } from '../../shared/chart-grid-drawing/chart-grid-drawing';
import { chartFormOf, MAX_PREVIEW_LINES, NEW_FORM_VALUES, previewLineCount, valuesOfChartForm } from './chart-form-values';
import { RegisterChangeLog } from '../register-change-log/register-change-log';
import { SavedNotice } from '../../shared/saved-notice/saved-notice';

/**
 * One chart form: its numbers and, beside them, the printed grid drawn from those numbers as you type.
 * A form that scans already use is shown read-only (changing it would move their readings).
 */
@Component({
  selector: 'isl-chart-form-page',
  imports: [ReactiveFormsModule, RouterLink, MatButtonModule, MatFormFieldModule, MatIconModule, MatInputModule, MatSelectModule, ChartGridDrawing, RegisterChangeLog],
  templateUrl: './chart-form-page.html',
  styleUrl: './chart-form-page.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class ChartFormPage {
  private readonly api = inject(ChartFormsApi);
  private readonly savedNotice = inject(SavedNotice);
  private readonly router = inject(Router);
  private readonly destroyRef = inject(DestroyRef);

  /** From the route parameter; absent on /chart-forms/new. */
  readonly chartFormId = input<string | undefined>(undefined);
  /** Query parameter on /chart-forms/new: start from this form's numbers. */
  readonly copyOf = input<string | undefined>(undefined);

  protected readonly units = PRESSURE_UNITS;
  protected readonly form = inject(NonNullableFormBuilder).group({
    name: ['', [Validators.required, Validators.maxLength(200)]],
    pressureUnit: NEW_FORM_VALUES.pressureUnit,
    pressureMin: [''],
    pressureMax: [''],
    drumHours: [''],
    mmPerHour: [''],
    mmPerUnit: [''],
    penArmRadiusMm: [''],
    pivotPressure: [''],
    arcSide: NEW_FORM_VALUES.arcSide,
    gridPressureStep: [''],
    labelPressureStep: [''],
    gridHoursStep: [''],
    labelHoursStep: [''],
  });
  private readonly loaded = toSignal(
    toObservable(this.chartFormId).pipe(
      switchMap((id) =>
        id
          ? this.api.get(id).pipe(
              map((chartForm) => ({ chartForm, failure: null as string | null })),
              catchError((error: unknown) => of({ chartForm: null, failure: error instanceof ApiError ? error.message : 'The chart form could not be loaded.' })),
            )
          : of({ chartForm: null, failure: null }),
      ),
    ),
  );
  private readonly template = toSignal(
    toObservable(this.copyOf).pipe(switchMap((id) => (id && this.chartFormId() === undefined ? this.api.get(id).pipe(catchError(() => of(null))) : of(null)))),
  );
  protected readonly saved = signal<ChartFormSummary | null>(null);
  protected readonly chartForm = computed(() => this.saved() ?? this.loaded()?.chartForm ?? null);
  protected readonly loadFailure = computed(() => this.loaded()?.failure ?? null);
  protected readonly isLocked = computed(() => (this.chartForm()?.scanCount ?? 0) > 0);
  private readonly values = toSignal(this.form.valueChanges.pipe(startWith(null), map(() => this.form.getRawValue())), { initialValue: this.form.getRawValue() });
  protected readonly candidate = computed(() => chartFormOf(this.values()));
  protected readonly problems = computed(() => checkChartForm(this.candidate()));
  protected readonly preview = computed(() => {
    const candidate = this.candidate();
    if (Object.keys(this.problems()).length > 0 || previewLineCount(candidate) > MAX_PREVIEW_LINES) return null;
    return candidate;
  });
  protected readonly isSaving = signal(false);
  protected readonly serverProblem = signal<{ message: string; details: Record<string, string> } | null>(null);

  constructor() {
    effect(() => {
      const chartForm = this.chartForm();
      const isNew = this.chartFormId() === undefined;
      const template = this.template() ?? null;
      if (chartForm) this.form.reset(valuesOfChartForm(chartForm));
      else if (isNew && template) this.form.reset({ ...valuesOfChartForm(template), name: `${template.name} (copy)` });
      else if (isNew) this.form.reset(NEW_FORM_VALUES);
    });
    effect(() => {
      if (this.isLocked()) this.form.disable({ emitEvent: false });
      else this.form.enable({ emitEvent: false });
    });
  }

  protected problemFor(field: string): string | null {
    return this.problems()[field] ?? this.serverProblem()?.details[field] ?? null;
  }

  protected save(): void {
    if (this.form.invalid || Object.keys(this.problems()).length > 0) {
      this.form.markAllAsTouched();
      return;
    }
    const candidate = this.candidate();
    const existing = this.chartForm();
    const request = existing ? this.api.update(existing.id, { ...candidate, version: existing.version }) : this.api.create(candidate);
    this.isSaving.set(true);
    this.serverProblem.set(null);
    request.pipe(takeUntilDestroyed(this.destroyRef)).subscribe({
      next: (saved) => {
        this.isSaving.set(false);
        this.saved.set(saved);
        this.savedNotice.show(`Chart form ${saved.name} saved.`);
        if (!existing) void this.router.navigate(['/archive/chart-forms', saved.id]);
      },
      error: (error: unknown) => {
        this.isSaving.set(false);
        const message =
          error instanceof ApiError && error.code === 'version_conflict'
            ? 'Someone else changed this chart form after you opened it. Reload the page to see their version.'
            : error instanceof ApiError
              ? error.message
              : 'The chart form could not be saved.';
        this.serverProblem.set({ message, details: error instanceof ApiError ? error.details : {} });
      },
    });
  }

  /** A used form cannot change; start a new one from its numbers instead. */
  protected copyAsNew(): void {
    const chartForm = this.chartForm();
    if (chartForm) void this.router.navigate(['/archive/chart-forms/new'], { queryParams: { copyOf: chartForm.id } });
  }
}
