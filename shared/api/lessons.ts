import { z } from 'zod';
import { normalizeInstant, type Parsed } from './field-reader';
import { parseWith } from './parse-with';
import type { SeriesPoint } from './series';

/** Kinds of a front note: the fronts and pressure features of the trade, or none. */
export const FRONT_NOTE_KINDS = ['cold_front', 'warm_front', 'occluded_front', 'trough', 'ridge', 'squall_line', 'pressure_jump', 'none'] as const;
export type FrontNoteKind = (typeof FRONT_NOTE_KINDS)[number];

/** How a kind reads in the UI, the handout and the Web Annotation export. */
export const FRONT_NOTE_KIND_LABELS: Record<FrontNoteKind, string> = {
  cold_front: 'Cold front',
  warm_front: 'Warm front',
  occluded_front: 'Occluded front',
  trough: 'Trough',
  ridge: 'Ridge',
  squall_line: 'Squall line',
  pressure_jump: 'Pressure jump',
  none: 'Note',
};

/** Longest passage a lesson may hold, days (a lesson is a few days around a front, not a season). */
export const MAX_LESSON_DAYS = 14;
export const MAX_LESSON_NOTES = 100;
export const MAX_LESSON_QUESTIONS = 50;
const MAX_TITLE = 200;
const MAX_TEXT = 4000;

const instant = z
  .string()
  .refine((value) => normalizeInstant(value) !== null, 'must be an ISO 8601 instant with Z or an offset, e.g. 2026-03-03T15:00Z')
  .transform((value) => normalizeInstant(value) as string);
const id = z.uuid({ message: 'must be an id' });

/** A mark on a scan's IIIF canvas, in the canvas's (the full image's) pixels: a point, or a box when width and height are given. */
export const chartMarkSchema = z.strictObject({
  scanId: id,
  shape: z.enum(['point', 'box']),
  xPx: z.number().min(0),
  yPx: z.number().min(0),
  widthPx: z.number().positive().nullable(),
  heightPx: z.number().positive().nullable(),
});
export type ChartMark = z.infer<typeof chartMarkSchema>;

/** A front note: at `time`, or over `time`–`endTime`; `showDerived` puts the tendency and the change beside it. */
export const frontNoteInputSchema = z.strictObject({
  id: id.optional(),
  kind: z.enum(FRONT_NOTE_KINDS),
  text: z.string().trim().max(MAX_TEXT),
  time: instant,
  endTime: instant.nullable(),
  mark: chartMarkSchema.nullable(),
  showDerived: z.boolean(),
  /** The front candidate this note was accepted from (its key), or null for a note of the teacher's own. */
  candidateKey: z.string().max(100).nullable(),
});
export type FrontNoteInput = z.input<typeof frontNoteInputSchema>;

export const questionInputSchema = z.strictObject({
  id: id.optional(),
  text: z.string().trim().min(1, 'a question needs its text').max(MAX_TEXT),
  /** Hidden on the shared page until the pupil reveals it; null for an open question. */
  answer: z.string().trim().max(MAX_TEXT).nullable(),
});
export type QuestionInput = z.input<typeof questionInputSchema>;

export const CANDIDATE_DECISIONS = ['accepted', 'dismissed'] as const;
export type CandidateDecision = (typeof CANDIDATE_DECISIONS)[number];

const lessonFields = {
  title: z.string().trim().min(1, 'a lesson needs a title').max(MAX_TITLE),
  audience: z.string().trim().max(MAX_TITLE),
  description: z.string().trim().max(MAX_TEXT),
};

/** What a teacher sends to start a lesson: a station and a passage (from ≤ to, at most MAX_LESSON_DAYS). */
export const lessonCreateSchema = z
  .strictObject({ ...lessonFields, stationId: id, from: instant, to: instant })
  .superRefine(checkPassage);
export type LessonCreate = z.output<typeof lessonCreateSchema>;

