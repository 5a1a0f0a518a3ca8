import { provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { TestBed } from '@angular/core/testing';
import { provideRouter, withComponentInputBinding } from '@angular/router';
import { RouterTestingHarness } from '@angular/router/testing';

import { NewLesson } from './new-lesson';

// Material form fields and selects: the first render takes seconds on a busy machine.
jest.setTimeout(30_000);

describe('NewLesson', () => {
  it('when opened from the Series page with stationId, from and to, then the form holds them', async () => {
    TestBed.configureTestingModule({
      providers: [provideRouter([{ path: 'lessons/new', component: NewLesson }], withComponentInputBinding()), provideHttpClient(), provideHttpClientTesting()],
    });
    const controller = TestBed.inject(HttpTestingController);
    const harness = await RouterTestingHarness.create();

    await harness.navigateByUrl('/lessons/new?stationId=s-1&from=2026-03-02T12:00:00.000Z&to=2026-03-05T00:00:00.000Z', NewLesson);
    controller.match((request) => request.url === '/api/stations').forEach((request) => request.flush({ items: [], total: 0, page: 0, pageSize: 200 }));
    await harness.fixture.whenStable();

    const value = (testId: string) => (harness.routeNativeElement?.querySelector(`[data-testid="${testId}"]`) as HTMLInputElement).value;
    expect(value('new-lesson-from')).toBe('2026-03-02T12:00:00.000Z');
    expect(value('new-lesson-to')).toBe('2026-03-05T00:00:00.000Z');
    const component = harness.routeDebugElement?.componentInstance as NewLesson;
    expect(component['form'].getRawValue().stationId).toBe('s-1');
  });
});
