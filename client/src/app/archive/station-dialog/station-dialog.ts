import { ChangeDetectionStrategy, Component, DestroyRef, inject, signal } from '@angular/core';
import { takeUntilDestroyed, toSignal } from '@angular/core/rxjs-interop';
import { NonNullableFormBuilder, ReactiveFormsModule, Validators } from '@angular/forms';
import { MatAutocompleteModule } from '@angular/material/autocomplete';
import { MatButtonModule } from '@angular/material/button';
import { MAT_DIALOG_DATA, MatDialogModule, MatDialogRef } from '@angular/material/dialog';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatInputModule } from '@angular/material/input';
import { MatSelectModule } from '@angular/material/select';
import { STATION_NUMBER_RANGES, type StationSummary } from '@shared/api/stations';
import { map, startWith } from 'rxjs';

import { StationsApi } from '../../core/api/stations-api';
import { ApiError } from '../../core/http/api-error';
import { EMPTY_STATION, ianaZoneValidator, numberInRange, stationCodeValidator, stationInputOf, valuesOfStation, wigosIdValidator } from './station-values';
import { SavedNotice } from '../../shared/saved-notice/saved-notice';

export interface StationDialogData {
  station: StationSummary | null;
}

const ZONES: readonly string[] = typeof Intl.supportedValuesOf === 'function' ? Intl.supportedValuesOf('timeZone') : [];

/** Creates or edits a station; a stale version (someone else saved first) is said plainly. */
@Component({
  selector: 'isl-station-dialog',
  imports: [ReactiveFormsModule, MatDialogModule, MatFormFieldModule, MatInputModule, MatSelectModule, MatAutocompleteModule, MatButtonModule],
  templateUrl: './station-dialog.html',
  styleUrl: './station-dialog.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class StationDialog {
  private readonly stationsApi = inject(StationsApi);
  private readonly savedNotice = inject(SavedNotice);
  private readonly dialogRef = inject(MatDialogRef<StationDialog, StationSummary>);
  private readonly destroyRef = inject(DestroyRef);
  protected readonly data = inject<StationDialogData>(MAT_DIALOG_DATA);

  protected readonly form = inject(NonNullableFormBuilder).group({
    code: ['', [Validators.required, stationCodeValidator]],
    name: ['', [Validators.required, Validators.maxLength(200)]],
    wigosId: ['', wigosIdValidator],
    latitude: ['', numberInRange(STATION_NUMBER_RANGES.latitude)],
    longitude: ['', numberInRange(STATION_NUMBER_RANGES.longitude)],
    elevationM: ['', numberInRange(STATION_NUMBER_RANGES.elevationM)],
    barometerHeightM: ['', numberInRange(STATION_NUMBER_RANGES.barometerHeightM)],
    timeZone: ['', [Validators.required, ianaZoneValidator]],
    timeStandard: this.data.station?.timeStandard ?? EMPTY_STATION.timeStandard,
    historyNotes: [''],
  });
  protected readonly zoneOptions = toSignal(
    this.form.controls.timeZone.valueChanges.pipe(
      startWith(''),
      map((typed) => {
        const needle = typed.trim().toLowerCase();
        return ZONES.filter((zone) => zone.toLowerCase().includes(needle)).slice(0, 40);
      }),
    ),
    { initialValue: [] as string[] },
  );
  protected readonly isSaving = signal(false);
  protected readonly problem = signal<{ message: string; details: Record<string, string> } | null>(null);

  constructor() {
    this.form.setValue(this.data.station ? valuesOfStation(this.data.station) : EMPTY_STATION);
  }

  protected save(): void {
    if (this.form.invalid) {
      this.form.markAllAsTouched();
      return;
    }
    const input = stationInputOf(this.form.getRawValue());
    const station = this.data.station;
    const request = station ? this.stationsApi.update(station.id, { ...input, version: station.version }) : this.stationsApi.create(input);
    this.isSaving.set(true);
    this.problem.set(null);
    request.pipe(takeUntilDestroyed(this.destroyRef)).subscribe({
      next: (saved) => {
        this.savedNotice.show(`Station ${saved.code} saved.`);
        this.dialogRef.close(saved);
      },
      error: (error: unknown) => {
        this.isSaving.set(false);
        if (error instanceof ApiError && error.code === 'version_conflict') {
          this.problem.set({ message: 'Someone else changed this station after you opened it. Close and open it again to see their version.', details: {} });
        } else {
          this.problem.set(error instanceof ApiError ? { message: error.message, details: error.details } : { message: 'The station could not be saved.', details: {} });
        }
      },
    });
  }

  protected detailFor(field: string): string | null {
    return this.problem()?.details[field] ?? null;
  }
}
