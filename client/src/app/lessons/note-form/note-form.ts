import { ChangeDetectionStrategy, Component, computed, input, output, signal } from '@angular/core';
import { FormsModule } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatCheckboxModule } from '@angular/material/checkbox';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatInputModule } from '@angular/material/input';
import { MatSelectModule } from '@angular/material/select';
import { FRONT_NOTE_KINDS, type FrontNoteInput } from '@shared/api/lessons';

import { kindLabel } from '../lesson-text';
import { type NoteDraft, readDraft } from '../note-draft';

/**
 * The form of one front note: kind, text, time or span, derived values on or off, and the mark on the chart
 * (the page takes the click on the chart while `markingShape` is set, and sends the mark back in `draft`).
 */
@Component({
  selector: 'isl-note-form',
  imports: [FormsModule, MatButtonModule, MatCheckboxModule, MatFormFieldModule, MatIconModule, MatInputModule, MatSelectModule],
  templateUrl: './note-form.html',
  styleUrl: './note-form.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class NoteForm {
  /** The note being edited; the page replaces it when a mark is placed. */
  readonly draft = input.required<NoteDraft>();
  readonly markingShape = input<'point' | 'box' | null>(null);
  readonly hasCharts = input(false);
  readonly isSaving = input(false);
  readonly saved = output<FrontNoteInput>();
  readonly cancelled = output<void>();
  readonly draftChange = output<NoteDraft>();
  readonly markRequested = output<'point' | 'box' | null>();

  protected readonly kinds = FRONT_NOTE_KINDS.map((kind) => ({ kind, label: kindLabel(kind) }));
  protected readonly problems = signal<Record<string, string>>({});
  protected readonly problemList = computed(() => Object.values(this.problems()));
  protected readonly markText = computed(() => {
    const mark = this.draft().mark;
    if (!mark) return 'No mark on the chart.';
    return mark.shape === 'point' ? `A point on the chart at ${Math.round(mark.xPx)}, ${Math.round(mark.yPx)} px.` : `A box on the chart, ${Math.round(mark.widthPx ?? 0)} × ${Math.round(mark.heightPx ?? 0)} px.`;
  });

  protected change<K extends keyof NoteDraft>(key: K, value: NoteDraft[K]): void {
    this.draftChange.emit({ ...this.draft(), [key]: value });
  }

  protected save(): void {
    const read = readDraft(this.draft());
    if ('problems' in read) {
      this.problems.set(read.problems);
      return;
    }
    this.problems.set({});
    this.saved.emit(read.input);
  }
}
