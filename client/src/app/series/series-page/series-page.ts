import { DOCUMENT } from '@angular/common';
import { ChangeDetectionStrategy, Component, computed, DestroyRef, inject, signal } from '@angular/core';
import { takeUntilDestroyed, toObservable, toSignal } from '@angular/core/rxjs-interop';
import { NonNullableFormBuilder, ReactiveFormsModule } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatInputModule } from '@angular/material/input';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { MatSelectModule } from '@angular/material/select';
import { RouterLink } from '@angular/router';
import type { PointChart } from '@shared/api/series-point-chart';
import type { SeriesFormat, SeriesQueryResponse, StationCoverage } from '@shared/api/series-query';
import { maxSeriesRangeMs, SERIES_STEP_NOMINAL_MS } from '@shared/api/series-query';
import type { SeriesFlag } from '@shared/api/series';
import { PRESSURE_UNITS, type PressureUnit } from '@shared/domain/pressure-units';
import { catchError, debounceTime, distinctUntilChanged, filter, map, of, switchMap } from 'rxjs';

import { StationsApi } from '../../core/api/stations-api';
import { rolesFor } from '../../core/auth/areas';
import { AuthSession } from '../../core/auth/auth-session';
import { ApiError } from '../../core/http/api-error';
import { ObjectUrlHolder, saveBlob } from '../../shared/object-url/object-url';
import { FlagLegend } from '../../shared/plot-marks/flag-legend';
import { CoverageStrip } from '../coverage-strip/coverage-strip';
import { DerivedPanel } from '../derived-panel/derived-panel';
import { lessonLinkFor } from '../lesson-link';
import { chooseDetailStep, fetchWindowMs, STEP_WORDS } from '../plot-math/detail-step';
import { toPlotPoints } from '../plot-math/plot-points';
import { reduceLineToSeaLevel, reductionHeightM, type SeaLevelAssumptions } from '../plot-math/sea-level-line';
import { tendencyAt } from '../plot-math/tendency-at';
import { PointChartPanel } from '../point-chart-panel/point-chart-panel';
import type { StationLine } from '../series-detail/detail-lines';
import { SeriesDetail } from '../series-detail/series-detail';
import { SeriesOverview } from '../series-overview/series-overview';
import { type SeriesView, SeriesQueryApi } from '../series-query-api';
import { parseUtcDay, seriesFileName } from '../series-range';
import { SeriesRangeForm } from './series-range-form';
import { loadSelectOptions } from '../../shared/select-options/select-options';
import { SelectOptionsFailure } from '../../shared/select-options/select-options-failure';

const DAY_MS = 86_400_000;
/** Stations one plot overlays (one request serves them all). */
const MAX_OVERLAID = 4;
/** Neighbours more than this many steps apart leave a gap in the line. */
const GAP_FACTOR = 3;

type Loaded<T> = { state: 'loading' } | { state: 'ready'; value: T } | { state: 'failed'; message: string };

function messageOf(error: unknown, fallback: string): string {
  return error instanceof ApiError ? error.message : fallback;
}

/**
 * The Series area: pick a station (and stations to overlay), see where it has data, brush its whole record
 * to choose a range, zoom the detail plot from decades to minutes, read values, open the chart behind a
 * point, derive sea-level pressure and tendency, and download the visible range in CSV, NetCDF or JSON.
 */
