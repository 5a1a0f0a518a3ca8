import type { FrontNoteInput } from '@shared/api/lessons';
import type { Db } from '../db/database';
import * as lessonsService from '../lessons/lessons.service';

const HOUR_MS = 3_600_000;
export const DEMO_LESSON_TITLE = 'Kestrel Ridge, March 2026: a cold front passes (demo)';

/**
 * The demo teacher's lesson around the traced chart's front: the passage from a day before the lowest pressure
 * to a day and a half after, the front candidate accepted as a note, one question with its answer, and a share
 * link, so a teacher who signs in to the demo sees a finished lesson beside the empty form. Nothing is made when
 * the series holds no front (the lesson would have nothing to show), or when the lesson is there already (a seed
 * run again after it stopped half-way).
 */
export async function seedDemoLesson(db: Db, teacherId: string, stationId: string, chartStartMs: number): Promise<void> {
  const existing = await db.selectFrom('lesson').select('id').where('owner_id', '=', teacherId).where('title', '=', DEMO_LESSON_TITLE).executeTakeFirst();
  if (existing) return;
  const caller = { id: teacherId, isAdmin: false };
  const created = await lessonsService.createLesson(db, caller, {
    title: DEMO_LESSON_TITLE,
    audience: 'Year 10 geography',
    description: 'Three days of pressure from one barograph chart: the fall ahead of a front, the trough, and the sharp rise behind it.',
    stationId,
    from: new Date(chartStartMs).toISOString(),
    to: new Date(chartStartMs + 3 * 24 * HOUR_MS).toISOString(),
  });
  const passage = await lessonsService.getPassage(db, caller, created.id);
  const front = passage.candidates.find((candidate) => candidate.kind === 'front');
  if (!front) {
    await lessonsService.deleteLesson(db, caller, created.id, created.version);
    return;
  }
  const note: FrontNoteInput = {
    kind: 'cold_front',
    text: 'The pressure bottoms out as the front passes, then rises quickly in the colder air behind it.',
    time: front.time,
    endTime: null,
    mark: null,
    showDerived: true,
    candidateKey: front.key,
  };
  const updated = await lessonsService.updateLesson(db, caller, created.id, {
    version: created.version,
    notes: [note],
    questions: [{ text: 'Read the chart: how many hours after the lowest pressure did the rise slow down?', answer: null }],
    candidateDecisions: { [front.key]: 'accepted' },
  });
  await lessonsService.createShare(db, caller, updated.id, { expiresAt: null });
}
