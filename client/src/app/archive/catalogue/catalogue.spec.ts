import { provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting, TestRequest } from '@angular/common/http/testing';
import { TestBed } from '@angular/core/testing';
import { TestbedHarnessEnvironment } from '@angular/cdk/testing/testbed';
import { MatPaginatorHarness } from '@angular/material/paginator/testing';
import { MatSortHarness } from '@angular/material/sort/testing';
import { MatTableHarness } from '@angular/material/table/testing';
import { provideRouter } from '@angular/router';
import type { Page } from '@shared/api/paging';
import type { ScanSummary } from '@shared/api/scans';

import { scanSummaryForTest } from '../../core/api/scan-for-test';
import { Catalogue } from './catalogue';

function scan(index: number): ScanSummary {
  // Tiles not made yet, so the rows ask for no thumbnails.
  return scanSummaryForTest({ id: `scan-${index}`, originalName: `kro-week-${index}.png`, derivativeState: 'queued' });
}

function pageOf(count: number, total: number, page: number): Page<ScanSummary> {
  return { items: Array.from({ length: count }, (_, i) => scan(page * 25 + i)), total, page, pageSize: 25 };
}

describe('Catalogue', () => {
  let controller: HttpTestingController;

  function expectList(): TestRequest {
    return controller.expectOne((request) => request.url === '/api/scans');
  }

  beforeEach(async () => {
    TestBed.configureTestingModule({ providers: [provideRouter([]), provideHttpClient(), provideHttpClientTesting()] });
    controller = TestBed.inject(HttpTestingController);
  });

  afterEach(() => controller.verify());

  it('when the catalogue opens, then it asks for the first page, newest uploads first, and shows the rows', async () => {
    const fixture = TestBed.createComponent(Catalogue);
    const harnesses = TestbedHarnessEnvironment.loader(fixture);
    await fixture.whenStable();

    const request = expectList();
    request.flush(pageOf(3, 3, 0));
    const rows = await (await harnesses.getHarness(MatTableHarness)).getRows();

    expect(request.request.params.get('page')).toBe('0');
    expect(request.request.params.get('pageSize')).toBe('25');
    expect(request.request.params.get('sort')).toBe('uploadedAt');
    expect(request.request.params.get('direction')).toBe('desc');
    expect(rows).toHaveLength(3);
  });

  it('when the next page is chosen, then the server is asked for page 1', async () => {
    const fixture = TestBed.createComponent(Catalogue);
    const harnesses = TestbedHarnessEnvironment.loader(fixture);
    await fixture.whenStable();
    expectList().flush(pageOf(25, 60, 0));
    const paginator = await harnesses.getHarness(MatPaginatorHarness);

    await paginator.goToNextPage();
    await fixture.whenStable();

    const request = expectList();
    expect(request.request.params.get('page')).toBe('1');
    request.flush(pageOf(25, 60, 1));
  });

  it('when a column header is clicked, then the server sorts by it from the first page', async () => {
    const fixture = TestBed.createComponent(Catalogue);
    const harnesses = TestbedHarnessEnvironment.loader(fixture);
    await fixture.whenStable();
    expectList().flush(pageOf(25, 60, 0));
    const sort = await harnesses.getHarness(MatSortHarness);
    const [stationHeader] = await sort.getSortHeaders({ label: 'Station' });

    await stationHeader.click();
    await fixture.whenStable();

    const request = expectList();
    expect(request.request.params.get('sort')).toBe('stationName');
    expect(request.request.params.get('direction')).toBe('asc');
    expect(request.request.params.get('page')).toBe('0');
    request.flush(pageOf(25, 60, 0));
  });

  it('when filters are given, then they go to the server with the page, tags repeated', async () => {
    const fixture = TestBed.createComponent(Catalogue);
    fixture.componentRef.setInput('filters', { stationId: 'st-kro', tag: ['gale', 'torn'], q: 'box 14' });
    await fixture.whenStable();

    const request = expectList();

    expect(request.request.params.get('stationId')).toBe('st-kro');
    expect(request.request.params.getAll('tag')).toEqual(['gale', 'torn']);
    expect(request.request.params.get('q')).toBe('box 14');
    expect(request.request.params.get('page')).toBe('0');
    request.flush(pageOf(0, 0, 0));
  });

  it('when some rows wait for their derivatives, then the page is asked for again quietly until they are ready', async () => {
    jest.useFakeTimers({ advanceTimers: true });
    const fixture = TestBed.createComponent(Catalogue);
    await fixture.whenStable();
    expectList().flush({ items: [scanSummaryForTest({ id: 'busy', derivativeState: 'working' })], total: 1, page: 0, pageSize: 25 });
    await fixture.whenStable();

    jest.advanceTimersByTime(3100);
    await fixture.whenStable();
    const isBarShown = (fixture.nativeElement as HTMLElement).querySelector('mat-progress-bar') !== null;
    expectList().flush({ items: [scanSummaryForTest({ id: 'busy', derivativeState: 'queued' })], total: 1, page: 0, pageSize: 25 });
    await fixture.whenStable();
    jest.advanceTimersByTime(3100);
    await fixture.whenStable();
    // Failed is an end state too (and asks for no thumbnail).
    expectList().flush({ items: [scanSummaryForTest({ id: 'busy', derivativeState: 'failed' })], total: 1, page: 0, pageSize: 25 });
    await fixture.whenStable();
    jest.advanceTimersByTime(6000);
    await fixture.whenStable();

    expect(isBarShown).toBe(false);
    controller.expectNone((request) => request.url === '/api/scans');
    jest.useRealTimers();
  });
});