/** A change to a lesson: the version read, and any fields to replace (lists are replaced whole). */
export const lessonPatchSchema = z
  .strictObject({
    version: z.number().int().min(1),
    title: lessonFields.title.optional(),
    audience: lessonFields.audience.optional(),
    description: lessonFields.description.optional(),
    from: instant.optional(),
    to: instant.optional(),
    notes: z.array(frontNoteInputSchema).max(MAX_LESSON_NOTES).optional(),
    questions: z.array(questionInputSchema).max(MAX_LESSON_QUESTIONS).optional(),
    candidateDecisions: z.record(z.string().max(100), z.enum(CANDIDATE_DECISIONS)).optional(),
  })
  .superRefine((patch, context) => {
    if ((patch.from === undefined) !== (patch.to === undefined)) context.addIssue({ code: 'custom', path: ['to'], message: 'from and to change together' });
    else if (patch.from !== undefined && patch.to !== undefined) checkPassage({ from: patch.from, to: patch.to }, context);
    patch.notes?.forEach((note, index) => {
      if (note.endTime !== null && Date.parse(note.endTime) < Date.parse(note.time)) {
        context.addIssue({ code: 'custom', path: ['notes', index, 'endTime'], message: 'endTime must not be before time' });
      }
      if (note.mark && note.mark.shape === 'box' && (note.mark.widthPx === null || note.mark.heightPx === null)) {
        context.addIssue({ code: 'custom', path: ['notes', index, 'mark', 'widthPx'], message: 'a box needs widthPx and heightPx' });
      }
    });
  });
export type LessonPatch = z.output<typeof lessonPatchSchema>;

function checkPassage(value: { from: string; to: string }, context: z.RefinementCtx): void {
  const spanMs = Date.parse(value.to) - Date.parse(value.from);
  if (spanMs <= 0) context.addIssue({ code: 'custom', path: ['to'], message: 'to must be after from' });
  else if (spanMs > MAX_LESSON_DAYS * 86_400_000) context.addIssue({ code: 'custom', path: ['to'], message: `a passage is at most ${MAX_LESSON_DAYS} days` });
}

/** A share link's settings: when it stops working (null: never), or revoked for good. */
export const shareLinkCreateSchema = z.strictObject({ expiresAt: instant.nullable() });
export const shareLinkPatchSchema = z
  .strictObject({ expiresAt: instant.nullable().optional(), revoked: z.literal(true).optional() })
  .refine((patch) => patch.expiresAt !== undefined || patch.revoked !== undefined, { message: 'name expiresAt or revoked', path: ['expiresAt'] });
export type ShareLinkCreate = z.output<typeof shareLinkCreateSchema>;
export type ShareLinkPatch = z.output<typeof shareLinkPatchSchema>;

export { parseWith };

export const parseLessonCreate = (body: unknown) => parseWith(lessonCreateSchema, body);
export const parseLessonPatch = (body: unknown) => parseWith(lessonPatchSchema, body);
export const parseShareLinkCreate = (body: unknown) => parseWith(shareLinkCreateSchema, body);
export const parseShareLinkPatch = (body: unknown) => parseWith(shareLinkPatchSchema, body);

/** Which lessons a list holds: the teacher's own, their own with a live share link, or other teachers' shared ones to copy. */
export const LESSON_SCOPES = ['mine', 'shared', 'others'] as const;
export type LessonScope = (typeof LESSON_SCOPES)[number];
export const LESSON_SORT_KEYS = ['updated', 'title'] as const;
export type LessonSortKey = (typeof LESSON_SORT_KEYS)[number];

export interface ShareLink {
  id: string;
  /** The unguessable part of the address; the page is `/shared/<token>`. */
  token: string;
  createdAt: string;
  expiresAt: string | null;
  revokedAt: string | null;
  openCount: number;
  lastOpenedAt: string | null;
  /** Neither revoked nor expired. */
  isLive: boolean;
}

export interface LessonSummary {
  id: string;
  title: string;
  audience: string;
  stationId: string;
  stationName: string;
  from: string;
  to: string;
  ownerId: string;
  ownerName: string;
  noteCount: number;
  questionCount: number;
  /** The live share links (in the `shared` list; the others carry only the count). */
  liveShares: ShareLink[];
  liveShareCount: number;
  updatedAt: string;
  version: number;
}

