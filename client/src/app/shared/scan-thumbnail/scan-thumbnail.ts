import { ChangeDetectionStrategy, Component, DestroyRef, inject, input } from '@angular/core';
import { toObservable, toSignal } from '@angular/core/rxjs-interop';
import { catchError, map, of, switchMap } from 'rxjs';

import { ScansApi } from '../../core/api/scans-api';
import { ObjectUrlHolder } from '../object-url/object-url';

/** Longest side of a catalogue thumbnail, px (twice the shown size, for sharp lines on dense screens). */
const THUMBNAIL_SIDE_PX = 160;

/** A small picture of a scan through IIIF, shown once its derivatives are ready. */
@Component({
  selector: 'isl-scan-thumbnail',
  template: `
    @if (url(); as url) {
      <img [src]="url" alt="" />
    } @else {
      <span class="blank"></span>
    }
  `,
  styles: `
    :host { display: inline-flex; width: 80px; height: 34px; align-items: center; justify-content: center; border-radius: 4px; overflow: hidden; background: var(--isl-paper); }
    img { max-width: 100%; max-height: 100%; display: block; }
    .blank { width: 100%; height: 100%; }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class ScanThumbnail {
  private readonly scansApi = inject(ScansApi);
  private readonly urls = new ObjectUrlHolder(inject(DestroyRef));

  readonly scanId = input.required<string>();
  /** Only ask when the worker has made the derivatives; before that the request would only fail. */
  readonly isReady = input(false);

  protected readonly url = toSignal(
    toObservable(this.isReady).pipe(
      switchMap((isReady) =>
        isReady
          ? this.scansApi.iiifImage(this.scanId(), THUMBNAIL_SIDE_PX).pipe(
              map((blob) => this.urls.replace(blob)),
              catchError(() => of(null)),
            )
          : of(null),
      ),
    ),
  );
}
