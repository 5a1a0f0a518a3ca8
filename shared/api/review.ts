import type { InkLineStatus, KnotInput, PinInput, PinResidualView } from './ink-lines';
import type { SeriesFlag } from './series';
import type { CorrectionsApplied } from './correction-words';
import type { ChartForm } from '../domain/chart-form';
import type { ClockMarkKind } from '../domain/clock-correction';
import type { CheckReadingUse } from '../domain/pipeline/robust-instrument';
import type { RegistrationFit } from '../domain/registration';
import { FieldReader, type Parsed } from './field-reader';

/** How two independent ink lines of one chart agree over their common span (see shared/domain/line-agreement.ts). */
export interface CrossTraceAgreementView {
  otherInkLineId: string;
  commonPointCount: number;
  /** Root mean square of the differences, hPa; null when the lines share fewer than two times. */
  rmsHpa: number | null;
  maxDifferenceHpa: number | null;
  /** The shift of the other line, minutes, that aligns the two best (positive: the other line runs late). */
  bestOffsetMinutes: number | null;
  /** Common times where the two differ by more than twice their combined uncertainty. */
  disagreeingPointCount: number;
}

/** One row of the review list: what an archivist needs to decide on a handed-in ink line. */
export interface ReviewRow {
  inkLineId: string;
  scanId: string;
  stationId: string | null;
  stationName: string | null;
  /** ISO 8601 UTC. */
  chartStart: string | null;
  originalName: string;
  box: string;
  authorId: string;
  authorName: string;
  status: InkLineStatus;
  /** Optimistic-edit counter of the ink line; send it back with a decision. */
  version: number;
  /** ISO 8601 UTC: when the line was handed in (or last changed). */
  handedInAt: string;
  pinRmsHpa: number;
  pinRmsMinutes: number;
  /** First and last hourly point of the line, ISO 8601 UTC; null without points. */
  spanFrom: string | null;
  spanTo: string | null;
  pointCount: number;
  /** Stretches with no points between two points (more than an hour apart). */
  gapCount: number;
  /** Share 0–1 of the line's points flagged suspect or off scale. */
  suspectShare: number;
  /** The clock and instrument corrections the hand-in applied (counts of the marks and readings used). */
  corrections: CorrectionsApplied;
  /** Agreement with a cross-trace of the same chart; null when there is none yet. */
  agreement: CrossTraceAgreementView | null;
}

export const REVIEW_STATES = ['handed_in', 'approved', 'returned'] as const satisfies readonly InkLineStatus[];
export type ReviewState = (typeof REVIEW_STATES)[number];

/** Query of GET /api/review (all optional; state defaults to handed_in). Oldest first. */
export interface ReviewFilters {
  stationId?: string;
  /** ISO 8601 UTC or YYYY-MM-DD: charts whose chart start lies in [from, to]. */
  from?: string;
  to?: string;
  authorId?: string;
  state?: ReviewState;
}

export interface StoredPointView {
  time: string;
  pressureHpa: number;
  uncertaintyHpa: number | null;
  flag: SeriesFlag;
}

/** One decision in the line's review history. */
export interface ReviewHistoryEntry {
  decision: 'approved' | 'returned';
  note: string;
  personName: string;
  at: string;
}

/** The line as drawn on the review page: pins, residuals, knots and its hourly points. */
export interface ReviewedLine {
  inkLineId: string;
  authorName: string;
  status: InkLineStatus;
  pins: PinInput[];
  residuals: PinResidualView[];
  knots: KnotInput[];
  points: StoredPointView[];
}

/** One clock mark of the line (a time mark, chart on or chart off) and its residual. */
export interface ClockMarkView {
  kind: ClockMarkKind;
  /** ISO 8601 UTC: the time read off the chart at the mark, and the true time written for it. */
  chartTime: string;
  trueTime: string;
  /** True minus chart time, minutes. */
  errorMinutes: number;
  /** True time minus what the other marks predict for it, minutes; null when too few marks remain. */
  leaveOneOutMinutes: number | null;
  /** Left out of the fit: it contradicted the others. */
  isDropped: boolean;
}

