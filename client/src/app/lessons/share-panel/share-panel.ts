import { DOCUMENT } from '@angular/common';
import { ChangeDetectionStrategy, Component, DestroyRef, inject, input, signal } from '@angular/core';
import { takeUntilDestroyed } from '@angular/core/rxjs-interop';
import { FormsModule } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatInputModule } from '@angular/material/input';
import { MatPaginatorModule } from '@angular/material/paginator';
import type { ShareLink } from '@shared/api/lessons';
import type { Observable } from 'rxjs';

import { ApiError } from '../../core/http/api-error';
import { createPagedList } from '../../shared/paged-list/paged-list';
import { parseUtcDay } from '../../series/series-range';
import { LessonsApi, shareLinkUrl } from '../lessons-api';
import { formatUtc } from '../lesson-text';

/** The end of a typed UTC day (YYYY-MM-DD) as an ISO instant; null for an empty field; undefined when not a day. */
export function expiryOfDay(day: string): string | null | undefined {
  if (day.trim() === '') return null;
  const startMs = parseUtcDay(day);
  return startMs === null ? undefined : new Date(startMs + 86_400_000 - 1000).toISOString();
}

/** A lesson's share links: make one (with an optional expiry), see how often each was opened, change its expiry, revoke it. */
@Component({
  selector: 'isl-share-panel',
  imports: [FormsModule, MatButtonModule, MatFormFieldModule, MatIconModule, MatInputModule, MatPaginatorModule],
  templateUrl: './share-panel.html',
  styleUrl: './share-panel.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class SharePanel {
  private readonly lessonsApi = inject(LessonsApi);
  private readonly destroyRef = inject(DestroyRef);
  private readonly document = inject(DOCUMENT);

  readonly lessonId = input.required<string>();

  protected readonly list = createPagedList<ShareLink, never>({
    initialQuery: { page: 0, pageSize: 10, direction: 'asc' },
    sortKeys: [],
    load: (query) => this.lessonsApi.shares(this.lessonId(), query),
    failureMessage: 'The share links could not be loaded.',
  });
  protected readonly newExpiryDay = signal('');
  protected readonly failure = signal<string | null>(null);
  protected readonly copiedId = signal<string | null>(null);
  protected readonly formatUtc = formatUtc;

  protected linkOf(share: ShareLink): string {
    return shareLinkUrl(this.document.location.origin, share.token);
  }

  protected createLink(): void {
    const expiresAt = expiryOfDay(this.newExpiryDay());
    if (expiresAt === undefined) {
      this.failure.set('The expiry is a UTC day, YYYY-MM-DD, or empty for none.');
      return;
    }
    this.run(this.lessonsApi.createShare(this.lessonId(), expiresAt), () => this.newExpiryDay.set(''));
  }

  protected setExpiry(share: ShareLink, day: string): void {
    const expiresAt = expiryOfDay(day);
    if (expiresAt === undefined) {
      this.failure.set('The expiry is a UTC day, YYYY-MM-DD, or empty for none.');
      return;
    }
    this.run(this.lessonsApi.updateShare(this.lessonId(), share.id, { expiresAt }));
  }

  protected revoke(share: ShareLink): void {
    this.run(this.lessonsApi.updateShare(this.lessonId(), share.id, { revoked: true }));
  }

  protected copyLink(share: ShareLink): void {
    void this.document.defaultView?.navigator.clipboard?.writeText(this.linkOf(share)).then(() => this.copiedId.set(share.id));
  }

  private run(call: Observable<ShareLink>, done: () => void = () => undefined): void {
    this.failure.set(null);
    call.pipe(takeUntilDestroyed(this.destroyRef)).subscribe({
      next: () => {
        done();
        this.list.reload();
      },
      error: (error: unknown) => this.failure.set(error instanceof ApiError ? [error.message, ...Object.values(error.details)].join(' ') : 'The share link could not be saved.'),
    });
  }
}
