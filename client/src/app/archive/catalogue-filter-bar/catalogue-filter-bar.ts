import { COMMA, ENTER } from '@angular/cdk/keycodes';
import { ChangeDetectionStrategy, Component, effect, inject, input, output } from '@angular/core';
import { takeUntilDestroyed, toObservable, toSignal } from '@angular/core/rxjs-interop';
import { AbstractControl, NonNullableFormBuilder, ReactiveFormsModule, ValidationErrors } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatChipInputEvent, MatChipsModule } from '@angular/material/chips';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatInputModule } from '@angular/material/input';
import { MatSelectModule } from '@angular/material/select';
import type { InstrumentSummary } from '@shared/api/instruments';
import { SCAN_STATUS_LABELS, SCAN_STATUSES, type ScanStatus } from '@shared/api/scans';
import { catchError, debounceTime, distinctUntilChanged, map, of, switchMap } from 'rxjs';

import { ChartFormsApi } from '../../core/api/chart-forms-api';
import { StationsApi } from '../../core/api/stations-api';
import { parseUtcDay } from '../../series/series-range';
import { type CatalogueFilters, NO_FILTERS } from '../catalogue-page/catalogue-filters';
import { loadSelectOptions } from '../../shared/select-options/select-options';
import { SelectOptionsFailure } from '../../shared/select-options/select-options-failure';

function utcDayValidator(control: AbstractControl<string>): ValidationErrors | null {
  return control.value.trim() === '' || parseUtcDay(control.value) !== null ? null : { utcDay: true };
}

// Typing in the free-text box should not send a request per key.
const TEXT_DEBOUNCE_MS = 350;

/** The catalogue's filters in one compact row: station, instrument, chart form, days, status, tags and free text. */
@Component({
  selector: 'isl-catalogue-filter-bar',
  imports: [SelectOptionsFailure, ReactiveFormsModule, MatFormFieldModule, MatInputModule, MatSelectModule, MatChipsModule, MatIconModule, MatButtonModule],
  templateUrl: './catalogue-filter-bar.html',
  styleUrl: './catalogue-filter-bar.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class CatalogueFilterBar {
  private readonly stationsApi = inject(StationsApi);

  readonly filters = input<CatalogueFilters>(NO_FILTERS);
  readonly filtersChange = output<CatalogueFilters>();

  protected readonly statuses = SCAN_STATUSES;
  protected readonly statusLabels = SCAN_STATUS_LABELS;
  protected readonly tagSeparators = [ENTER, COMMA] as const;
  protected readonly stationOptions = loadSelectOptions(this.stationsApi.listForSelect(), 'The stations');
  protected readonly stations = this.stationOptions.items;
  protected readonly chartFormOptions = loadSelectOptions(inject(ChartFormsApi).listForSelect(), 'The chart forms');
  protected readonly chartForms = this.chartFormOptions.items;
  protected readonly form = inject(NonNullableFormBuilder).group({
    stationId: [''],
    instrumentId: [''],
    chartFormId: [''],
    fromDay: ['', utcDayValidator],
    toDay: ['', utcDayValidator],
    status: [''],
    q: [''],
  });
  protected readonly instruments = toSignal(
    toObservable(this.filters).pipe(
      map((filters) => filters.stationId),
      distinctUntilChanged(),
      switchMap((stationId) =>
        stationId ? this.stationsApi.instruments(stationId).pipe(map((page) => page.items), catchError(() => of<InstrumentSummary[]>([]))) : of<InstrumentSummary[]>([]),
      ),
    ),
    { initialValue: [] as InstrumentSummary[] },
  );

  constructor() {
    // The address is the source of truth: show what it says without echoing it back.
    effect(() => {
      const f = this.filters();
      this.form.setValue(
        {
          stationId: f.stationId ?? '',
          instrumentId: f.instrumentId ?? '',
          chartFormId: f.chartFormId ?? '',
          fromDay: f.fromDay ?? '',
          toDay: f.toDay ?? '',
          status: f.status ?? '',
          q: f.q ?? '',
        },
        { emitEvent: false },
      );
    });
    this.form.valueChanges.pipe(debounceTime(TEXT_DEBOUNCE_MS), takeUntilDestroyed()).subscribe(() => this.applyForm());
  }

  protected addTag(event: MatChipInputEvent): void {
    const tag = event.value.trim().toLowerCase();
    event.chipInput.clear();
    if (tag === '' || this.filters().tags.includes(tag)) return;
    this.filtersChange.emit({ ...this.filters(), tags: [...this.filters().tags, tag] });
  }

  protected removeTag(tag: string): void {
    this.filtersChange.emit({ ...this.filters(), tags: this.filters().tags.filter((t) => t !== tag) });
  }

  protected clearAll(): void {
    this.filtersChange.emit({ ...NO_FILTERS });
  }

  protected applyNow(): void {
    this.applyForm();
  }

  private applyForm(): void {
    if (this.form.invalid) return;
    const v = this.form.getRawValue();
    const current = this.filters();
    const stationChanged = (v.stationId || null) !== current.stationId;
    const next: CatalogueFilters = {
      ...current,
      stationId: v.stationId || null,
      // An instrument belongs to one station; another station's list does not hold it.
      instrumentId: stationChanged ? null : v.instrumentId || null,
      chartFormId: v.chartFormId || null,
      fromDay: v.fromDay.trim() || null,
      toDay: v.toDay.trim() || null,
      status: (v.status || null) as ScanStatus | null,
      q: v.q.trim() || null,
    };
    if (JSON.stringify(next) !== JSON.stringify(current)) this.filtersChange.emit(next);
  }
}
