import type { ColumnType, Generated, JSONColumnType } from 'kysely';
import type { PinInput } from '@shared/api/ink-lines';
import type { RegistrationFit } from '@shared/domain/registration';

export interface PinSetTable {
  id: Generated<string>;
  scan_id: string;
  created_by: string;
  pins: JSONColumnType<PinInput[]>;
  /** The registration model's name, as the fit reports it. */
  model: string;
  rms_hpa: number;
  rms_minutes: number;
  /** The whole RegistrationFit, kept so a later reading uses exactly the fit the volunteer saw. */
  fit: JSONColumnType<RegistrationFit>;
  created_at: ColumnType<Date, Date | undefined, never>;
}
