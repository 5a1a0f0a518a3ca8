import { ChangeDetectionStrategy, Component, DestroyRef, inject, signal } from '@angular/core';
import { takeUntilDestroyed } from '@angular/core/rxjs-interop';
import { AbstractControl, NonNullableFormBuilder, ReactiveFormsModule, ValidationErrors, Validators } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MAT_DIALOG_DATA, MatDialogModule, MatDialogRef } from '@angular/material/dialog';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatInputModule } from '@angular/material/input';
import type { InstrumentInput, InstrumentSummary } from '@shared/api/instruments';

import { StationsApi } from '../../core/api/stations-api';
import { ApiError } from '../../core/http/api-error';
import { parseUtcDay } from '../../series/series-range';
import { SavedNotice } from '../../shared/saved-notice/saved-notice';

export interface InstrumentDialogData {
  stationId: string;
  instrument: InstrumentSummary | null;
}

function dayValidator(control: AbstractControl<string>): ValidationErrors | null {
  return control.value.trim() === '' || parseUtcDay(control.value) !== null ? null : { day: true };
}

/** Removal cannot come before installation. */
function orderValidator(group: AbstractControl): ValidationErrors | null {
  const installed = String(group.get('installedOn')?.value ?? '').trim();
  const removed = String(group.get('removedOn')?.value ?? '').trim();
  return installed && removed && removed < installed ? { order: true } : null;
}

/** Adds or edits one barograph of a station. */
@Component({
  selector: 'isl-instrument-dialog',
  imports: [ReactiveFormsModule, MatDialogModule, MatFormFieldModule, MatInputModule, MatButtonModule],
  template: `
    <h2 mat-dialog-title>{{ data.instrument ? 'Edit instrument ' + data.instrument.serial : 'New instrument' }}</h2>
    <mat-dialog-content>
      <form class="fields" [formGroup]="form" (ngSubmit)="save()" id="instrument-form">
        <mat-form-field class="half">
          <mat-label>Serial</mat-label>
          <input matInput formControlName="serial" data-testid="instrument-serial" />
        </mat-form-field>
        <mat-form-field class="half">
          <mat-label>Maker</mat-label>
          <input matInput formControlName="maker" data-testid="instrument-maker" />
        </mat-form-field>
        <mat-form-field class="half">
          <mat-label>Installed on</mat-label>
          <input matInput formControlName="installedOn" placeholder="YYYY-MM-DD" data-testid="instrument-installed" />
          @if (form.controls.installedOn.hasError('day')) { <mat-error>YYYY-MM-DD</mat-error> }
        </mat-form-field>
        <mat-form-field class="half">
          <mat-label>Removed on</mat-label>
          <input matInput formControlName="removedOn" placeholder="YYYY-MM-DD (empty while in use)" data-testid="instrument-removed" />
          @if (form.controls.removedOn.hasError('day')) { <mat-error>YYYY-MM-DD</mat-error> }
        </mat-form-field>
        @if (form.hasError('order')) {
          <p class="isl-inline-error full">Removed before it was installed?</p>
        }
        <mat-form-field class="full">
          <mat-label>Notes</mat-label>
          <textarea matInput formControlName="notes" rows="3" placeholder="Calibration, repairs, clock…" data-testid="instrument-notes"></textarea>
        </mat-form-field>
      </form>
      @if (problem(); as problem) {
        <p class="isl-inline-error" role="alert">{{ problem }}</p>
      }
    </mat-dialog-content>
    <mat-dialog-actions align="end">
      <button mat-button type="button" mat-dialog-close>Cancel</button>
      <button mat-flat-button type="submit" form="instrument-form" [disabled]="isSaving()" data-testid="instrument-save">Save</button>
    </mat-dialog-actions>
  `,
  styles: `
    .fields { display: flex; flex-wrap: wrap; gap: 12px 8px; align-items: flex-start; padding-top: 8px; }
    .half { flex: 1 1 calc(50% - 8px); min-width: 180px; }
    .full { flex: 1 1 100%; }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class InstrumentDialog {
  private readonly stationsApi = inject(StationsApi);
  private readonly savedNotice = inject(SavedNotice);
  private readonly dialogRef = inject(MatDialogRef<InstrumentDialog, InstrumentSummary>);
  private readonly destroyRef = inject(DestroyRef);
  protected readonly data = inject<InstrumentDialogData>(MAT_DIALOG_DATA);

  protected readonly form = inject(NonNullableFormBuilder).group(
    {
      serial: [this.data.instrument?.serial ?? '', [Validators.required, Validators.maxLength(100)]],
      maker: [this.data.instrument?.maker ?? '', Validators.maxLength(200)],
      installedOn: [this.data.instrument?.installedOn ?? '', dayValidator],
      removedOn: [this.data.instrument?.removedOn ?? '', dayValidator],
      notes: [this.data.instrument?.notes ?? ''],
    },
    { validators: orderValidator },
  );
  protected readonly isSaving = signal(false);
  protected readonly problem = signal<string | null>(null);

  protected save(): void {
    if (this.form.invalid) {
      this.form.markAllAsTouched();
      return;
    }
    const v = this.form.getRawValue();
    const input: InstrumentInput = {
      serial: v.serial.trim(),
      maker: v.maker.trim(),
      installedOn: v.installedOn.trim() || null,
      removedOn: v.removedOn.trim() || null,
      notes: v.notes,
    };
    const instrument = this.data.instrument;
    const request = instrument
      ? this.stationsApi.updateInstrument(instrument.id, { ...input, version: instrument.version })
      : this.stationsApi.createInstrument(this.data.stationId, input);
    this.isSaving.set(true);
    request.pipe(takeUntilDestroyed(this.destroyRef)).subscribe({
      next: (saved) => {
        this.savedNotice.show('Instrument saved.');
        this.dialogRef.close(saved);
      },
      error: (error: unknown) => {
        this.isSaving.set(false);
        this.problem.set(
          error instanceof ApiError && error.code === 'version_conflict'
            ? 'Someone else changed this instrument after you opened it. Close and open it again.'
            : error instanceof ApiError
              ? error.message
              : 'The instrument could not be saved.',
        );
      },
    });
  }
}