/** Derived values beside a note (shared/domain/pressure-tendency.ts and pressure-change.ts). */
export interface NoteDerivedValues {
  /** Three-hour tendency ending at the note's time (its end for a span), WMO code table 0200; null when the series is not known there. */
  tendency: { amountHpa: number; ppp: number; characteristic: number; group: string } | null;
  /** Fall or rise over the note's span (the three hours before a note at a time): hPa and hPa per hour. */
  change: { fromTime: string; toTime: string; changeHpa: number; rateHpaPerHour: number } | null;
}

export interface FrontNote {
  id: string;
  kind: FrontNoteKind;
  text: string;
  time: string;
  endTime: string | null;
  mark: ChartMark | null;
  showDerived: boolean;
  candidateKey: string | null;
  /** Filled when showDerived is set. */
  derived: NoteDerivedValues | null;
}

export interface Question {
  id: string;
  text: string;
  answer: string | null;
}

export interface LessonDetail {
  id: string;
  title: string;
  audience: string;
  description: string;
  stationId: string;
  stationName: string;
  stationCode: string;
  from: string;
  to: string;
  ownerId: string;
  ownerName: string;
  /** The lesson it was copied from, if any. */
  copiedFromId: string | null;
  notes: FrontNote[];
  questions: Question[];
  candidateDecisions: Record<string, CandidateDecision>;
  /** True when the caller may change it (its teacher, or an admin). */
  isEditable: boolean;
  createdAt: string;
  updatedAt: string;
  version: number;
}

/** A suggestion of shared/domain/front-candidates.ts, with a key stable for the same series. */
export interface FrontCandidateView {
  key: string;
  kind: 'front' | 'pressure_jump';
  time: string;
  depthHpa: number;
  rateHpaPerHour: number;
}

/** A region of one scan that the passage came from, with the ink line inside it. */
export interface ChartRegion {
  index: number;
  /** Only in the teacher's view; a share link's view names no scan. */
  scanId?: string;
  /** IIIF region in the canvas's pixels. */
  region: { xPx: number; yPx: number; widthPx: number; heightPx: number };
  /** The ink line's knots inside the region, canvas pixels. */
  inkLine: { xPx: number; yPx: number }[];
  /** The part of the passage this chart covers. */
  from: string;
  to: string;
  /** Where the image of the region is served (teacher route or the share link's own path). */
  imagePath: string;
}

/** The passage of a lesson: its station series, the charts it came from and the front candidates in it. */
export interface LessonPassage {
  points: SeriesPoint[];
  truncated: boolean;
  regions: ChartRegion[];
  candidates: FrontCandidateView[];
}

/** What a share link shows: the lesson (without its teacher's id) and its passage. */
export interface SharedLesson {
  title: string;
  audience: string;
  description: string;
  stationName: string;
  from: string;
  to: string;
  notes: (Omit<FrontNote, 'mark'> & { mark: (Omit<ChartMark, 'scanId'> & { regionIndex: number }) | null })[];
  questions: Question[];
  passage: LessonPassage;
  /** The caution line of the handout. */
  caution: string;
  source: string;
}

/** The region a mark on a scan falls in (or the first of that scan), or undefined when the scan is not in the passage. */
export function regionOfMark(regions: readonly ChartRegion[], mark: { scanId: string; xPx: number; yPx: number }): ChartRegion | undefined {
  const ofScan = regions.filter((region) => region.scanId === mark.scanId);
  return (
    ofScan.find(
      (region) =>
        mark.xPx >= region.region.xPx &&
        mark.xPx <= region.region.xPx + region.region.widthPx &&
        mark.yPx >= region.region.yPx &&
        mark.yPx <= region.region.yPx + region.region.heightPx,
    ) ?? ofScan[0]
  );
}

/** The source line of a shared page and handout. */
export function lessonSourceLine(stationName: string, stationCode: string, teacherName: string): string {
  return `Station series of ${stationName} (${stationCode}), digitized in Isallo from the station's barograms; lesson by ${teacherName}.`;
}

/** Shown on every shared page and handout (the README's caution, short). */
export const LESSON_CAUTION =
  'Digitized historical pressures serve research and teaching; they are not for aviation altimeter settings or navigation.';
