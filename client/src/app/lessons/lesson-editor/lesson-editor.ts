import { DOCUMENT } from '@angular/common';
import { ChangeDetectionStrategy, Component, computed, DestroyRef, effect, inject, input, signal } from '@angular/core';
import { takeUntilDestroyed } from '@angular/core/rxjs-interop';
import { FormsModule } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatInputModule } from '@angular/material/input';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { Router, RouterLink } from '@angular/router';
import type { CandidateDecision, ChartRegion, FrontCandidateView, FrontNoteInput, LessonDetail, LessonPassage, QuestionInput } from '@shared/api/lessons';
import { switchMap, tap } from 'rxjs';

import { ApiError } from '../../core/http/api-error';
import { saveBlob } from '../../shared/object-url/object-url';
import { ChartRegionFigure, type RegionMark } from '../../shared/chart-region-figure/chart-region-figure';
import { type LessonChange, LessonsApi } from '../lessons-api';
import { LessonPlot } from '../lesson-plot/lesson-plot';
import { derivedText, formatUtc, kindLabel, noteWhen, passageAltText, toMinuteIso } from '../lesson-text';
import { draftOf, inputOf, type NoteDraft } from '../note-draft';
import { NoteForm } from '../note-form/note-form';
import { RegionImages } from '../region-images/region-images';
import { SharePanel } from '../share-panel/share-panel';

/** The default kind of an accepted candidate: a trough-then-rise is most often a cold front; the teacher may change it. */
function kindOfCandidate(candidate: FrontCandidateView): NoteDraft['kind'] {
  return candidate.kind === 'front' ? 'cold_front' : 'pressure_jump';
}

/**
 * Builds a lesson: the passage's plot and chart regions, the front candidates to accept or dismiss, front
 * notes with derived values and chart marks, questions, share links, the handout and the Web Annotation export.
 * Every change is saved with the version read (a stale one says so and reloads nothing by itself).
 */
