import { signal, type Signal } from '@angular/core';
import { toSignal } from '@angular/core/rxjs-interop';
import type { Page } from '@shared/api/paging';
import { catchError, map, type Observable, of } from 'rxjs';

import { problemText } from '../../core/http/problem-text';

/** The choices of a select (stations, chart forms…), and why they are missing when their load failed. */
export interface SelectOptions<T> {
  readonly items: Signal<readonly T[]>;
  /** Null while loading and after a good load; a sentence naming what failed otherwise. */
  readonly failure: Signal<string | null>;
}

/**
 * Loads a select's choices once. A failed load leaves the select empty and says so (shown by
 * `isl-select-options-failure`): an empty list alone reads as "there are none", which sends an archivist off to
 * register a station that exists. Call in an injection context (a field initializer).
 */
export function loadSelectOptions<T>(source: Observable<Page<T>>, what: string): SelectOptions<T> {
  const failure = signal<string | null>(null);
  const items = toSignal(
    source.pipe(
      map((page): readonly T[] => page.items),
      catchError((error: unknown) => {
        const reason = problemText(error, 'the server did not answer').replace(/\.$/, '');
        failure.set(`${what} could not be loaded: ${reason}. Reload the page to try again.`);
        return of([] as readonly T[]);
      }),
    ),
    { initialValue: [] as readonly T[] },
  );
  return { items, failure: failure.asReadonly() };
}
