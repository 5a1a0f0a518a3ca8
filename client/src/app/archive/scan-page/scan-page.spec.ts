import { provideHttpClient, withInterceptors } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { TestBed } from '@angular/core/testing';
import { provideRouter } from '@angular/router';

import { scanDetailForTest } from '../../core/api/scan-for-test';
import { httpErrorInterceptor } from '../../core/http/http-error-interceptor';
import { ScanPage } from './scan-page';

const EMPTY_PAGE = { items: [], total: 0, page: 0, pageSize: 200 };

// The page pulls in the close view, tabs and forms: its first render takes several seconds on a busy machine.
jest.setTimeout(30_000);

describe('ScanPage', () => {
  let controller: HttpTestingController;

  beforeEach(() => {
    TestBed.configureTestingModule({
      providers: [provideRouter([]), provideHttpClient(withInterceptors([httpErrorInterceptor])), provideHttpClientTesting()],
    });
    controller = TestBed.inject(HttpTestingController);
  });

  function answerLookups(): void {
    for (const r of controller.match((r) => r.url === '/api/stations' || r.url === '/api/chart-forms' || r.url.includes('/instruments'))) r.flush(EMPTY_PAGE);
    for (const r of controller.match((r) => r.url.startsWith('/api/chart-forms/'))) r.flush({ ...EMPTY_PAGE, id: 'cf-1' });
  }

  it('when the derivatives failed, then the reason shows and Retry requeues the job', async () => {
    const fixture = TestBed.createComponent(ScanPage);
    fixture.componentRef.setInput('scanId', 'scan-1');
    await fixture.whenStable();
    controller
      .expectOne('/api/scans/scan-1')
      .flush(scanDetailForTest({ derivativeState: 'failed', derivativeError: 'Input file is missing', derivativeAttempts: 3 }));
    await fixture.whenStable();
    answerLookups();
    await fixture.whenStable();
    const element = fixture.nativeElement as HTMLElement;
    const stateBefore = element.querySelector('[data-testid="derivative-state"]')?.textContent ?? '';

    element.querySelector<HTMLButtonElement>('[data-testid="derivative-retry"]')!.click();
    const retry = controller.expectOne('/api/scans/scan-1/derivatives/retry');
    retry.flush(scanDetailForTest({ derivativeState: 'queued', derivativeError: null, version: 4 }));
    await fixture.whenStable();

    expect(stateBefore).toContain('failed after 3 tries: Input file is missing');
    expect(retry.request.method).toBe('POST');
    expect(element.querySelector('[data-testid="derivative-state"]')?.getAttribute('data-state')).toBe('queued');
    expect(element.querySelector('[data-testid="derivative-retry"]')).toBeNull();
    answerLookups();
    fixture.destroy();
  });

  it('when the file gave no dpi, then the grid toggle is off and the page asks for the dpi', async () => {
    const fixture = TestBed.createComponent(ScanPage);
    fixture.componentRef.setInput('scanId', 'scan-1');
    await fixture.whenStable();
    controller.expectOne('/api/scans/scan-1').flush(scanDetailForTest({ derivativeState: 'failed', dpi: null }));
    await fixture.whenStable();
    answerLookups();
    await fixture.whenStable();

    const element = fixture.nativeElement as HTMLElement;

    expect(element.querySelector('[data-testid="dpi-missing"]')?.textContent).toContain('type its dpi');
    expect(element.querySelector('[data-testid="grid-toggle"] button')?.getAttribute('aria-checked')).toBe('false');
    expect(element.querySelector('[data-testid="grid-toggle"] button')?.hasAttribute('disabled')).toBe(true);
    fixture.destroy();
  });
});
