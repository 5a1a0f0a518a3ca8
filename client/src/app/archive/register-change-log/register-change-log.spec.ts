import { provideHttpClient, withInterceptors } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { TestBed } from '@angular/core/testing';
import type { Page } from '@shared/api/paging';
import type { RegisterChangeLogEntry } from '@shared/api/register-changes';

import { httpErrorInterceptor } from '../../core/http/http-error-interceptor';
import { RegisterChangeLog } from './register-change-log';

describe('RegisterChangeLog', () => {
  let controller: HttpTestingController;

  beforeEach(() => {
    TestBed.configureTestingModule({ providers: [provideHttpClient(withInterceptors([httpErrorInterceptor])), provideHttpClientTesting()] });
    controller = TestBed.inject(HttpTestingController);
  });

  afterEach(() => controller.verify());

  it('when a station log is loaded, then each entry shows who, the action in words and each field before and after', async () => {
    const fixture = TestBed.createComponent(RegisterChangeLog);
    fixture.componentRef.setInput('register', 'station');
    fixture.componentRef.setInput('recordId', 'st-1');
    fixture.detectChanges();
    const page: Page<RegisterChangeLogEntry> = {
      items: [{ id: 'c-1', at: '2026-12-02T10:00:00.000Z', personName: 'Ada Archivist', action: 'edit', changes: { elevationM: { before: 230, after: 240 } } }],
      total: 1,
      page: 0,
      pageSize: 100,
    };

    const request = controller.expectOne((req) => req.url === '/api/stations/st-1/change-log');
    request.flush(page);
    await fixture.whenStable();
    const text = (fixture.nativeElement as HTMLElement).querySelector('[data-testid="change-log-entry"]')?.textContent ?? '';

    expect(request.request.params.get('direction')).toBe('desc');
    expect(text).toContain('Ada Archivist');
    expect(text).toContain('edited');
    expect(text).toContain('elevation m');
    expect(text).toContain('230');
    expect(text).toContain('240');
  });

  it('when the log cannot be loaded, then the reason is shown inline', async () => {
    const fixture = TestBed.createComponent(RegisterChangeLog);
    fixture.componentRef.setInput('register', 'chart_form');
    fixture.componentRef.setInput('recordId', 'cf-1');
    fixture.detectChanges();

    controller.expectOne('/api/chart-forms/cf-1/change-log?page=0&pageSize=100&direction=desc').flush(
      { error: { code: 'forbidden', message: 'Only archivists and admins may read this.' } },
      { status: 403, statusText: 'Forbidden' },
    );
    await fixture.whenStable();
    fixture.detectChanges();

    expect((fixture.nativeElement as HTMLElement).querySelector('[role="alert"]')?.textContent).toContain('Only archivists and admins may read this.');
  });
});
