import { type BenchWork, EMPTY_BENCH_WORK } from '@shared/api/bench-work';
import fs from 'node:fs/promises';
import type { Logger } from 'pino';
import sharp from 'sharp';
import type { ChartFormSummary } from '@shared/api/chart-forms';
import type { ScanDetail } from '@shared/api/scans';
import type { StationInput, StationSummary } from '@shared/api/stations';
import type { ChartForm } from '@shared/domain/chart-form';
import { fitRegistration, readingToPixel } from '@shared/domain/registration';
import { hashPassword } from '../auth/passwords';
import * as chartFormsRepository from '../chart-forms/chart-forms.repository';
import type { Db } from '../db/database';
import { AppError } from '../errors/app-error';
import { toRegistrationPins } from '../ink-lines/ink-line-reading';
import * as inkLinesService from '../ink-lines/ink-lines.service';
import * as peopleRepository from '../people/people.repository';
import * as reviewService from '../review/review.service';
import { makeDerivatives } from '../jobs/make-derivatives';
import { markDerivativesReady } from '../scans/ready-after-derivatives';
import * as scansRepository from '../scans/scans.repository';
import * as scansService from '../scans/scans.service';
import * as stationsRepository from '../stations/stations.repository';
import type { ScanDeps } from '../scans/scan-deps';
import type { Storage } from '../storage/storage';
import { seedDemoLesson } from './demo-lesson';
import { readDemoSample, type DemoSample } from './demo-sample';
import { DEMO_DAILY_FORM, DEMO_PASSWORD, DEMO_PEOPLE, DEMO_STATIONS, DEMO_WEEKLY_FORM_FALLBACK } from './demo-scenario';

const SEED_NAME = 'demo-scenario';
const MS_PER_HOUR = 3_600_000;

export interface SeedDemoOptions {
  fixturesDir: string;
  logger?: Logger;
}

export interface SeedDemoResult {
  /** False when the scenario had been seeded before and nothing was done. */
  isSeeded: boolean;
  readyScanId: string | null;
  /** The chart whose handed-in line the archivist approved: the Series area's data. */
  tracedScanId: string | null;
  /** A chart whose handed-in line waits for review. */
  waitingScanId: string | null;
}

async function ensureStation(db: Db, station: StationInput): Promise<StationSummary> {
  return (await stationsRepository.findStationByCode(db, station.code)) ?? stationsRepository.insertStation(db, station);
}

async function ensureChartForm(db: Db, form: ChartForm): Promise<ChartFormSummary> {
  return (await chartFormsRepository.findChartFormByName(db, form.name)) ?? chartFormsRepository.insertChartForm(db, form);
}

async function ensurePeople(db: Db): Promise<Map<string, string>> {
  const idsByEmail = new Map<string, string>();
  const passwordHash = await hashPassword(DEMO_PASSWORD);
  for (const person of DEMO_PEOPLE) {
    const existing = await peopleRepository.findPersonCredentialsByEmail(db, person.email);
    idsByEmail.set(person.email, existing?.id ?? (await peopleRepository.insertPerson(db, { ...person, passwordHash })));
  }
  return idsByEmail;
}

/** Copies a file into storage's temp folder, because an upload consumes its temp file. */
async function stageFile(storage: Storage, sourcePath: string): Promise<string> {
  const tempPath = storage.newTempPath('.upload');
  await fs.copyFile(sourcePath, tempPath);
  return tempPath;
}

/**
 * Uploads through the route's service; a scan left by an earlier run that stopped half-way is reused,
 * so a failed seed can simply be run again.
 */
async function uploadOrReuse(
  deps: ScanDeps,
  file: scansService.ReceivedFile,
  fields: scansService.ParsedUploadFields,
  uploadedBy: string,
): Promise<ScanDetail> {
  const { db } = deps;
  try {
    const uploaded = await scansService.uploadScan(deps, file, fields, uploadedBy);
    // A scan is ready to trace only once its derivatives exist; the seed makes them now, as the worker would,
    // so the demo's hand-ins below find traceable scans (the queued job later remakes them, harmlessly).
    const stored = await scansRepository.findScanFile(db, uploaded.id);
    if (stored) await makeDerivatives(deps.storage, stored);
    await markDerivativesReady(db, uploaded.id);
    return await scansService.getScan(db, uploaded.id);
  } catch (error) {
    const isDuplicate = error instanceof AppError && error.code === 'duplicate_scan';
    const existingId = isDuplicate ? (error.details as { scanId?: string }).scanId : undefined;
    if (!existingId) throw error;
    return scansService.getScan(db, existingId);
  }
}

/**
 * Knots along the true series, placed where the registered chart would have them: the demo's handed-in
 * line reads back (to the fit's accuracy) the series the sample was drawn from.
 */
function knotsFromTruth(sample: DemoSample, chartStartMs: number): { xPx: number; yPx: number }[] {
  const fit = fitRegistration(sample.form, toRegistrationPins({ pins: sample.pins, knots: [] }, chartStartMs));
  return sample.truth.map((row) =>
    readingToPixel(sample.form, fit, { hours: (row.timeMs - chartStartMs) / MS_PER_HOUR, pressure: row.pressureHpa }),
  );
}

