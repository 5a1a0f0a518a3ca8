import { provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { TestBed } from '@angular/core/testing';

import { SeriesApi } from './series-api';

describe('SeriesApi', () => {
  let api: SeriesApi;
  let controller: HttpTestingController;

  beforeEach(() => {
    TestBed.configureTestingModule({ providers: [provideHttpClient(), provideHttpClientTesting()] });
    api = TestBed.inject(SeriesApi);
    controller = TestBed.inject(HttpTestingController);
  });

  afterEach(() => controller.verify());

  it('when a station series is asked for, then the station and UTC days go as typed', () => {
    api.get({ stationId: 'st-1', fromDay: '2026-03-02', toDay: '2026-03-09' }).subscribe();

    const request = controller.expectOne((r) => r.url === '/api/series');

    expect(request.request.params.get('stationId')).toBe('st-1');
    expect(request.request.params.get('from')).toBe('2026-03-02');
    expect(request.request.params.get('to')).toBe('2026-03-09');
  });

  it('when the CSV is asked for, then it is fetched as a blob from the CSV path with the same range', () => {
    api.getCsv({ stationId: 'st-1', fromDay: '2026-03-02', toDay: '2026-03-09' }).subscribe();

    const request = controller.expectOne((r) => r.url === '/api/series.csv');

    expect(request.request.responseType).toBe('blob');
    expect(request.request.params.get('to')).toBe('2026-03-09');
    request.flush(new Blob(['time,pressure_hpa,flag,uncertainty_hpa,ink_line_id\n']));
  });
});
