import { DatePipe } from '@angular/common';
import { ChangeDetectionStrategy, Component, inject, input } from '@angular/core';
import { toObservable, toSignal } from '@angular/core/rxjs-interop';
import { MatIconModule } from '@angular/material/icon';
import type { ScanChangeLogEntry } from '@shared/api/scans';
import { catchError, combineLatest, map, of, switchMap } from 'rxjs';

import { ScansApi } from '../../core/api/scans-api';
import { ApiError } from '../../core/http/api-error';
import { changeLogFieldLabel, changeLogValueText } from './change-log-text';

interface AuditView {
  entries: ScanChangeLogEntry[];
  total: number;
  failure: string | null;
}

const ACTION_LABELS: Record<ScanChangeLogEntry['action'], string> = { upload: 'uploaded', edit: 'edited', status: 'status changed', inventory: 'filled from the inventory', review: 'ink line reviewed' };

/** The scan's change log: who changed what and when, newest first, with each field's value before and after. */
@Component({
  selector: 'isl-scan-change-log',
  imports: [DatePipe, MatIconModule],
  template: `
    @if (view(); as view) {
      @if (view.failure) {
        <p class="isl-inline-error" role="alert">{{ view.failure }}</p>
      }
      <ol class="entries" data-testid="change-log">
        @for (entry of view.entries; track entry.id) {
          <li class="entry" data-testid="change-log-entry" [attr.data-action]="entry.action">
            <div class="head">
              <b>{{ entry.personName }}</b> {{ actionLabels[entry.action] }}
              <span class="isl-muted">{{ entry.at | date: 'yyyy-MM-dd HH:mm:ss' : 'UTC' }} UTC</span>
            </div>
            <table class="changes">
              @for (field of fieldsOf(entry); track field) {
                <tr>
                  <th scope="row">{{ fieldLabel(field) }}</th>
                  <td class="before">{{ text(entry.changes[field].before, field, entry.names) }}</td>
                  <td class="arrow"><mat-icon>arrow_forward</mat-icon></td>
                  <td class="after">{{ text(entry.changes[field].after, field, entry.names) }}</td>
                </tr>
              }
            </table>
          </li>
        } @empty {
          <li class="isl-muted">No changes recorded yet.</li>
        }
      </ol>
      @if (view.total > view.entries.length) {
        <p class="isl-muted">Showing the latest {{ view.entries.length }} of {{ view.total }} changes.</p>
      }
    }
  `,
  styles: `
    .entries { list-style: none; margin: 0; padding: 12px 0 0; }
    .entry { padding: 6px 0; border-bottom: 1px solid var(--mat-sys-outline-variant); font: var(--mat-sys-body-medium); }
    .head { display: flex; flex-wrap: wrap; gap: 6px; align-items: baseline; }
    .changes { border-collapse: collapse; margin-top: 2px; font: var(--mat-sys-body-small); width: 100%; }
    th { text-align: left; font-weight: 500; padding-right: 8px; color: var(--mat-sys-on-surface-variant); white-space: nowrap; vertical-align: top; }
    .before { color: var(--mat-sys-on-surface-variant); text-decoration: line-through; overflow-wrap: anywhere; }
    .after { overflow-wrap: anywhere; }
    .arrow mat-icon { font-size: 14px; width: 14px; height: 14px; }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class ScanChangeLog {
  private readonly scansApi = inject(ScansApi);

  readonly scanId = input.required<string>();
  /** Bump to reload. */
  readonly refresh = input(0);

  protected readonly actionLabels = ACTION_LABELS;
  protected readonly text = changeLogValueText;
  protected readonly fieldLabel = changeLogFieldLabel;
  protected readonly view = toSignal(
    combineLatest([toObservable(this.scanId), toObservable(this.refresh)]).pipe(
      switchMap(([scanId]) =>
        this.scansApi.changeLog(scanId, { page: 0, pageSize: 100, direction: 'desc' }).pipe(
          map((page): AuditView => ({ entries: page.items, total: page.total, failure: null })),
          catchError((error: unknown) => of<AuditView>({ entries: [], total: 0, failure: error instanceof ApiError ? error.message : 'The change log could not be loaded.' })),
        ),
      ),
    ),
  );

  protected fieldsOf(entry: ScanChangeLogEntry): string[] {
    return Object.keys(entry.changes);
  }
}
