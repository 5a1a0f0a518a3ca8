import { provideHttpClient, withInterceptors } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting, type TestRequest } from '@angular/common/http/testing';
import { TestBed, type ComponentFixture } from '@angular/core/testing';
import { provideRouter } from '@angular/router';
import type { SeriesQueryResponse, StationCoverage } from '@shared/api/series-query';

import { httpErrorInterceptor } from '../../core/http/http-error-interceptor';
import { SeriesPage } from './series-page';

// The page pulls in Material selects, both plots and the derived panel: the first render takes seconds.
jest.setTimeout(30_000);

const STATION_ID = '11111111-1111-4111-8111-111111111111';
const STATION = { id: STATION_ID, code: 'KRO', name: 'Kestrel Ridge', latitude: 54.6, longitude: -2.9, elevationM: 412, timeZone: 'UTC', wigosId: null, barometerHeightM: 413.2, timeStandard: 'utc', historyNotes: '', version: 1 };
const COVERAGE: StationCoverage = {
  stationId: STATION_ID,
  version: 3,
  builtAt: '2026-03-10T00:00:00.000Z',
  first: '2026-03-02T00:00:00.000Z',
  last: '2026-03-08T23:00:00.000Z',
  pointCount: 168,
  chartCount: 1,
  chartStates: { traced: 1 },
  months: [{ month: '2026-03', pointCount: 168, flaggedShare: 0, minHpa: 990, maxHpa: 1004, chartCount: 1, chartStates: { traced: 1 } }],
};

function answer(stations: SeriesQueryResponse['stations'][number]['points']): SeriesQueryResponse {
  return {
    from: COVERAGE.first as string,
    to: COVERAGE.last as string,
    step: 'raw',
    aggregate: null,
    flags: ['ok'],
    stations: [{ stationId: STATION_ID, stationCode: 'KRO', stationName: 'Kestrel Ridge', version: 3, builtAt: COVERAGE.builtAt, points: stations }],
  };
}

const POINTS = Array.from({ length: 24 }, (_, hour) => ({
  time: new Date(Date.UTC(2026, 2, 4, hour)).toISOString(),
  pressureHpa: 1000 + hour / 10,
  flag: 'ok' as const,
  uncertaintyHpa: 0.3,
  inkLineId: '22222222-2222-4222-8222-222222222222',
}));

describe('SeriesPage', () => {
  let controller: HttpTestingController;
  let fixture: ComponentFixture<SeriesPage>;

  beforeEach(async () => {
    jest.useFakeTimers();
    TestBed.configureTestingModule({
      providers: [provideRouter([]), provideHttpClient(withInterceptors([httpErrorInterceptor])), provideHttpClientTesting()],
    });
    controller = TestBed.inject(HttpTestingController);
    fixture = TestBed.createComponent(SeriesPage);
    fixture.detectChanges();
    controller.expectOne((request) => request.url === '/api/stations').flush({ items: [STATION], total: 1, page: 0, pageSize: 200 });
    fixture.componentInstance['picks'].controls.stationId.setValue(STATION_ID);
    fixture.detectChanges();
    controller.expectOne(`/api/stations/${STATION_ID}/coverage`).flush(COVERAGE);
    fixture.detectChanges();
    // The overview asks for the whole record by day.
    const overview = controller.expectOne((request) => request.url === '/api/series/query' && request.params.get('step') === 'daily');
    overview.flush({ ...answer([]), step: 'daily' });
    fixture.detectChanges();
  });

  afterEach(() => {
    fixture.destroy();
    jest.useRealTimers();
  });

  /** The detail plot's request, once the view has settled (the page waits 150 ms for a zoom to pause). */
  function detailRequest(): TestRequest {
    jest.advanceTimersByTime(200);
    return controller.expectOne((request) => request.url === '/api/series/query' && request.params.get('step') !== 'daily');
  }

  const element = () => fixture.nativeElement as HTMLElement;
  const byTestId = (testId: string) => element().querySelector(`[data-testid="${testId}"]`);

  it('when the station is chosen, then the coverage shows and the detail plot asks for the whole record at the step it fits', () => {
    const request = detailRequest();

    expect(byTestId('coverage-summary')?.textContent).toContain('168 points in 1 month');
    expect(request.request.params.get('stationId')).toBe(STATION_ID);
    // A week of data: every traced point (docs: the step for a range, plot-math/detail-step.ts).
    expect(request.request.params.get('step')).toBe('raw');
    request.flush(answer(POINTS));
  });

  it('when the range holds no points, then the page says so and offers nothing to download', () => {
    detailRequest().flush(answer([]));
    fixture.detectChanges();

    expect(byTestId('series-empty')?.textContent).toContain('No points in this range');
    expect(byTestId('series-download')).toBeNull();
    expect(byTestId('series-download-netcdf')).toBeNull();
    expect(byTestId('series-download-json')).toBeNull();
  });

  it('when points come back, then the plot draws them and the three downloads are offered', () => {
    detailRequest().flush(answer(POINTS));
    fixture.detectChanges();

    expect(byTestId('series-plot')?.getAttribute('data-point-count')).toBe('24');
    expect(byTestId('series-line')?.getAttribute('d')).toMatch(/^M/);
    expect(byTestId('series-download')).not.toBeNull();
    expect(byTestId('series-download-netcdf')).not.toBeNull();
    expect(byTestId('series-download-json')).not.toBeNull();
  });

  it('when a later request fails, then the old plot is cleared and the error says what went wrong', async () => {
    detailRequest().flush(answer(POINTS));
    fixture.detectChanges();
    // Two months want hourly means: the raw week loaded cannot serve them, so the page asks again.
    fixture.componentInstance['showRange']([Date.UTC(2026, 1, 1), Date.UTC(2026, 3, 1)]);
    fixture.detectChanges();

    detailRequest().flush(
      { error: { code: 'series_range_too_large', message: 'At step raw, one station may span at most 694 days; ask for step hourly or a shorter range.', details: {} } },
      { status: 400, statusText: 'Bad Request' },
    );
    // The error interceptor reads the body through a promise: let it settle.
    for (let turn = 0; turn < 5; turn++) await Promise.resolve();
    fixture.detectChanges();

    expect(byTestId('series-failure')?.textContent).toContain('ask for step hourly');
    expect(byTestId('series-plot')).toBeNull();
    expect(byTestId('series-download')).toBeNull();
  });
});
