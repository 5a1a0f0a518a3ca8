import { ChangeDetectionStrategy, Component, DestroyRef, inject, input, OnInit, signal } from '@angular/core';
import { takeUntilDestroyed } from '@angular/core/rxjs-interop';
import { AbstractControl, NonNullableFormBuilder, ReactiveFormsModule, ValidationErrors, Validators } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatInputModule } from '@angular/material/input';
import { MatSelectModule } from '@angular/material/select';
import { Router, RouterLink } from '@angular/router';
import { MAX_LESSON_DAYS } from '@shared/api/lessons';

import { StationsApi } from '../../core/api/stations-api';
import { ApiError } from '../../core/http/api-error';
import { normalizeInstant } from '@shared/api/parse-instant';
import { LessonsApi } from '../lessons-api';
import { loadSelectOptions } from '../../shared/select-options/select-options';
import { SelectOptionsFailure } from '../../shared/select-options/select-options-failure';

function instantValidator(control: AbstractControl<string>): ValidationErrors | null {
  return normalizeInstant(control.value) === null ? { instant: true } : null;
}

/** The passage's problem, if any: from must come before to, and the span is at most MAX_LESSON_DAYS. */
export function passageProblem(from: string, to: string): string | null {
  const fromIso = normalizeInstant(from);
  const toIso = normalizeInstant(to);
  if (fromIso === null || toIso === null) return null;
  const spanMs = Date.parse(toIso) - Date.parse(fromIso);
  if (spanMs <= 0) return 'The end comes before the start.';
  if (spanMs > MAX_LESSON_DAYS * 86_400_000) return `A passage is at most ${MAX_LESSON_DAYS} days.`;
  return null;
}

/**
 * Starts a lesson: a title, audience and description, a station and a passage (UTC instants). The Series page
 * links here with `stationId`, `from` and `to` filled in from its chosen range.
 */
@Component({
  selector: 'isl-new-lesson',
  imports: [SelectOptionsFailure, ReactiveFormsModule, MatFormFieldModule, MatInputModule, MatSelectModule, MatButtonModule, RouterLink],
  templateUrl: './new-lesson.html',
  styles: `.form { display: flex; flex-direction: column; gap: 12px; max-width: 640px; }`,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class NewLesson implements OnInit {
  private readonly lessonsApi = inject(LessonsApi);
  private readonly router = inject(Router);
  private readonly destroyRef = inject(DestroyRef);

  /** Query parameters (withComponentInputBinding). */
  readonly stationId = input<string | undefined>(undefined);
  readonly from = input<string | undefined>(undefined);
  readonly to = input<string | undefined>(undefined);

  protected readonly stationOptions = loadSelectOptions(inject(StationsApi).listForSelect(), 'The stations');
  protected readonly stations = this.stationOptions.items;
  protected readonly form = inject(NonNullableFormBuilder).group({
    title: ['', [Validators.required, Validators.maxLength(200)]],
    audience: ['', Validators.maxLength(200)],
    description: ['', Validators.maxLength(4000)],
    stationId: ['', Validators.required],
    from: ['', [Validators.required, instantValidator]],
    to: ['', [Validators.required, instantValidator]],
  });
  protected readonly failure = signal<string | null>(null);
  protected readonly isSaving = signal(false);
  protected readonly passageProblem = signal<string | null>(null);

  ngOnInit(): void {
    this.form.patchValue({ stationId: this.stationId() ?? '', from: this.from() ?? '', to: this.to() ?? '' });
  }

  protected createLesson(): void {
    const value = this.form.getRawValue();
    this.passageProblem.set(passageProblem(value.from, value.to));
    if (this.form.invalid || this.passageProblem() !== null) {
      this.form.markAllAsTouched();
      return;
    }
    this.isSaving.set(true);
    this.failure.set(null);
    this.lessonsApi
      .create({ ...value, from: normalizeInstant(value.from) as string, to: normalizeInstant(value.to) as string })
      .pipe(takeUntilDestroyed(this.destroyRef))
      .subscribe({
        next: (lesson) => void this.router.navigate(['/lessons', lesson.id]),
        error: (error: unknown) => {
          this.isSaving.set(false);
          this.failure.set(error instanceof ApiError ? [error.message, ...Object.values(error.details)].join(' ') : 'The lesson could not be started.');
        },
      });
  }
}
