import { provideHttpClient, withInterceptors } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { TestbedHarnessEnvironment } from '@angular/cdk/testing/testbed';
import { TestBed } from '@angular/core/testing';
import { MatButtonHarness } from '@angular/material/button/testing';
import { MatInputHarness } from '@angular/material/input/testing';
import { provideRouter } from '@angular/router';
import type { ScanDetail } from '@shared/api/scans';

import { scanDetailForTest } from '../../core/api/scan-for-test';
import { httpErrorInterceptor } from '../../core/http/http-error-interceptor';
import { SavedNotice } from '../../shared/saved-notice/saved-notice';
import { ScanMetadataForm } from './scan-metadata-form';

const EMPTY_PAGE = { items: [], total: 0, page: 0, pageSize: 200 };

function settle(): Promise<void> {
  return new Promise((resolve) => setTimeout(resolve, 0));
}

describe('ScanMetadataForm', () => {
  let controller: HttpTestingController;

  beforeEach(() => {
    TestBed.configureTestingModule({
      providers: [provideRouter([]), provideHttpClient(withInterceptors([httpErrorInterceptor])), provideHttpClientTesting()],
    });
    controller = TestBed.inject(HttpTestingController);
  });

  afterEach(() => controller.verify());

  async function open(scan: ScanDetail) {
    const fixture = TestBed.createComponent(ScanMetadataForm);
    fixture.componentRef.setInput('scan', scan);
    await fixture.whenStable();
    for (const request of controller.match((r) => r.url === '/api/stations' || r.url === '/api/chart-forms')) request.flush(EMPTY_PAGE);
    for (const request of controller.match((r) => r.url.includes('/instruments'))) request.flush(EMPTY_PAGE);
    await fixture.whenStable();
    return { fixture, loader: TestbedHarnessEnvironment.loader(fixture) };
  }

  it('when the observer and box are changed and saved, then only those fields go with the version read, and the save is confirmed', async () => {
    const { fixture, loader } = await open(scanDetailForTest({ version: 7, box: 'B13' }));
    const saved: ScanDetail[] = [];
    fixture.componentInstance.saved.subscribe((scan) => saved.push(scan));
    const notice = jest.spyOn(TestBed.inject(SavedNotice), 'show');

    await (await loader.getHarness(MatInputHarness.with({ selector: '[data-testid="meta-observer"]' }))).setValue('R. Pellow');
    await (await loader.getHarness(MatInputHarness.with({ selector: '[data-testid="meta-box"]' }))).setValue('B14');
    await (await loader.getHarness(MatButtonHarness.with({ text: /Save/ }))).click();
    const request = controller.expectOne('/api/scans/scan-1');
    request.flush(scanDetailForTest({ version: 8, box: 'B14', observer: 'R. Pellow' }));

    expect(request.request.method).toBe('PATCH');
    expect(request.request.body).toEqual({ version: 7, observer: 'R. Pellow', box: 'B14' });
    expect(saved.map((scan) => scan.version)).toEqual([8]);
    expect(notice).toHaveBeenCalledWith('Catalogue fields saved.');
  });

  it('when someone else saved first, then the form says so and offers to reload', async () => {
    const { fixture, loader } = await open(scanDetailForTest({ version: 7 }));
    let reloads = 0;
    fixture.componentInstance.reloadRequested.subscribe(() => reloads++);
    await (await loader.getHarness(MatInputHarness.with({ selector: '[data-testid="meta-observer"]' }))).setValue('R. Pellow');

    await (await loader.getHarness(MatButtonHarness.with({ text: /Save/ }))).click();
    controller
      .expectOne('/api/scans/scan-1')
      .flush({ error: { code: 'version_conflict', message: 'The scan changed since version 7.' } }, { status: 409, statusText: 'Conflict' });
    await settle();
    await fixture.whenStable();
    const problem = (fixture.nativeElement as HTMLElement).querySelector('[data-testid="meta-problem"]');
    await (await loader.getHarness(MatButtonHarness.with({ text: /Reload/ }))).click();

    expect(problem?.getAttribute('data-kind')).toBe('conflict');
    expect(problem?.textContent).toContain('Someone else changed this scan');
    expect(reloads).toBe(1);
  });

  it('when a chart-on time is not ISO 8601 UTC, then nothing is sent and the field says how to write it', async () => {
    const { fixture, loader } = await open(scanDetailForTest());
    const chartOn = await loader.getHarness(MatInputHarness.with({ selector: '[data-testid="meta-chart-on"]' }));

    await chartOn.setValue('2 March 1931, 9 am');
    await chartOn.blur();
    await (await loader.getHarness(MatButtonHarness.with({ text: /Save/ }))).click();
    await fixture.whenStable();

    expect((fixture.nativeElement as HTMLElement).textContent).toContain('ISO 8601 in UTC');
    controller.expectNone('/api/scans/scan-1');
  });
});
