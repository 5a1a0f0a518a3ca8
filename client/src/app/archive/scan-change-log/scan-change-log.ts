import { ChangeDetectionStrategy, Component, inject, input } from '@angular/core';
import { toObservable, toSignal } from '@angular/core/rxjs-interop';
import type { ScanChangeLogEntry } from '@shared/api/scans';
import { catchError, combineLatest, map, of, switchMap } from 'rxjs';

import { ScansApi } from '../../core/api/scans-api';
import { ApiError } from '../../core/http/api-error';
import { ChangeLogList, type ChangeLogView } from '../change-log-list/change-log-list';

const ACTION_LABELS: Record<ScanChangeLogEntry['action'], string> = { upload: 'uploaded', edit: 'edited', status: 'status changed', inventory: 'filled from the inventory', review: 'ink line reviewed' };

/** The scan's change log: who changed what and when, newest first, with each field's value before and after. */
@Component({
  selector: 'isl-scan-change-log',
  imports: [ChangeLogList],
  template: `<isl-change-log-list [view]="view()" [actionLabels]="actionLabels" />`,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class ScanChangeLog {
  private readonly scansApi = inject(ScansApi);

  readonly scanId = input.required<string>();
  /** Bump to reload. */
  readonly refresh = input(0);

  protected readonly actionLabels = ACTION_LABELS;
  protected readonly view = toSignal(
    combineLatest([toObservable(this.scanId), toObservable(this.refresh)]).pipe(
      switchMap(([scanId]) =>
        this.scansApi.changeLog(scanId, { page: 0, pageSize: 100, direction: 'desc' }).pipe(
          map((page): ChangeLogView => ({ entries: page.items, total: page.total, failure: null })),
          catchError((error: unknown) => of<ChangeLogView>({ entries: [], total: 0, failure: error instanceof ApiError ? error.message : 'The change log could not be loaded.' })),
        ),
      ),
    ),
  );
}