@Component({
  selector: 'isl-lesson-editor',
  imports: [FormsModule, MatButtonModule, MatFormFieldModule, MatIconModule, MatInputModule, MatProgressBarModule, RouterLink, LessonPlot, ChartRegionFigure, NoteForm, SharePanel],
  templateUrl: './lesson-editor.html',
  styleUrl: './lesson-editor.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class LessonEditor {
  private readonly lessonsApi = inject(LessonsApi);
  private readonly destroyRef = inject(DestroyRef);
  private readonly router = inject(Router);
  private readonly document = inject(DOCUMENT);
  private readonly regionImages = new RegionImages(inject(DestroyRef));

  /** From the route (withComponentInputBinding). */
  readonly lessonId = input.required<string>();

  protected readonly lesson = signal<LessonDetail | null>(null);
  protected readonly passage = signal<LessonPassage | null>(null);
  protected readonly imageUrls = signal<Partial<Record<number, string>>>({});
  protected readonly failure = signal<string | null>(null);
  protected readonly isSaving = signal(false);
  protected readonly draft = signal<NoteDraft | null>(null);
  protected readonly markingShape = signal<'point' | 'box' | null>(null);
  private readonly boxCorner = signal<{ regionIndex: number; xPx: number; yPx: number } | null>(null);
  protected readonly details = signal({ title: '', audience: '', description: '' });
  protected readonly newQuestion = signal({ text: '', answer: '' });

  protected readonly timeDomainMs = computed((): [number, number] | null => {
    const lesson = this.lesson();
    return lesson ? [Date.parse(lesson.from), Date.parse(lesson.to)] : null;
  });
  protected readonly period = computed(() => {
    const lesson = this.lesson();
    return lesson ? `${formatUtc(lesson.from)} to ${formatUtc(lesson.to)}` : '';
  });
  protected readonly notes = computed(() =>
    (this.lesson()?.notes ?? []).map((note, index) => ({ note, number: index + 1, label: kindLabel(note.kind), when: noteWhen(note), derivedLine: derivedText(note.derived) })),
  );
  protected readonly altText = computed(() => passageAltText(`Station pressure at ${this.lesson()?.stationName ?? ''}, ${this.period()}`, this.lesson()?.notes ?? []));
  protected readonly candidates = computed(() => {
    const decisions = this.lesson()?.candidateDecisions ?? {};
    return (this.passage()?.candidates ?? []).map((candidate) => ({
      candidate,
      decision: (decisions[candidate.key] as CandidateDecision | undefined) ?? null,
      label: candidate.kind === 'front' ? 'Front candidate: lowest point, then a sustained rise' : 'Pressure jump candidate: a sudden rise',
      when: formatUtc(candidate.time),
      detail:
        candidate.kind === 'front'
          ? `${candidate.depthHpa.toFixed(1)} hPa below its shoulders, then rising ${candidate.rateHpaPerHour.toFixed(1)} hPa/h`
          : `rises ${candidate.depthHpa.toFixed(1)} hPa, up to ${candidate.rateHpaPerHour.toFixed(1)} hPa/h`,
    }));
  });
  protected readonly figures = computed(() => {
    const regions = this.passage()?.regions ?? [];
    const draft = this.draft();
    return regions.map((region) => {
      const marks: RegionMark[] = this.notes().flatMap(({ note, number }) =>
        note.mark && note.mark.scanId === region.scanId && note.id !== draft?.id ? [{ number, ...note.mark }] : [],
      );
      if (draft?.mark && draft.mark.scanId === region.scanId) marks.push({ number: 0, ...draft.mark });
      return {
        region,
        marks,
        caption: `Scan of the barogram, ${formatUtc(region.from)} to ${formatUtc(region.to)}; the traced pen line in cyan.`,
        altText: passageAltText(`Barograph chart, ${formatUtc(region.from)} to ${formatUtc(region.to)}, with the pen line traced`, this.lesson()?.notes ?? []),
      };
    });
  });

  constructor() {
    effect(() => this.load(this.lessonId()));
  }

  protected saveDetails(): void {
    this.save(this.details());
  }

  protected acceptCandidate(candidate: FrontCandidateView): void {
    const lesson = this.lesson();
    if (!lesson) return;
    const note: FrontNoteInput = { kind: kindOfCandidate(candidate), text: '', time: candidate.time, endTime: null, mark: null, showDerived: true, candidateKey: candidate.key };
    this.save({ notes: [...lesson.notes.map(inputOf), note], candidateDecisions: { ...lesson.candidateDecisions, [candidate.key]: 'accepted' } }, (saved) => {
      // Open the new note, so the teacher can move it, name its kind and mark it on the chart.
      const created = saved.notes.find((n) => n.candidateKey === candidate.key);
      if (created) this.draft.set(draftOf(created));
    });
  }

  protected dismissCandidate(candidate: FrontCandidateView): void {
    const lesson = this.lesson();
    if (lesson) this.save({ candidateDecisions: { ...lesson.candidateDecisions, [candidate.key]: 'dismissed' } });
  }

  /** Takes back a dismissal: the candidate is offered again. (An accepted one is undone by deleting its note.) */
  protected reopenCandidate(candidate: FrontCandidateView): void {
    const lesson = this.lesson();
    if (!lesson) return;
    const { [candidate.key]: _dismissed, ...others } = lesson.candidateDecisions;
    this.save({ candidateDecisions: others });
  }

  protected startNote(): void {
    const lesson = this.lesson();
    if (!lesson) return;
    this.draft.set({ kind: 'none', text: '', time: toMinuteIso(lesson.from), endTime: '', showDerived: false, candidateKey: null, mark: null });
  }

  protected editNote(noteId: string): void {
    const note = this.lesson()?.notes.find((n) => n.id === noteId);
    if (note) this.draft.set(draftOf(note));
  }

  protected saveNote(input: FrontNoteInput): void {
    const lesson = this.lesson();
    if (!lesson) return;
    const others = lesson.notes.filter((note) => note.id !== input.id).map(inputOf);
    this.save({ notes: [...others, input] }, () => this.closeDraft());
  }

  protected deleteNote(noteId: string): void {
    const lesson = this.lesson();
    if (!lesson) return;
    // A note made from a candidate takes its acceptance with it, so the candidate is offered again.
    const key = lesson.notes.find((note) => note.id === noteId)?.candidateKey;
    const decisions = { ...lesson.candidateDecisions };
    if (key) delete decisions[key];
    this.save({ notes: lesson.notes.filter((note) => note.id !== noteId).map(inputOf), candidateDecisions: decisions });
  }

  protected updateDraft(draft: NoteDraft): void {
    this.draft.set(draft);
  }

  protected closeDraft(): void {
    this.draft.set(null);
    this.markingShape.set(null);
    this.boxCorner.set(null);
  }

  protected requestMark(shape: 'point' | 'box' | null): void {
    this.markingShape.set(shape);
    this.boxCorner.set(null);
  }

  /** A click on a chart while marking: a point at once, a box from two opposite corners on the same chart. */
  protected placeMark(region: ChartRegion, at: { xPx: number; yPx: number }): void {
    const shape = this.markingShape();
    const draft = this.draft();
    if (!shape || !draft || !region.scanId) return;
    if (shape === 'point') {
      this.draft.set({ ...draft, mark: { scanId: region.scanId, shape: 'point', xPx: at.xPx, yPx: at.yPx, widthPx: null, heightPx: null } });
      this.markingShape.set(null);
      return;
    }
    const corner = this.boxCorner();
    if (!corner || corner.regionIndex !== region.index) {
      this.boxCorner.set({ regionIndex: region.index, ...at });
      return;
    }
    const xPx = Math.min(corner.xPx, at.xPx);
    const yPx = Math.min(corner.yPx, at.yPx);
    const widthPx = Math.max(1, Math.abs(at.xPx - corner.xPx));
    const heightPx = Math.max(1, Math.abs(at.yPx - corner.yPx));
    this.draft.set({ ...draft, mark: { scanId: region.scanId, shape: 'box', xPx, yPx, widthPx, heightPx } });
    this.markingShape.set(null);
    this.boxCorner.set(null);
  }

  protected addQuestion(): void {
    const lesson = this.lesson();
    const { text, answer } = this.newQuestion();
    if (!lesson || text.trim() === '') return;
    const question: QuestionInput = { text: text.trim(), answer: answer.trim() === '' ? null : answer.trim() };
    this.save({ questions: [...lesson.questions, question] }, () => this.newQuestion.set({ text: '', answer: '' }));
  }

  protected deleteQuestion(questionId: string): void {
    const lesson = this.lesson();
    if (lesson) this.save({ questions: lesson.questions.filter((question) => question.id !== questionId) });
  }

  protected exportAnnotations(): void {
    const lesson = this.lesson();
    if (!lesson) return;
    this.lessonsApi
      .annotations(lesson.id)
      .pipe(takeUntilDestroyed(this.destroyRef))
      .subscribe({
        next: (blob) => saveBlob(blob, `lesson-${lesson.stationCode}-${lesson.from.slice(0, 10)}.jsonld`, this.document),
        error: (error: unknown) => this.failure.set(error instanceof ApiError ? error.message : 'The export failed.'),
      });
  }

  protected copyLesson(): void {
    const lesson = this.lesson();
    if (!lesson) return;
    this.lessonsApi
      .copy(lesson.id)
      .pipe(takeUntilDestroyed(this.destroyRef))
      .subscribe({
        next: (copy) => void this.router.navigate(['/lessons', copy.id]),
        error: (error: unknown) => this.failure.set(error instanceof ApiError ? error.message : 'The lesson could not be copied.'),
      });
  }

  protected updateDetails(key: 'title' | 'audience' | 'description', value: string): void {
    this.details.update((current) => ({ ...current, [key]: value }));
  }

  protected updateNewQuestion(key: 'text' | 'answer', value: string): void {
    this.newQuestion.update((current) => ({ ...current, [key]: value }));
  }

  private save(change: Omit<LessonChange, 'version'>, done: (saved: LessonDetail) => void = () => undefined): void {
    const lesson = this.lesson();
    if (!lesson) return;
    this.isSaving.set(true);
    this.failure.set(null);
    this.lessonsApi
      .update(lesson.id, { ...change, version: lesson.version })
      .pipe(takeUntilDestroyed(this.destroyRef))
      .subscribe({
        next: (saved) => {
          this.isSaving.set(false);
          this.setLesson(saved);
          done(saved);
        },
        error: (error: unknown) => {
          this.isSaving.set(false);
          const message = error instanceof ApiError ? [error.message, ...Object.entries(error.details).map(([key, text]) => `${key}: ${text}`)].join(' ') : 'The change could not be saved.';
          this.failure.set(message);
        },
      });
  }

  private setLesson(lesson: LessonDetail): void {
    this.lesson.set(lesson);
    this.details.set({ title: lesson.title, audience: lesson.audience, description: lesson.description });
  }

  private load(lessonId: string): void {
    this.lessonsApi
      .get(lessonId)
      .pipe(
        tap((lesson) => this.setLesson(lesson)),
        switchMap(() => this.lessonsApi.passage(lessonId)),
        tap((passage) => this.passage.set(passage)),
        switchMap((passage) => this.regionImages.load(passage.regions, (path) => this.lessonsApi.regionImage(path))),
        takeUntilDestroyed(this.destroyRef),
      )
      .subscribe({
        next: (urls) => this.imageUrls.set(urls),
        error: (error: unknown) => this.failure.set(error instanceof ApiError ? error.message : 'The lesson could not be loaded.'),
      });
  }
}
