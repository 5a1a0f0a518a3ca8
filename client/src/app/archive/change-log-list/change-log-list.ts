import { DatePipe } from '@angular/common';
import { ChangeDetectionStrategy, Component, input } from '@angular/core';
import { MatIconModule } from '@angular/material/icon';

import { changeLogFieldLabel, changeLogValueText } from '../scan-change-log/change-log-text';

/** One entry of any change log (the scan's or a register's): who changed which fields, when, before and after. */
export interface ChangeLogEntryView {
  id: string;
  at: string;
  personName: string;
  action: string;
  changes: Record<string, { before: unknown; after: unknown }>;
  /** Names of the ids the entry mentions, when the log sends them. */
  names?: Record<string, string>;
}

/** A loaded page of a change log, or why it could not be loaded. */
export interface ChangeLogView {
  entries: ChangeLogEntryView[];
  total: number;
  failure: string | null;
}

/** Shows a change log, newest first, with each field's value before and after; the scan and register logs share it. */
@Component({
  selector: 'isl-change-log-list',
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
              <b>{{ entry.personName }}</b> {{ actionLabels()[entry.action] ?? entry.action }}
              <span class="isl-muted">{{ entry.at | date: 'yyyy-MM-dd HH:mm:ss' : 'UTC' }} UTC</span>
            </div>
            <table class="changes">
              @for (field of fieldsOf(entry); track field) {
                <tr>
                  <th scope="row">{{ fieldLabel(field) }}</th>
                  <td class="before">{{ text(entry.changes[field].before, field, entry.names ?? {}) }}</td>
                  <td class="arrow"><mat-icon>arrow_forward</mat-icon></td>
                  <td class="after">{{ text(entry.changes[field].after, field, entry.names ?? {}) }}</td>
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
export class ChangeLogList {
  readonly view = input.required<ChangeLogView | undefined>();
  /** Words for each action code of this log. */
  readonly actionLabels = input.required<Readonly<Record<string, string>>>();

  protected readonly text = changeLogValueText;
  protected readonly fieldLabel = changeLogFieldLabel;

  protected fieldsOf(entry: ChangeLogEntryView): string[] {
    return Object.keys(entry.changes);
  }
}
