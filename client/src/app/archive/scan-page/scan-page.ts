import { DatePipe, DecimalPipe } from '@angular/common';
import { ChangeDetectionStrategy, Component, DestroyRef, inject, input } from '@angular/core';
import { toObservable, toSignal } from '@angular/core/rxjs-interop';
import { MatButtonModule } from '@angular/material/button';
import { MatIconModule } from '@angular/material/icon';
import { RouterLink } from '@angular/router';
import { catchError, map, of, switchMap } from 'rxjs';

import { ScansApi } from '../../core/api/scans-api';
import { ApiError } from '../../core/http/api-error';
import { ObjectUrlHolder } from '../../shared/object-url/object-url';
import { ScanStatusChip } from '../../shared/scan-status-chip/scan-status-chip';

/** One scan's catalogue entry with its preview. */
@Component({
  selector: 'isl-scan-page',
  imports: [DatePipe, DecimalPipe, RouterLink, MatButtonModule, MatIconModule, ScanStatusChip],
  templateUrl: './scan-page.html',
  styleUrl: './scan-page.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class ScanPage {
  private readonly scansApi = inject(ScansApi);
  private readonly previewUrls = new ObjectUrlHolder(inject(DestroyRef));

  /** From the route parameter. */
  readonly scanId = input.required<string>();

  protected readonly scan = toSignal(
    toObservable(this.scanId).pipe(
      switchMap((scanId) =>
        this.scansApi.get(scanId).pipe(
          map((scan) => ({ scan, failure: null })),
          catchError((error: unknown) => of({ scan: null, failure: error instanceof ApiError ? error.message : 'The scan could not be loaded.' })),
        ),
      ),
    ),
  );
  protected readonly previewUrl = toSignal(
    toObservable(this.scanId).pipe(
      switchMap((scanId) =>
        this.scansApi.preview(scanId).pipe(
          map((blob) => this.previewUrls.replace(blob)),
          catchError(() => of(null)),
        ),
      ),
    ),
  );
}
