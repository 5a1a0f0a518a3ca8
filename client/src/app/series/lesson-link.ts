import { MAX_LESSON_DAYS } from '@shared/api/lessons';

/** The query parameters of /lessons/new for a station and range, or why the range cannot start a lesson. */
export type LessonLink = { queryParams: { stationId: string; from: string; to: string } } | { problem: string };

/** /lessons/new reads stationId, from and to (ISO 8601 UTC); a lesson's passage is at most MAX_LESSON_DAYS. */
export function lessonLinkFor(stationId: string, viewMs: readonly [number, number]): LessonLink {
  if (viewMs[1] - viewMs[0] > MAX_LESSON_DAYS * 86_400_000) return { problem: `A lesson covers at most ${MAX_LESSON_DAYS} days: brush a shorter range to start one.` };
  return { queryParams: { stationId, from: new Date(Math.round(viewMs[0])).toISOString(), to: new Date(Math.round(viewMs[1])).toISOString() } };
}