/**
 * The waiting line's work: as the observer would have written them, chart on and chart off at the ends of the
 * line and two barometer readings on it, so Review has a clock and an instrument correction to show. The
 * invented barograph keeps true time and reads true, so both corrections come out near zero.
 */
function waitingWork(sample: DemoSample, knots: BenchWork['knots']): BenchWork {
  const at = (index: number) => sample.truth[Math.min(sample.truth.length - 1, Math.max(0, index))];
  const iso = (ms: number) => new Date(ms).toISOString();
  const third = Math.floor(sample.truth.length / 3);
  return {
    ...EMPTY_BENCH_WORK,
    step: 'proof',
    pins: sample.pins,
    knots,
    chartOn: iso(at(0).timeMs),
    chartOff: iso(at(sample.truth.length - 1).timeMs),
    checkReadings: [at(third), at(2 * third)].map((row) => ({ time: iso(row.timeMs), pressureHpa: row.pressureHpa })),
  };
}

/**
 * Seeds the invented demo scenario once: the five accounts, the two stations, a weekly and a daily chart
 * form and, when fixtures/samples/demo-weekly.png exists, that chart as a ready-to-trace scan of Kestrel
 * Ridge, a re-encoded copy handed in from its true series and approved (so the Series area has data at once),
 * and a third copy handed in and waiting for review.
 * Scans go through the same upload and hand-in services as the routes.
 */
export async function seedDemo(deps: ScanDeps, options: SeedDemoOptions): Promise<SeedDemoResult> {
  const { db, storage } = deps;
  const notSeeded: SeedDemoResult = { isSeeded: false, readyScanId: null, tracedScanId: null, waitingScanId: null };
  if (await db.selectFrom('demo_seed').select('name').where('name', '=', SEED_NAME).executeTakeFirst()) return notSeeded;
  await storage.ensureFolders();

  const personIds = await ensurePeople(db);
  const [kestrelRidge] = await Promise.all(DEMO_STATIONS.map((station) => ensureStation(db, station)));
  const sample = await readDemoSample(options.fixturesDir);
  const weeklyForm = await ensureChartForm(db, sample?.form ?? DEMO_WEEKLY_FORM_FALLBACK);
  await ensureChartForm(db, DEMO_DAILY_FORM);

  const result: SeedDemoResult = { isSeeded: true, readyScanId: null, tracedScanId: null, waitingScanId: null };
  if (sample) {
    const archivistId = personIds.get('archivist@isallo.test') as string;
    const volunteerId = personIds.get('volunteer@isallo.test') as string;
    const fields = { stationId: kestrelRidge.id, chartFormId: weeklyForm.id, chartStart: new Date(sample.chartStart) };
    const ready = await uploadOrReuse(
      deps,
      { tempPath: await stageFile(storage, sample.imagePath), originalName: 'demo-weekly.png' },
      fields,
      archivistId,
    );
    result.readyScanId = ready.id;

    if (sample.truth.length >= 2 && sample.pins.length >= 3) {
      // Same pixels, different bytes (higher compression), so the content-hash check sees a new scan.
      const copyPath = storage.newTempPath('.upload');
      await sharp(sample.imagePath).png({ compressionLevel: 9, adaptiveFiltering: true }).toFile(copyPath);
      const traced = await uploadOrReuse(
        deps,
        { tempPath: copyPath, originalName: 'demo-weekly-traced.png' },
        fields,
        archivistId,
      );
      const chartStartMs = Date.parse(sample.chartStart);
      const knots = knotsFromTruth(sample, chartStartMs);
      if (traced.inkLineCount === 0) {
        const saved = await inkLinesService.handInInkLine(
          db,
          traced.id,
          { work: { ...EMPTY_BENCH_WORK, step: 'proof', pins: sample.pins, knots }, draftVersion: null },
          volunteerId,
        );
        await reviewService.approveInkLine(db, saved.inkLineId, { version: saved.version }, archivistId);
      }
      result.tracedScanId = traced.id;
      await seedDemoLesson(db, personIds.get('teacher@isallo.test') as string, kestrelRidge.id, chartStartMs);

      // A third encoding of the same pixels, handed in and left for the archivist's Review.
      const waitingPath = storage.newTempPath('.upload');
      await sharp(sample.imagePath).png({ compressionLevel: 6, adaptiveFiltering: true }).toFile(waitingPath);
      const waiting = await uploadOrReuse(deps, { tempPath: waitingPath, originalName: 'demo-weekly-review.png' }, fields, archivistId);
      if (waiting.id !== traced.id && waiting.id !== ready.id) {
        if (waiting.inkLineCount === 0) {
          await inkLinesService.handInInkLine(db, waiting.id, { work: waitingWork(sample, knots), draftVersion: null }, volunteerId);
        }
        result.waitingScanId = waiting.id;
      }
    }
  }

  await db.insertInto('demo_seed').values({ name: SEED_NAME }).execute();
  options.logger?.info(result, 'demo scenario seeded');
  return result;
}
