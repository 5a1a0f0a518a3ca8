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
import { missingForTracing, ScanStatusActions } from './scan-status-actions';

function settle(): Promise<void> {
  return new Promise((resolve) => setTimeout(resolve, 0));
}

describe('missingForTracing', () => {
  it('when a scan arrived without metadata and its derivatives are still being made, then all four needs are named', () => {
    const scan = scanDetailForTest({ stationId: null, chartFormId: null, chartStart: null, derivativeState: 'working' });

    expect(missingForTracing(scan)).toEqual(['station', 'chart form', 'chart start', 'derivatives']);
  });

  it('when everything is in place, then nothing is missing', () => {
    expect(missingForTracing(scanDetailForTest())).toEqual([]);
  });
});

describe('ScanStatusActions', () => {
  let controller: HttpTestingController;

  beforeEach(() => {
    TestBed.configureTestingModule({
      providers: [provideRouter([]), provideHttpClient(withInterceptors([httpErrorInterceptor])), provideHttpClientTesting()],
    });
    controller = TestBed.inject(HttpTestingController);
  });

  afterEach(() => controller.verify());

  async function open(scan: ScanDetail) {
    const fixture = TestBed.createComponent(ScanStatusActions);
    fixture.componentRef.setInput('scan', scan);
    await fixture.whenStable();
    return { fixture, loader: TestbedHarnessEnvironment.loader(fixture) };
  }

  it('when no reason is typed, then Withdraw stays disabled; with one, it posts the reason', async () => {
    const { loader } = await open(scanDetailForTest({ status: 'received' }));
    const withdraw = await loader.getHarness(MatButtonHarness.with({ text: /Withdraw/ }));
    const isDisabledBefore = await withdraw.isDisabled();

    await (await loader.getHarness(MatInputHarness.with({ selector: '[data-testid="status-reason"]' }))).setValue('second copy of box 14 item 3');
    await withdraw.click();
    const request = controller.expectOne('/api/scans/scan-1/status');
    request.flush(scanDetailForTest({ status: 'withdrawn', withdrawnReason: 'second copy of box 14 item 3' }));

    expect(isDisabledBefore).toBe(true);
    expect(request.request.body).toEqual({ status: 'withdrawn', reason: 'second copy of box 14 item 3' });
  });

  it('when fields are missing, then Ready to trace waits and says what it needs', async () => {
    const { fixture, loader } = await open(scanDetailForTest({ status: 'received', chartStart: null }));

    const ready = await loader.getHarness(MatButtonHarness.with({ text: /Ready to trace/ }));

    expect(await ready.isDisabled()).toBe(true);
    expect((fixture.nativeElement as HTMLElement).textContent).toContain('it needs: chart start');
  });

  it('when the server refuses ready to trace, then the missing fields it names are shown', async () => {
    const { fixture, loader } = await open(scanDetailForTest({ status: 'received' }));

    await (await loader.getHarness(MatButtonHarness.with({ text: /Ready to trace/ }))).click();
    controller
      .expectOne('/api/scans/scan-1/status')
      .flush({ error: { code: 'conflict', message: 'The scan is not ready to trace.', details: { stationId: 'station is not set' } } }, { status: 409, statusText: 'Conflict' });
    await settle();
    await fixture.whenStable();
    const text = (fixture.nativeElement as HTMLElement).querySelector('[data-testid="status-problem"]')?.textContent ?? '';

    expect(text).toContain('The scan is not ready to trace.');
    expect(text).toContain('stationId: station is not set');
  });

  it('when a scan is withdrawn, then the only action is to restore it to received', async () => {
    const { loader } = await open(scanDetailForTest({ status: 'withdrawn', withdrawnReason: 'illegible' }));

    const buttons = await loader.getAllHarnesses(MatButtonHarness);
    await buttons[0].click();
    const request = controller.expectOne('/api/scans/scan-1/status');
    request.flush(scanDetailForTest({ status: 'received' }));

    expect(await Promise.all(buttons.map((b) => b.getText()))).toEqual(['restore Restore to received']);
    expect(request.request.body).toEqual({ status: 'received' });
  });
});
