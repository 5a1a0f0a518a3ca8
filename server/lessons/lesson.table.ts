import type { ColumnType, Generated, JSONColumnType } from 'kysely';
import type { CandidateDecision, ChartMark, FrontNoteKind } from '@shared/api/lessons';

/** A front note as stored (derived values are computed when read). */
export interface StoredFrontNote {
  id: string;
  kind: FrontNoteKind;
  text: string;
  time: string;
  endTime: string | null;
  mark: ChartMark | null;
  showDerived: boolean;
  candidateKey: string | null;
}

export interface StoredQuestion {
  id: string;
  text: string;
  answer: string | null;
}

export interface LessonTable {
  id: Generated<string>;
  owner_id: string;
  station_id: string;
  title: string;
  audience: string;
  description: string;
  passage_from: Date;
  passage_to: Date;
  notes: JSONColumnType<StoredFrontNote[]>;
  questions: JSONColumnType<StoredQuestion[]>;
  candidate_decisions: JSONColumnType<Record<string, CandidateDecision>>;
  copied_from_id: string | null;
  version: Generated<number>;
  created_at: ColumnType<Date, Date | undefined, never>;
  updated_at: ColumnType<Date, Date | undefined, Date>;
}

export interface LessonShareTable {
  id: Generated<string>;
  lesson_id: string;
  token: string;
  created_by: string;
  created_at: ColumnType<Date, Date | undefined, never>;
  expires_at: Date | null;
  revoked_at: Date | null;
  open_count: Generated<number>;
  last_opened_at: Date | null;
}
