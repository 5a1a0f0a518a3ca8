import { BreakpointObserver } from '@angular/cdk/layout';
import { ChangeDetectionStrategy, Component, computed, inject, input, signal } from '@angular/core';
import { toSignal } from '@angular/core/rxjs-interop';
import { MatButtonModule } from '@angular/material/button';
import type { ChartRegion, FrontNoteKind, NoteDerivedValues, Question } from '@shared/api/lessons';
import type { SeriesPoint } from '@shared/api/series';
import { map } from 'rxjs';

import { ChartRegionFigure, type RegionMark } from '../../shared/chart-region-figure/chart-region-figure';
import { LessonPlot } from '../lesson-plot/lesson-plot';
import { derivedText, formatUtc, kindLabel, noteWhen, passageAltText } from '../lesson-text';

/** A note as the handout shows it; its mark names the chart region it sits on. */
export interface ViewNote {
  id: string;
  kind: FrontNoteKind;
  text: string;
  time: string;
  endTime: string | null;
  derived: NoteDerivedValues | null;
  mark: { regionIndex: number; shape: 'point' | 'box'; xPx: number; yPx: number; widthPx: number | null; heightPx: number | null } | null;
}

/** Everything the handout shows: the same for a share link and for the teacher's own preview. */
export interface LessonViewModel {
  title: string;
  audience: string;
  description: string;
  stationName: string;
  from: string;
  to: string;
  notes: ViewNote[];
  questions: Question[];
  points: SeriesPoint[];
  regions: Omit<ChartRegion, 'imagePath' | 'scanId'>[];
  caution: string;
  source: string;
}

/**
 * A lesson as pupils see it and as the handout prints: the plot, the chart regions with the ink line and the
 * marks, the notes in time order with their derived values, the questions with answers hidden until revealed,
 * and the source and caution line. Its print style sheet lays it out on A4.
 */
@Component({
  selector: 'isl-lesson-view',
  imports: [MatButtonModule, LessonPlot, ChartRegionFigure],
  templateUrl: './lesson-view.html',
  styleUrl: './lesson-view.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class LessonView {
  readonly lesson = input.required<LessonViewModel>();
  /** Image address of each region, by index (an object URL for the teacher, the link-scoped path on a share page). */
  readonly imageUrls = input<Readonly<Partial<Record<number, string>>>>({});

  private readonly revealed = signal<ReadonlySet<string>>(new Set());
  protected readonly isNarrow = toSignal(inject(BreakpointObserver).observe('(max-width: 600px)').pipe(map((state) => state.matches)), { initialValue: false });

  protected readonly period = computed(() => `${formatUtc(this.lesson().from)} to ${formatUtc(this.lesson().to)}`);
  protected readonly timeDomainMs = computed((): [number, number] => [Date.parse(this.lesson().from), Date.parse(this.lesson().to)]);
  protected readonly notes = computed(() =>
    this.lesson()
      .notes.slice()
      .sort((a, b) => Date.parse(a.time) - Date.parse(b.time))
      .map((note, index) => ({ ...note, number: index + 1, label: kindLabel(note.kind), when: noteWhen(note), derivedLine: derivedText(note.derived) })),
  );
  protected readonly altText = computed(() => passageAltText(`Station pressure at ${this.lesson().stationName}, ${this.period()}`, this.lesson().notes));
  protected readonly figures = computed(() =>
    this.lesson().regions.map((region) => {
      const marks: RegionMark[] = this.notes().flatMap((note) =>
        note.mark && note.mark.regionIndex === region.index ? [{ number: note.number, ...note.mark }] : [],
      );
      const onThisChart = this.notes().filter((note) => note.mark?.regionIndex === region.index);
      return {
        region,
        marks,
        caption: `Barogram of ${this.lesson().stationName}, ${formatUtc(region.from)} to ${formatUtc(region.to)}; the traced pen line in cyan.`,
        altText: passageAltText(`Scan of the barograph chart, ${formatUtc(region.from)} to ${formatUtc(region.to)}, with the pen line traced`, onThisChart),
      };
    }),
  );

  protected isRevealed(questionId: string): boolean {
    return this.revealed().has(questionId);
  }

  protected toggleAnswer(questionId: string): void {
    this.revealed.update((current) => {
      const next = new Set(current);
      if (next.has(questionId)) next.delete(questionId);
      else next.add(questionId);
      return next;
    });
  }
}
