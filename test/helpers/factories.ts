import type { Role } from '@shared/api/roles';
import type { DerivativeState, ScanStatus } from '@shared/api/scans';
import type { SeriesFlag } from '@shared/api/series';
import type { StationInput, StationSummary } from '@shared/api/stations';
import type { ChartForm } from '@shared/domain/chart-form';
import { hashPassword } from '../../server/auth/passwords';
import { issueToken } from '../../server/auth/tokens';
import * as chartFormsRepository from '../../server/chart-forms/chart-forms.repository';
import type { Db } from '../../server/db/database';
import * as peopleRepository from '../../server/people/people.repository';
import * as stationsRepository from '../../server/stations/stations.repository';
import { TEST_JWT_SECRET } from './test-app';
import { GENERATED_WEEKLY_FORM } from '../../fixtures/generator/weekly-form';

export const TEST_PASSWORD = 'correct-pen-arm-42';

let testPasswordHash: Promise<string> | undefined;
let sequence = 0;

function nextNumber(): number {
  sequence += 1;
  return sequence;
}

export interface TestPerson {
  id: string;
  email: string;
  password: string;
  roles: Role[];
  /** A valid bearer token for this person (one hour). */
  token: string;
}

/** A person with the given roles and TEST_PASSWORD (hashed once per test file, argon2 is slow on purpose). */
export async function createPerson(db: Db, roles: Role[], email = `person-${nextNumber()}@isallo.test`): Promise<TestPerson> {
  testPasswordHash ??= hashPassword(TEST_PASSWORD);
  const id = await peopleRepository.insertPerson(db, {
    email,
    displayName: `Test Person ${email.split('@')[0]}`,
    passwordHash: await testPasswordHash,
    roles,
  });
  // A new person's session version is 1 (the column's default).
  const { token } = issueToken(TEST_JWT_SECRET, { personId: id, sessionVersion: 1 }, 3600);
  return { id, email, password: TEST_PASSWORD, roles, token };
}

export async function createStation(db: Db, overrides: Partial<StationInput> = {}): Promise<StationSummary> {
  const n = nextNumber();
  return stationsRepository.insertStation(db, {
    code: `T${n}`,
    name: `Test Station ${n}`,
    latitude: 52,
    longitude: -1,
    elevationM: 100,
    timeZone: 'Europe/London',
    ...overrides,
  });
}

/** A weekly 950–1050 hPa form with a 150 mm pen arm: the geometry of the demo sample, under its own name. */
export const TEST_WEEKLY_FORM: ChartForm = { ...GENERATED_WEEKLY_FORM, name: 'Test weekly 950–1050 hPa' };

export async function createChartForm(db: Db, overrides: Partial<ChartForm> = {}) {
  return chartFormsRepository.insertChartForm(db, { ...TEST_WEEKLY_FORM, name: `Test form ${nextNumber()}`, ...overrides });
}

/** A scan row without a stored file, for routes that never read the master (tracing, lists, the catalogue). */
export async function createScanRow(
  db: Db,
  scan: {
    stationId: string | null;
    chartFormId: string | null;
    uploadedBy: string;
    chartStart: string | null;
    status?: ScanStatus;
    chartOn?: string;
    chartOff?: string;
    instrumentId?: string;
    batchId?: string;
    tags?: string[];
    observer?: string;
    transcription?: string;
    originalName?: string;
    derivativeState?: DerivativeState;
  },
): Promise<string> {
  const n = nextNumber();
  const { id } = await db
    .insertInto('scan')
    .values({
      sha256: n.toString(16).padStart(64, '0'),
      storage_key: `masters/00/${n}.png`,
      media_type: 'image/png',
      size_bytes: 1000,
      width_px: 1600,
      height_px: 800,
      station_id: scan.stationId,
      chart_form_id: scan.chartFormId,
      chart_start: scan.chartStart === null ? null : new Date(scan.chartStart),
      status: scan.status ?? 'ready_to_trace',
      original_name: scan.originalName ?? `scan-${n}.png`,
      uploaded_by: scan.uploadedBy,
      chart_on: scan.chartOn ? new Date(scan.chartOn) : null,
      chart_off: scan.chartOff ? new Date(scan.chartOff) : null,
      instrument_id: scan.instrumentId ?? null,
      batch_id: scan.batchId ?? null,
      tags: scan.tags ?? [],
      observer: scan.observer ?? '',
      transcription: scan.transcription ?? '',
      derivative_state: scan.derivativeState ?? 'ready',
    })
    .returning('id')
    .executeTakeFirstOrThrow();
  return id;
}

/** An ink line with the given series points, written straight to the tables (for series reads); approved unless told. */
export async function createInkLineWithPoints(
  db: Db,
  line: {
    scanId: string;
    stationId: string;
    authorId: string;
    status?: 'draft' | 'handed_in' | 'approved' | 'returned';
    points: { time: string; pressureHpa: number; flag?: SeriesFlag }[];
  },
): Promise<string> {
  const { id: pinSetId } = await db
    .insertInto('pin_set')
    .values({
      scan_id: line.scanId,
      created_by: line.authorId,
      pins: JSON.stringify([]),
      model: 'affine',
      rms_hpa: 0,
      rms_minutes: 0,
      fit: JSON.stringify({}),
    })
    .returning('id')
    .executeTakeFirstOrThrow();
  const { id } = await db
    .insertInto('ink_line')
    .values({
      scan_id: line.scanId,
      pin_set_id: pinSetId,
      author_id: line.authorId,
      status: line.status ?? 'approved',
      knots: JSON.stringify([]),
    })
    .returning('id')
    .executeTakeFirstOrThrow();
  if (line.points.length > 0) {
    await db
      .insertInto('series_point')
      .values(
        line.points.map((point) => ({
          ink_line_id: id,
          station_id: line.stationId,
          time: new Date(point.time),
          pressure_hpa: point.pressureHpa,
          uncertainty_hpa: null,
          flag: point.flag ?? 'ok',
        })),
      )
      .execute();
  }
  // As a hand-in or a decision would: the series build reads this record (it leaves out lines that do not count).
  await db
    .insertInto('series_change')
    .values({ station_id: line.stationId, ink_line_id: id, change: 'added', person_id: null, reason: 'test fixture' })
    .execute();
  return id;
}