/** The clock correction applied at hand-in (shared/domain/clock-correction.ts). */
export interface ClockCorrectionView {
  method: 'offset' | 'rate' | 'piecewise';
  firstOffsetMinutes: number;
  rateMinutesPerDay: number;
  rmsMinutes: number;
  marks: ClockMarkView[];
}

/** One check reading the instrument fit used, and its residual. */
export interface CheckReadingView {
  /** ISO 8601 UTC. */
  time: string;
  /** Barometer minus chart, hPa. */
  offsetHpa: number;
  /** The reading minus what the others predict, hPa; null with a single reading. */
  residualHpa: number | null;
}

/** The instrument correction applied at hand-in (shared/domain/instrument-correction.ts). */
export interface InstrumentCorrectionView {
  method: 'offset' | 'drift' | 'scale';
  meanOffsetHpa: number;
  penDriftHpaPerWeek: number | null;
  rmsHpa: number;
  readings: CheckReadingView[];
}

/** The corrections of the line and their residuals; null members were not applied. */
export interface ReviewCorrections {
  clock: ClockCorrectionView | null;
  instrument: InstrumentCorrectionView | null;
  /** One entry per check reading the volunteer gave, in their order. */
  checkReadingUses: CheckReadingUse[];
}

/** GET /api/ink-lines/:id/review: everything the review page shows. */
export interface ReviewDetail {
  row: ReviewRow;
  scan: { id: string; widthPx: number; heightPx: number; status: string; chartFormName: string | null };
  /** The registration limits the hand-in was checked against (per chart form). */
  pinRmsLimit: { hPa: number; minutes: number };
  /** The scan's chart form and the line's fitted registration: together they place the ghost grid on the scan. */
  chartForm: ChartForm | null;
  registration: Pick<RegistrationFit, 'model' | 'paperToPixel' | 'penArmRadiusMm'>;
  corrections: ReviewCorrections;
  line: ReviewedLine;
  history: ReviewHistoryEntry[];
  /** The other independent line of the chart, when there is one handed in or approved. */
  crossTrace: (ReviewedLine & { agreement: CrossTraceAgreementView | null }) | null;
}

/** Body of POST /api/ink-lines/:id/approve and /rework. */
export interface InkLineVersionInput {
  version: number;
}

/** Body of POST /api/ink-lines/:id/return: the note says what to fix (required). */
export interface InkLineReturnInput {
  version: number;
  note: string;
}

/** Answer of a decision or a rework. */
export interface InkLineDecisionResult {
  inkLineId: string;
  scanId: string;
  status: InkLineStatus;
  version: number;
  /** The scan's status after the decision (it follows its ink lines). */
  scanStatus: string;
}

export const MAX_REVIEW_NOTE_LENGTH = 2000;

export function parseInkLineVersionInput(body: unknown): Parsed<InkLineVersionInput> {
  const reader = new FieldReader(body);
  const version = reader.integer('version', 1);
  if (version === undefined) reader.problem('version', 'version must be the ink line version you read');
  reader.refuseUnreadKeys();
  if (!reader.isValid) return { ok: false, details: reader.details };
  return { ok: true, value: { version: version as number } };
}

export function parseInkLineReturnInput(body: unknown): Parsed<InkLineReturnInput> {
  const reader = new FieldReader(body);
  const version = reader.integer('version', 1);
  if (version === undefined) reader.problem('version', 'version must be the ink line version you read');
  const note = reader.text('note', { isRequired: true, maxLength: MAX_REVIEW_NOTE_LENGTH });
  if (note === undefined) reader.problem('note', 'a note that says what to fix is required');
  reader.refuseUnreadKeys();
  if (!reader.isValid) return { ok: false, details: reader.details };
  return { ok: true, value: { version: version as number, note: note as string } };
}
