import { ChangeDetectionStrategy, Component, inject, input } from '@angular/core';
import { toObservable, toSignal } from '@angular/core/rxjs-interop';
import type { Register, RegisterChangeAction } from '@shared/api/register-changes';
import { catchError, combineLatest, map, of, switchMap } from 'rxjs';

import { ApiError } from '../../core/http/api-error';
import { ChangeLogList, type ChangeLogView } from '../change-log-list/change-log-list';
import { RegisterChangesApi } from '../register-changes-api';

const ACTION_LABELS: Record<RegisterChangeAction, string> = { create: 'created', edit: 'edited', hand_in_again: 'handed in again' };

/** A station's, instrument's or chart form's change log, newest first, as the scan change log shows its own. */
@Component({
  selector: 'isl-register-change-log',
  imports: [ChangeLogList],
  template: `<isl-change-log-list [view]="view()" [actionLabels]="actionLabels" />`,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class RegisterChangeLog {
  private readonly api = inject(RegisterChangesApi);

  readonly register = input.required<Register>();
  readonly recordId = input.required<string>();
  /** Bump to reload (after an edit on the same page). */
  readonly refresh = input(0);

  protected readonly actionLabels = ACTION_LABELS;
  protected readonly view = toSignal(
    combineLatest([toObservable(this.register), toObservable(this.recordId), toObservable(this.refresh)]).pipe(
      switchMap(([register, recordId]) =>
        this.api.changeLog(register, recordId, { page: 0, pageSize: 100, direction: 'desc' }).pipe(
          map((page): ChangeLogView => ({ entries: page.items, total: page.total, failure: null })),
          catchError((error: unknown) => of<ChangeLogView>({ entries: [], total: 0, failure: error instanceof ApiError ? error.message : 'The change log could not be loaded.' })),
        ),
      ),
    ),
  );
}
