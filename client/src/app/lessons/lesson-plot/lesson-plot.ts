import { ChangeDetectionStrategy, Component, computed, input } from '@angular/core';
import type { CandidateDecision, FrontCandidateView, FrontNoteKind } from '@shared/api/lessons';
import type { SeriesPoint } from '@shared/api/series';

import { gapBracketPath } from '../../shared/plot-marks/gap-brackets';
import { findGapEnds } from '../../shared/pressure-plot/plot-gaps';
import { buildLinePath, createPlotScales, medianStepMs, type PlotBox } from '../../shared/pressure-plot/plot-scales';
import { pressureTicks, timeTicks } from '../../shared/pressure-plot/plot-ticks';
import { kindLabel } from '../lesson-text';

const BOX: PlotBox = { width: 960, height: 340, marginLeft: 56, marginRight: 16, marginTop: 14, marginBottom: 36 };
/** On a phone the same text size needs a narrower drawing: fewer user units across, so labels stay readable. */
const NARROW_BOX: PlotBox = { width: 440, height: 300, marginLeft: 44, marginRight: 10, marginTop: 14, marginBottom: 32 };
const GAP_FACTOR = 3;
/** One line width of the gap brackets, plot units (the series plot's). */
const BRACKET_UNIT = 0.75;

/** A note as the plot draws it. */
export interface PlotNote {
  id: string;
  kind: FrontNoteKind;
  time: string;
  endTime: string | null;
}

/**
 * The passage's station series with its front notes (a line at a time, a band over a span) and the front
 * candidates still to decide (open triangles) or accepted (filled). The SVG carries the text alternative given.
 */
@Component({
  selector: 'isl-lesson-plot',
  templateUrl: './lesson-plot.svg',
  styleUrl: './lesson-plot.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class LessonPlot {
  readonly points = input.required<readonly SeriesPoint[]>();
  readonly timeDomainMs = input.required<[number, number]>();
  readonly notes = input<readonly PlotNote[]>([]);
  readonly candidates = input<readonly FrontCandidateView[]>([]);
  readonly decisions = input<Readonly<Record<string, CandidateDecision>>>({});
  /** The text alternative: what the plot shows and the notes in time order. */
  readonly altText = input.required<string>();

  /** Draw for a narrow screen (fewer ticks, larger type relative to the width). */
  readonly isNarrow = input(false);

  protected readonly box = computed(() => (this.isNarrow() ? NARROW_BOX : BOX));
  private readonly scales = computed(() => createPlotScales(this.points(), this.box(), this.timeDomainMs()));
  private readonly maxStepMs = computed(() => {
    const step = medianStepMs(this.points()) * GAP_FACTOR;
    return step > 0 ? step : Number.POSITIVE_INFINITY;
  });
  protected readonly linePath = computed(() => buildLinePath(this.points(), this.scales(), this.maxStepMs()));
  /** Gaps are drawn as on the Bench and the series plot. */
  protected readonly gapBrackets = computed(() => findGapEnds(this.points(), this.scales(), this.maxStepMs()).map((ends) => gapBracketPath(ends.before, ends.after, BRACKET_UNIT)));
  protected readonly xTicks = computed(() => timeTicks(this.scales(), this.box(), this.isNarrow() ? 3 : 6));
  protected readonly yTicks = computed(() => pressureTicks(this.scales(), this.isNarrow() ? 4 : 6));
  protected readonly noteMarks = computed(() => {
    const { x } = this.scales();
    const [startMs, endMs] = this.timeDomainMs();
    const clamp = (ms: number) => x(new Date(Math.min(endMs, Math.max(startMs, ms))));
    return this.notes()
      .slice()
      .sort((a, b) => Date.parse(a.time) - Date.parse(b.time))
      .map((note, index) => {
        const x1 = clamp(Date.parse(note.time));
        const x2 = note.endTime === null ? x1 : clamp(Date.parse(note.endTime));
        return { id: note.id, x1, width: Math.max(0, x2 - x1), isSpan: note.endTime !== null, number: index + 1, title: kindLabel(note.kind) };
      });
  });
  protected readonly candidateMarks = computed(() => {
    const { x, y } = this.scales();
    const points = this.points();
    return this.candidates()
      .filter((candidate) => this.decisions()[candidate.key] !== 'dismissed')
      .map((candidate) => {
        const timeMs = Date.parse(candidate.time);
        const at = points.find((point) => Date.parse(point.time) === timeMs);
        const cx = x(new Date(timeMs));
        const cy = at ? y(at.pressureHpa) + 10 : this.box().height - this.box().marginBottom - 8;
        return {
          key: candidate.key,
          path: `M${cx},${cy} l-6,10 h12 z`,
          isAccepted: this.decisions()[candidate.key] === 'accepted',
          title: candidate.kind === 'front' ? 'Front candidate' : 'Pressure jump candidate',
        };
      });
  });
}