@Component({
  selector: 'isl-series-page',
  imports: [SelectOptionsFailure, 
    ReactiveFormsModule,
    RouterLink,
    MatFormFieldModule,
    MatInputModule,
    MatSelectModule,
    MatButtonModule,
    MatIconModule,
    MatProgressBarModule,
    CoverageStrip,
    SeriesOverview,
    SeriesDetail,
    FlagLegend,
    PointChartPanel,
    DerivedPanel,
    SeriesRangeForm,
  ],
  templateUrl: './series-page.html',
  styleUrl: './series-page.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class SeriesPage {
  private readonly api = inject(SeriesQueryApi);
  private readonly destroyRef = inject(DestroyRef);
  private readonly document = inject(DOCUMENT);
  private readonly imageUrls = new ObjectUrlHolder(this.destroyRef);
  private readonly session = inject(AuthSession);

  protected readonly units = PRESSURE_UNITS.filter((unit) => unit === 'hPa' || unit === 'inHg' || unit === 'mmHg');
  protected readonly stationOptions = loadSelectOptions(inject(StationsApi).listForSelect(), 'The stations');
  protected readonly stations = this.stationOptions.items;
  protected readonly picks = inject(NonNullableFormBuilder).group({
    stationId: [''],
    overlayIds: [[] as string[]],
    unit: ['hPa' as PressureUnit],
  });
  private readonly pickValues = toSignal(this.picks.valueChanges.pipe(map(() => this.picks.getRawValue())), { initialValue: this.picks.getRawValue() });
  protected readonly unit = computed(() => this.pickValues().unit);
  protected readonly stationId = computed(() => this.pickValues().stationId);
  protected readonly station = computed(() => this.stations().find((station) => station.id === this.stationId()) ?? null);
  protected readonly overlayChoices = computed(() => this.stations().filter((station) => station.id !== this.stationId()));
  private readonly stationIds = computed(() => {
    const primary = this.stationId();
    if (primary === '') return [];
    return [primary, ...this.pickValues().overlayIds.filter((id) => id !== primary)].slice(0, MAX_OVERLAID);
  });

  /** The primary station's coverage, and its daily record for the overview. */
  protected readonly coverage = signal<Loaded<StationCoverage> | null>(null);
  protected readonly overview = signal<Loaded<SeriesQueryResponse> | null>(null);
  protected readonly recordMs = computed((): [number, number] | null => {
    const coverage = this.coverage();
    if (coverage?.state !== 'ready' || coverage.value.first === null || coverage.value.last === null) return null;
    const firstMs = Date.parse(coverage.value.first);
    return [firstMs, Math.max(Date.parse(coverage.value.last), firstMs + 3_600_000)];
  });
  protected readonly overviewDays = computed(() => {
    const overview = this.overview();
    return overview?.state === 'ready' && overview.value.stations[0] ? toPlotPoints(overview.value.stations[0]) : [];
  });

  /** The detail plot's range, epoch ms. */
  protected readonly viewMs = signal<[number, number] | null>(null);
  protected readonly step = computed(() => {
    const view = this.viewMs();
    return view ? chooseDetailStep(view[1] - view[0], Math.max(1, this.stationIds().length)) : 'daily';
  });
  protected readonly stepWords = computed(() => STEP_WORDS[this.step()]);
  protected readonly detail = signal<Loaded<SeriesQueryResponse> | null>(null);
  protected readonly isDetailLoading = signal(false);
  protected readonly seaLevel = signal<SeaLevelAssumptions | null>(null);
  protected readonly lines = computed((): StationLine[] => {
    const detail = this.detail();
    if (detail?.state !== 'ready') return [];
    const seaLevel = this.seaLevel();
    return detail.value.stations.map((series, slot) => {
      const points = toPlotPoints(series);
      return { stationId: series.stationId, label: `${series.stationName} (${series.stationCode})`, slot, points: seaLevel && slot === 0 ? reduceLineToSeaLevel(points, seaLevel) : points };
    });
  });
  protected readonly maxStepMs = computed(() => GAP_FACTOR * Math.max(SERIES_STEP_NOMINAL_MS[this.detailStep()], 3_600_000));
  private readonly detailStep = computed(() => {
    const detail = this.detail();
    return detail?.state === 'ready' ? detail.value.step : this.step();
  });
  protected readonly visiblePointCount = computed(() => {
    const view = this.viewMs();
    if (!view) return 0;
    return this.lines().reduce((sum, line) => sum + line.points.filter((point) => point.timeMs >= view[0] && point.timeMs <= view[1]).length, 0);
  });
  protected readonly isEmpty = computed(() => this.detail()?.state === 'ready' && this.visiblePointCount() === 0);
  protected readonly shownFlags = computed(() => {
    const flags = new Set<SeriesFlag>(this.lines().flatMap((line) => line.points.map((point) => point.flag)));
    flags.add('gap');
    return [...flags];
  });
  protected readonly hasFlaggedBars = computed(() => this.lines().some((line) => line.points.some((point) => point.count > 1 && point.flaggedShare > 0)));
  protected readonly versionText = computed(() => {
    const detail = this.detail();
    if (detail?.state !== 'ready') return '';
    return detail.value.stations.map((series) => `${series.stationCode} version ${series.version}${series.builtAt ? `, built ${series.builtAt.slice(0, 16).replace('T', ' ')} UTC` : ''}`).join(' · ');
  });
  /** Teachers (and whoever may open Lessons) start a lesson from the brushed range. */
  protected readonly lessonLink = computed(() => {
    const view = this.viewMs();
    if (!view || this.stationId() === '' || !this.session.hasAnyRole(rolesFor('lessons'))) return null;
    return lessonLinkFor(this.stationId(), view);
  });
  protected readonly lessonQueryParams = computed(() => {
    const link = this.lessonLink();
    return link && 'queryParams' in link ? link.queryParams : null;
  });
  protected readonly lessonProblem = computed(() => {
    const link = this.lessonLink();
    return link && 'problem' in link ? link.problem : null;
  });
  protected readonly seaLevelHeightM = computed(() => {
    const station = this.station();
    return station ? reductionHeightM(station) : null;
  });
  protected readonly seaLevelHeightSource = computed(() => (this.station()?.barometerHeightM != null ? 'barometer' : 'station'));

  /** The picked point, its chart and the chart's image. */
  protected readonly pickedTimeMs = signal<number | null>(null);
  protected readonly pointChart = signal<Loaded<PointChart> | null>(null);
  protected readonly chartImageUrl = signal<string | null>(null);
  protected readonly tendency = computed(() => {
    const timeMs = this.pickedTimeMs();
    const first = this.lines()[0];
    if (timeMs === null || !first) return undefined;
    return tendencyAt(first.points, this.detailStep(), timeMs);
  });
  protected readonly isDownloading = signal(false);
  protected readonly downloadFailure = signal<string | null>(null);

  constructor() {
    toObservable(this.stationId)
      .pipe(
        distinctUntilChanged(),
        filter((stationId) => stationId !== ''),
        switchMap((stationId) => {
          this.resetForStation();
          return this.api.coverage(stationId).pipe(
            map((value): Loaded<StationCoverage> => ({ state: 'ready', value })),
            catchError((error: unknown) => of<Loaded<StationCoverage>>({ state: 'failed', message: messageOf(error, 'The coverage could not be loaded.') })),
          );
        }),
        takeUntilDestroyed(),
      )
      .subscribe((coverage) => {
        this.coverage.set(coverage);
        this.loadOverview();
      });

    toObservable(computed(() => ({ stationIds: this.stationIds(), viewMs: this.viewMs(), step: this.step(), recordMs: this.recordMs() })))
      .pipe(
        debounceTime(150),
        filter((request) => request.viewMs !== null && request.stationIds.length > 0),
        map((request): SeriesView => {
          const viewMs = request.viewMs as [number, number];
          const [fromMs, toMs] = fetchWindowMs(viewMs, request.recordMs ?? viewMs);
          // The widened window may pass the server's limit at the step: then the view alone is asked for.
          const window = toMs - fromMs <= maxSeriesRangeMs(request.step, request.stationIds.length) ? [fromMs, toMs] : viewMs;
          return { stationIds: request.stationIds, fromMs: Math.round(window[0]), toMs: Math.round(window[1]), step: request.step };
        }),
        filter((view) => !this.servesView(view)),
        switchMap((view) => {
          // The old plot stays while a finer or wider one loads; only an error clears it.
          this.isDetailLoading.set(true);
          return this.api.query(view).pipe(
            map((value): Loaded<SeriesQueryResponse> => ({ state: 'ready', value })),
            // An error clears the old plot and says what went wrong.
            catchError((error: unknown) => of<Loaded<SeriesQueryResponse>>({ state: 'failed', message: messageOf(error, 'The series could not be loaded.') })),
          );
        }),
        takeUntilDestroyed(),
      )
      .subscribe((detail) => {
        this.isDetailLoading.set(false);
        this.detail.set(detail);
      });
  }

  /** True when the detail already loaded covers the view at its step with the same stations. */
  private servesView(view: SeriesView): boolean {
    const detail = this.detail();
    if (detail?.state !== 'ready') return false;
    const current = this.viewMs();
    const shown = detail.value;
    return (
      current !== null &&
      shown.step === view.step &&
      Date.parse(shown.from) <= current[0] &&
      Date.parse(shown.to) >= current[1] &&
      shown.stations.map((series) => series.stationId).join() === view.stationIds.join()
    );
  }

  private resetForStation(): void {
    this.coverage.set({ state: 'loading' });
    this.overview.set(null);
    this.detail.set(null);
    this.isDetailLoading.set(false);
    this.viewMs.set(null);
    this.closeChart();
    this.seaLevel.set(null);
  }

  private loadOverview(): void {
    const record = this.recordMs();
    if (!record) return;
    const stationId = this.stationId();
    const spanMs = record[1] - record[0];
    this.viewMs.set([record[0], record[1]]);
    this.overview.set({ state: 'loading' });
    this.api
      .query({ stationIds: [stationId], fromMs: record[0], toMs: record[1], step: spanMs <= maxSeriesRangeMs('daily', 1) ? 'daily' : 'monthly' })
      .pipe(takeUntilDestroyed(this.destroyRef))
      .subscribe({
        next: (value) => this.overview.set({ state: 'ready', value }),
        error: (error: unknown) => this.overview.set({ state: 'failed', message: messageOf(error, 'The record could not be loaded.') }),
      });
  }

  protected showRange(range: [number, number]): void {
    this.viewMs.set(range);
  }

  protected showTypedDays(days: { fromDay: string; toDay: string }): void {
    const fromMs = parseUtcDay(days.fromDay);
    const toMs = parseUtcDay(days.toDay);
    if (fromMs === null || toMs === null) return;
    this.viewMs.set([fromMs, toMs + DAY_MS - 1]);
  }

  protected openChart(pick: { stationId: string; timeMs: number }): void {
    this.pickedTimeMs.set(pick.timeMs);
    this.pointChart.set({ state: 'loading' });
    this.chartImageUrl.set(null);
    this.api
      .pointChart(pick.stationId, pick.timeMs)
      .pipe(
        switchMap((chart) => {
          this.pointChart.set({ state: 'ready', value: chart });
          return chart.imagePath ? this.api.image(chart.imagePath) : of(null);
        }),
        takeUntilDestroyed(this.destroyRef),
      )
      .subscribe({
        next: (blob) => this.chartImageUrl.set(blob ? this.imageUrls.replace(blob) : null),
        error: (error: unknown) => {
          if (this.pointChart()?.state === 'loading') this.pointChart.set({ state: 'failed', message: messageOf(error, 'The chart could not be found.') });
          else this.downloadFailure.set(messageOf(error, 'The chart image could not be loaded.'));
        },
      });
  }

  protected closeChart(): void {
    this.pickedTimeMs.set(null);
    this.pointChart.set(null);
    this.chartImageUrl.set(null);
  }

  protected download(format: SeriesFormat): void {
    const view = this.viewMs();
    if (!view || this.isEmpty()) return;
    // NetCDF holds one station; the overlaid ones come in CSV and JSON.
    const stationIds = format === 'netcdf' ? this.stationIds().slice(0, 1) : this.stationIds();
    const codes = stationIds.map((id) => this.stations().find((station) => station.id === id)?.code ?? id);
    const request: SeriesView = { stationIds, fromMs: Math.round(view[0]), toMs: Math.round(view[1]), step: this.step() };
    this.isDownloading.set(true);
    this.downloadFailure.set(null);
    this.api
      .download(request, format)
      .pipe(takeUntilDestroyed(this.destroyRef))
      .subscribe({
        next: (blob) => {
          this.isDownloading.set(false);
          saveBlob(blob, seriesFileName(codes, request.fromMs, request.toMs, request.step, format), this.document);
        },
        error: (error: unknown) => {
          this.isDownloading.set(false);
          this.downloadFailure.set(messageOf(error, 'The file could not be downloaded.'));
        },
      });
  }
}
