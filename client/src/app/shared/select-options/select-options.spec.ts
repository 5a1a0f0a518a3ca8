import { Component, Injector, runInInjectionContext, signal } from '@angular/core';
import { TestBed } from '@angular/core/testing';
import { of, throwError } from 'rxjs';

import { ApiError } from '../../core/http/api-error';
import { loadSelectOptions, type SelectOptions } from './select-options';
import { SelectOptionsFailure } from './select-options-failure';

function load<T>(source: Parameters<typeof loadSelectOptions<T>>[0]): SelectOptions<T> {
  return runInInjectionContext(TestBed.inject(Injector), () => loadSelectOptions(source, 'The stations'));
}

@Component({
  imports: [SelectOptionsFailure],
  template: `<isl-select-options-failure [options]="options()" />`,
})
class Host {
  readonly options = signal<SelectOptions<unknown>[]>([]);
}

describe('loadSelectOptions', () => {
  it('when the list loads, then its items are the choices and there is no failure', () => {
    const options = load(of({ items: [{ id: 's1' }, { id: 's2' }], total: 2, page: 0, pageSize: 200 }));

    expect(options.items()).toEqual([{ id: 's1' }, { id: 's2' }]);
    expect(options.failure()).toBeNull();
  });

  it('when the list fails, then the choices are empty and the failure names the list and the server\'s words', () => {
    const options = load(throwError(() => new ApiError(503, 'internal_error', 'The database is not answering.')));

    expect(options.items()).toEqual([]);
    expect(options.failure()).toBe('The stations could not be loaded: The database is not answering. Reload the page to try again.');
  });
});

describe('SelectOptionsFailure', () => {
  it('when one of the lists failed, then only its sentence is shown as an alert', () => {
    const fixture = TestBed.createComponent(Host);
    const good = load(of({ items: [], total: 0, page: 0, pageSize: 200 }));
    const bad = load(throwError(() => new Error('offline')));
    fixture.componentInstance.options.set([good, bad]);
    fixture.detectChanges();

    const alerts = [...(fixture.nativeElement as HTMLElement).querySelectorAll('[role="alert"]')].map((alert) => alert.textContent?.trim());

    expect(alerts).toEqual(['The stations could not be loaded: the server did not answer. Reload the page to try again.']);
  });
});
