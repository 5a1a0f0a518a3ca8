import type { Migration } from 'kysely';
import * as createPerson from './2026_12_02_0100_create_person';
import * as createPersonRole from './2026_12_02_0110_create_person_role';
import * as createStation from './2026_12_02_0120_create_station';
import * as createChartForm from './2026_12_02_0130_create_chart_form';
import * as createScan from './2026_12_02_0140_create_scan';
import * as createPinSet from './2026_12_02_0150_create_pin_set';
import * as createInkLine from './2026_12_02_0160_create_ink_line';
import * as createSeriesPoint from './2026_12_02_0170_create_series_point';
import * as createDemoSeed from './2026_12_02_0180_create_demo_seed';
import * as extendStation from './2026_12_02_0400_extend_station';
import * as createInstrument from './2026_12_02_0410_create_instrument';
import * as addChartFormVersion from './2026_12_02_0420_add_chart_form_version';
import * as createIntakeBatch from './2026_12_02_0430_create_intake_batch';
import * as createIntakeFile from './2026_12_02_0440_create_intake_file';
import * as extendScan from './2026_12_02_0450_extend_scan';
import * as createScanAudit from './2026_12_02_0460_create_scan_audit';
import * as addScanSortIndexes from './2026_12_02_0470_add_scan_sort_indexes';
import * as addScanSpanBtree from './2026_12_02_0480_add_scan_span_btree';
import * as indexScanSpanLength from './2026_12_02_0490_index_scan_span_length';
import * as renameScanChartStart from './2026_12_03_0600_rename_scan_chart_start';
import * as createSeriesChange from './2026_12_03_0610_create_series_change';
import * as createLesson from './2026_12_03_1200_create_lesson';
import * as createLessonShare from './2026_12_03_1210_create_lesson_share';
import * as addInkLineDraftWork from './2026_12_04_0800_add_ink_line_draft_work';
import * as addPersonSessionVersion from './2026_12_04_1300_add_person_session_version';
import * as addPersonVersion from './2026_12_04_1310_add_person_version';
import * as createInvitation from './2026_12_04_1320_create_invitation';
import * as createPasswordReset from './2026_12_04_1330_create_password_reset';
import * as createPeopleChange from './2026_12_04_1340_create_people_change';
import * as addSeriesBucketJson from './2026_12_05_1130_add_series_bucket_json';
import * as createInkLineReview from './2026_12_04_0900_create_ink_line_review';
import * as createStationTracing from './2026_12_04_0910_create_station_tracing';
import * as createTracePriority from './2026_12_04_0920_create_trace_priority';
import * as createChartClaim from './2026_12_04_0930_create_chart_claim';
import * as createCrossTraceAgreement from './2026_12_04_0940_create_cross_trace_agreement';
import * as allowReviewAudit from './2026_12_04_0950_allow_review_audit';
import * as createStationSeries from './2026_12_04_1100_create_station_series';
import * as recordExistingSeriesLines from './2026_12_04_1110_record_existing_series_lines';
import * as createApiToken from './2026_12_04_1120_create_api_token';
import * as createRegisterChange from './2026_12_04_1400_create_register_change';

/**
 * Every migration, by name. A static list rather than a folder scan, so that the same code loads under
 * tsx and under jest's swc transform (which does not support the dynamic import a folder scan needs).
 * Add each new migration here; names sort by date, which is the order they run in.
 */
export const MIGRATIONS: Record<string, Migration> = {
  '2026_12_02_0100_create_person': createPerson,
  '2026_12_02_0110_create_person_role': createPersonRole,
  '2026_12_02_0120_create_station': createStation,
  '2026_12_02_0130_create_chart_form': createChartForm,
  '2026_12_02_0140_create_scan': createScan,
  '2026_12_02_0150_create_pin_set': createPinSet,
  '2026_12_02_0160_create_ink_line': createInkLine,
  '2026_12_02_0170_create_series_point': createSeriesPoint,
  '2026_12_02_0180_create_demo_seed': createDemoSeed,
  '2026_12_02_0400_extend_station': extendStation,
  '2026_12_02_0410_create_instrument': createInstrument,
  '2026_12_02_0420_add_chart_form_version': addChartFormVersion,
  '2026_12_02_0430_create_intake_batch': createIntakeBatch,
  '2026_12_02_0440_create_intake_file': createIntakeFile,
  '2026_12_02_0450_extend_scan': extendScan,
  '2026_12_02_0460_create_scan_audit': createScanAudit,
  '2026_12_02_0470_add_scan_sort_indexes': addScanSortIndexes,
  '2026_12_02_0480_add_scan_span_btree': addScanSpanBtree,
  '2026_12_02_0490_index_scan_span_length': indexScanSpanLength,
  '2026_12_03_0600_rename_scan_chart_start': renameScanChartStart,
  '2026_12_03_0610_create_series_change': createSeriesChange,
  '2026_12_03_1200_create_lesson': createLesson,
  '2026_12_03_1210_create_lesson_share': createLessonShare,
  '2026_12_04_0800_add_ink_line_draft_work': addInkLineDraftWork,
  '2026_12_04_1300_add_person_session_version': addPersonSessionVersion,
  '2026_12_04_1310_add_person_version': addPersonVersion,
  '2026_12_04_1320_create_invitation': createInvitation,
  '2026_12_04_1330_create_password_reset': createPasswordReset,
  '2026_12_04_1340_create_people_change': createPeopleChange,
  '2026_12_04_1400_create_register_change': createRegisterChange,
  '2026_12_05_1130_add_series_bucket_json': addSeriesBucketJson,
  '2026_12_04_0900_create_ink_line_review': createInkLineReview,
  '2026_12_04_0910_create_station_tracing': createStationTracing,
  '2026_12_04_0920_create_trace_priority': createTracePriority,
  '2026_12_04_0930_create_chart_claim': createChartClaim,
  '2026_12_04_0940_create_cross_trace_agreement': createCrossTraceAgreement,
  '2026_12_04_0950_allow_review_audit': allowReviewAudit,
  '2026_12_04_1100_create_station_series': createStationSeries,
  '2026_12_04_1110_record_existing_series_lines': recordExistingSeriesLines,
  '2026_12_04_1120_create_api_token': createApiToken,
};
