import type { Kysely, Transaction } from 'kysely';
import type { ApiTokenTable } from '../api-tokens/api-token.table';
import type { ScanAuditTable } from '../audit/scan-audit.table';
import type { ChartFormTable } from '../chart-forms/chart-form.table';
import type { DemoSeedTable } from '../demo/demo-seed.table';
import type { ChartClaimTable, StationTracingTable, TracePriorityTable } from '../desk/desk.table';
import type { InkLineTable } from '../ink-lines/ink-line.table';
import type { PinSetTable } from '../ink-lines/pin-set.table';
import type { InstrumentTable } from '../instruments/instrument.table';
import type { IntakeBatchTable, IntakeFileTable } from '../intake/intake.table';
import type { LessonShareTable, LessonTable } from '../lessons/lesson.table';
import type { InvitationTable, PasswordResetTable } from '../people/invitation.table';
import type { PeopleChangeTable } from '../people/people-change.table';
import type { RegisterChangeTable } from '../audit/register-change.table';
import type { PersonRoleTable, PersonTable } from '../people/person.table';
import type { CrossTraceAgreementTable, InkLineReviewTable } from '../review/review.table';
import type { ScanTable } from '../scans/scan.table';
import type { SeriesChangeTable } from '../series/series-change.table';
import type { SeriesPointTable } from '../series/series-point.table';
import type { StationSeriesAggregateTable, StationSeriesPointTable, StationSeriesStateTable } from '../series/station-series.table';
import type { StationTable } from '../stations/station.table';

/** Every table, keyed by its SQL name; each feature owns its `*.table.ts`. */
export interface Database {
  person: PersonTable;
  person_role: PersonRoleTable;
  station: StationTable;
  chart_form: ChartFormTable;
  scan: ScanTable;
  pin_set: PinSetTable;
  ink_line: InkLineTable;
  series_point: SeriesPointTable;
  demo_seed: DemoSeedTable;
  instrument: InstrumentTable;
  intake_batch: IntakeBatchTable;
  intake_file: IntakeFileTable;
  scan_audit: ScanAuditTable;
  series_change: SeriesChangeTable;
  lesson: LessonTable;
  lesson_share: LessonShareTable;
  invitation: InvitationTable;
  password_reset: PasswordResetTable;
  people_change: PeopleChangeTable;
  register_change: RegisterChangeTable;
  ink_line_review: InkLineReviewTable;
  cross_trace_agreement: CrossTraceAgreementTable;
  station_tracing: StationTracingTable;
  trace_priority: TracePriorityTable;
  chart_claim: ChartClaimTable;
  station_series_point: StationSeriesPointTable;
  station_series_hourly: StationSeriesAggregateTable;
  station_series_daily: StationSeriesAggregateTable;
  station_series_state: StationSeriesStateTable;
  api_token: ApiTokenTable;
}

export type Db = Kysely<Database>;
/** A db or a transaction: repositories take either, so a service can group calls in one transaction. */
export type DbOrTrx = Kysely<Database> | Transaction<Database>;
