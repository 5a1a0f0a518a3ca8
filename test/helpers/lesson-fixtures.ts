import { EMPTY_BENCH_WORK } from '@shared/api/bench-work';
import fs from 'node:fs/promises';
import type { InkLineDraft } from '@shared/api/ink-lines';
import type { ChartForm } from '@shared/domain/chart-form';
import { readingToPixel } from '@shared/domain/registration';
import * as inkLinesService from '../../server/ink-lines/ink-lines.service';
import * as reviewService from '../../server/review/review.service';
import * as scansService from '../../server/scans/scans.service';
import { makePng } from './images';
import type { TestContext } from './test-app';
import { syntheticDraft, syntheticPlacement } from './trace';

/** Hour of the front in frontPressureHpa, after the chart start. */
export const FRONT_HOUR = 40;

/**
 * An invented front passage: a fall of 0.3 hPa/h to the trough at FRONT_HOUR, a rise of 2.5 hPa/h for three
 * hours behind it, then a slow rise. About 1000 hPa, well inside a 950–1050 hPa chart.
 */
export function frontPressureHpa(hours: number): number {
  if (hours <= FRONT_HOUR) return 1000 - 0.3 * hours;
  if (hours <= FRONT_HOUR + 3) return 1000 - 0.3 * FRONT_HOUR + 2.5 * (hours - FRONT_HOUR);
  return 1000 - 0.3 * FRONT_HOUR + 7.5 + 0.2 * (hours - FRONT_HOUR - 3);
}

/** The synthetic hand-in's pins with knots every 10 minutes from fromHours to toHours along frontPressureHpa. */
export function frontDraft(form: ChartForm, chartStart: string, fromHours = 2, toHours = 80): InkLineDraft {
  const { pins } = syntheticDraft(form, chartStart);
  const knots = [];
  for (let minutes = fromHours * 60; minutes <= toHours * 60; minutes += 10) {
    const hours = minutes / 60;
    knots.push(readingToPixel(form, syntheticPlacement(form), { hours, pressure: frontPressureHpa(hours) }));
  }
  return { pins, knots };
}

/**
 * A scan with a real (blank) 1800 × 720 px master, large enough to hold the synthetic placement of a weekly
 * chart, made ready to trace and handed in along frontPressureHpa through the hand-in service.
 */
export async function createTracedFrontScan(
  context: TestContext,
  scan: { stationId: string; chartFormId: string; form: ChartForm; chartStart: string; archivistId: string; volunteerId: string },
): Promise<{ scanId: string; inkLineId: string }> {
  // Handed in, then approved by the archivist: only approved lines reach the station series a lesson reads.
  const tempPath = context.storage.newTempPath('.upload');
  await fs.writeFile(tempPath, await makePng(1800, 720));
  const uploaded = await scansService.uploadScan(
    context,
    { tempPath, originalName: `front-${Date.now()}.png` },
    { stationId: scan.stationId, chartFormId: scan.chartFormId, chartStart: new Date(scan.chartStart) },
    scan.archivistId,
  );
  await context.db.updateTable('scan').set({ status: 'ready_to_trace' }).where('id', '=', uploaded.id).execute();
  const saved = await inkLinesService.handInInkLine(
    context.db,
    uploaded.id,
    { work: { ...EMPTY_BENCH_WORK, ...frontDraft(scan.form, scan.chartStart) }, draftVersion: null },
    scan.volunteerId,
  );
  await reviewService.approveInkLine(context.db, saved.inkLineId, { version: saved.version }, scan.archivistId);
  return { scanId: uploaded.id, inkLineId: saved.inkLineId };
}
