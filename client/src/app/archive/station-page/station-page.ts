import { ChangeDetectionStrategy, Component, computed, inject, input, signal } from '@angular/core';
import { toObservable, toSignal } from '@angular/core/rxjs-interop';
import { MatButtonModule } from '@angular/material/button';
import { MatDialog } from '@angular/material/dialog';
import { MatIconModule } from '@angular/material/icon';
import { MatTableModule } from '@angular/material/table';
import { RouterLink } from '@angular/router';
import type { InstrumentSummary } from '@shared/api/instruments';
import type { StationSummary } from '@shared/api/stations';
import { catchError, combineLatest, map, of, switchMap } from 'rxjs';

import { StationsApi } from '../../core/api/stations-api';
import { ApiError } from '../../core/http/api-error';
import { InstrumentDialog, type InstrumentDialogData } from '../instrument-dialog/instrument-dialog';
import { StationDialog, type StationDialogData } from '../station-dialog/station-dialog';
import { TracingSettings } from '../tracing-settings/tracing-settings';
import { RegisterChangeLog } from '../register-change-log/register-change-log';

/** One station: its facts and history, its tracing setting, and the barographs it used. */
@Component({
  selector: 'isl-station-page',
  imports: [RouterLink, MatButtonModule, MatIconModule, MatTableModule, TracingSettings, RegisterChangeLog],
  templateUrl: './station-page.html',
  styleUrl: './station-page.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class StationPage {
  private readonly stationsApi = inject(StationsApi);
  private readonly dialog = inject(MatDialog);

  /** From the route parameter. */
  readonly stationId = input.required<string>();

  protected readonly reloads = signal(0);
  protected readonly columns = ['serial', 'maker', 'installedOn', 'removedOn', 'notes', 'edit'];
  private readonly view = toSignal(
    combineLatest([toObservable(this.stationId), toObservable(this.reloads)]).pipe(
      switchMap(([stationId]) =>
        combineLatest([this.stationsApi.get(stationId), this.stationsApi.instruments(stationId)]).pipe(
          map(([station, instruments]) => ({ station, instruments: instruments.items, failure: null as string | null })),
          catchError((error: unknown) =>
            of({ station: null as StationSummary | null, instruments: [] as InstrumentSummary[], failure: error instanceof ApiError ? error.message : 'The station could not be loaded.' }),
          ),
        ),
      ),
    ),
  );
  protected readonly station = computed(() => this.view()?.station ?? null);
  protected readonly instruments = computed(() => this.view()?.instruments ?? []);
  protected readonly failure = computed(() => this.view()?.failure ?? null);

  protected editStation(station: StationSummary): void {
    this.dialog
      .open<StationDialog, StationDialogData, StationSummary>(StationDialog, { data: { station }, width: '680px', maxWidth: '95vw' })
      .afterClosed()
      .subscribe((saved) => saved && this.reload());
  }

  protected openInstrument(instrument: InstrumentSummary | null): void {
    this.dialog
      .open<InstrumentDialog, InstrumentDialogData, InstrumentSummary>(InstrumentDialog, { data: { stationId: this.stationId(), instrument }, width: '560px', maxWidth: '95vw' })
      .afterClosed()
      .subscribe((saved) => saved && this.reload());
  }

  private reload(): void {
    this.reloads.update((n) => n + 1);
  }
}
