import type { InkLineStatus, KnotInput, PinInput } from '@shared/api/ink-lines';
import type { RegistrationFit } from '@shared/domain/registration';
import type { DbOrTrx } from '../db/database';
import { PG_FOREIGN_KEY_VIOLATION, pgErrorCode } from '../db/pg-errors';
import { AppError, HTTP } from '../errors/app-error';

export async function insertPinSet(
  db: DbOrTrx,
  pinSet: { scanId: string; createdBy: string; pins: PinInput[]; fit: RegistrationFit },
): Promise<string> {
  try {
    const { id } = await db
      .insertInto('pin_set')
      .values({
        scan_id: pinSet.scanId,
        created_by: pinSet.createdBy,
        pins: JSON.stringify(pinSet.pins),
        model: pinSet.fit.model,
        rms_hpa: pinSet.fit.rmsHpa,
        rms_minutes: pinSet.fit.rmsMinutes,
        fit: JSON.stringify(pinSet.fit),
      })
      .returning('id')
      .executeTakeFirstOrThrow();
    return id;
  } catch (error) {
    // The scan row is locked by the caller, so the only reference that can vanish is the person.
    if (pgErrorCode(error) === PG_FOREIGN_KEY_VIOLATION) throw new AppError(HTTP.unauthorized, 'unauthenticated', 'Your account no longer exists.');
    throw error;
  }
}

export async function insertInkLine(
  db: DbOrTrx,
  inkLine: { scanId: string; pinSetId: string; authorId: string; status: InkLineStatus; knots: KnotInput[] },
): Promise<{ id: string; version: number; status: InkLineStatus }> {
  return db
    .insertInto('ink_line')
    .values({
      scan_id: inkLine.scanId,
      pin_set_id: inkLine.pinSetId,
      author_id: inkLine.authorId,
      status: inkLine.status,
      knots: JSON.stringify(inkLine.knots),
    })
    .returning(['id', 'version', 'status'])
    .executeTakeFirstOrThrow();
}

/**
 * Hands in the author's own draft row (a reworked, returned line keeps its id): new pin set and knots, its
 * old points dropped (the caller stores the new ones), status handed in, version bumped.
 */
export async function handInDraftRow(
  db: DbOrTrx,
  draft: { inkLineId: string; pinSetId: string; knots: KnotInput[] },
): Promise<{ id: string; version: number; status: InkLineStatus }> {
  await db.deleteFrom('series_point').where('ink_line_id', '=', draft.inkLineId).execute();
  return db
    .updateTable('ink_line')
    .set((eb) => ({
      pin_set_id: draft.pinSetId,
      knots: JSON.stringify(draft.knots),
      status: 'handed_in' as const,
      version: eb('version', '+', 1),
      updated_at: new Date(),
    }))
    .where('id', '=', draft.inkLineId)
    .where('status', '=', 'draft')
    .returning(['id', 'version', 'status'])
    .executeTakeFirstOrThrow();
}
