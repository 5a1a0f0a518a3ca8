import { provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { TestbedHarnessEnvironment } from '@angular/cdk/testing/testbed';
import { TestBed } from '@angular/core/testing';
import { MatInputHarness } from '@angular/material/input/testing';
import { provideRouter, Router } from '@angular/router';
import { RouterTestingHarness } from '@angular/router/testing';

import { CataloguePage } from './catalogue-page';

const EMPTY_PAGE = { items: [], total: 0, page: 0, pageSize: 25 };
const COUNTS = { received: 4, ready_to_trace: 2, traced: 1, approved: 0, withdrawn: 1 };

describe('CataloguePage', () => {
  let controller: HttpTestingController;

  beforeEach(() => {
    TestBed.configureTestingModule({
      providers: [provideRouter([{ path: 'archive', component: CataloguePage }]), provideHttpClient(), provideHttpClientTesting()],
    });
    controller = TestBed.inject(HttpTestingController);
  });

  function answerLookups(): void {
    for (const request of controller.match((r) => r.url === '/api/stations' || r.url === '/api/chart-forms')) request.flush(EMPTY_PAGE);
  }

  function answerScans(): void {
    for (const r of controller.match((r) => r.url.startsWith('/api/scans'))) {
      if (!r.cancelled) r.flush(r.request.url.endsWith('status-counts') ? COUNTS : EMPTY_PAGE);
    }
  }

  it('when the address carries filters, then the list and the status counts are asked for with them', async () => {
    const harness = await RouterTestingHarness.create();

    await harness.navigateByUrl('/archive?stationId=st-kro&status=received&from=2026-04-06&tag=gale');
    answerLookups();
    const list = controller.expectOne((r) => r.url === '/api/scans');
    const counts = controller.expectOne((r) => r.url === '/api/scans/status-counts');

    expect(list.request.params.get('stationId')).toBe('st-kro');
    expect(list.request.params.get('status')).toBe('received');
    expect(list.request.params.get('from')).toBe('2026-04-06T00:00:00.000Z');
    expect(list.request.params.getAll('tag')).toEqual(['gale']);
    // The counts cover every status, so the status filter is left out of them.
    expect(counts.request.params.get('stationId')).toBe('st-kro');
    expect(counts.request.params.has('status')).toBe(false);
    list.flush(EMPTY_PAGE);
    counts.flush(COUNTS);
  });

  it('when a status count is clicked, then the address filters by that status from the first page', async () => {
    const harness = await RouterTestingHarness.create();
    await harness.navigateByUrl('/archive?page=2');
    answerLookups();
    controller.expectOne((r) => r.url === '/api/scans').flush(EMPTY_PAGE);
    controller.expectOne((r) => r.url === '/api/scans/status-counts').flush(COUNTS);
    await harness.fixture.whenStable();

    (harness.routeNativeElement!.querySelector('[data-status="withdrawn"]') as HTMLButtonElement).click();
    await harness.fixture.whenStable();

    expect(TestBed.inject(Router).url).toBe('/archive?status=withdrawn');
    answerScans();
  });

  it('when free text is typed, then after a pause the address carries it', async () => {
    jest.useFakeTimers({ advanceTimers: true });
    const harness = await RouterTestingHarness.create();
    await harness.navigateByUrl('/archive');
    answerLookups();
    controller.expectOne((r) => r.url === '/api/scans').flush(EMPTY_PAGE);
    controller.expectOne((r) => r.url === '/api/scans/status-counts').flush(COUNTS);
    const loader = TestbedHarnessEnvironment.loader(harness.fixture);
    const search = await loader.getHarness(MatInputHarness.with({ selector: '[data-testid="filter-q"]' }));

    await search.setValue('kestrel gale');
    jest.advanceTimersByTime(400);
    await harness.fixture.whenStable();

    expect(TestBed.inject(Router).url).toBe('/archive?q=kestrel%20gale');
    answerScans();
    jest.useRealTimers();
  });
});
