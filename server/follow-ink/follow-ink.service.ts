import type { FollowInkRequest, FollowInkResult } from '@shared/api/follow-ink';
import { followInk } from '@shared/domain/ink/follow-ink';
import { followSpanHours } from '@shared/domain/pipeline/follow-span';
import { parseHexColour, type RawImage } from '@shared/domain/ink/raw-image';
import { readingToPixel, RegistrationError, type RegistrationFit } from '@shared/domain/registration';
import type { ChartForm } from '@shared/domain/chart-form';
import type { Db } from '../db/database';
import { AppError, HTTP } from '../errors/app-error';
import { registerDraft } from '../ink-lines/ink-line-reading';
import { findPageSource } from '../jobs/page-source';
import * as scansRepository from '../scans/scans.repository';
import type { Storage } from '../storage/storage';
import { loadTraceableScan } from '../tracing/traceable-scan';
import { thinTrace } from './thin-knots';

/** Knot spacing along the line, paper mm: close enough that straight joins stay within a pen width of the curve (common practice). */
const KNOT_SPACING_MM = 0.75;

/**
 * Follow ink: fits the pins, decodes the scan's page, follows the pen line over the chart span (chart on →
 * chart off when catalogued, else the whole drum turn) and thins it to knots in full-resolution pixels.
 */
export async function followScanInk(db: Db, storage: Storage, scanId: string, request: FollowInkRequest): Promise<FollowInkResult> {
  const startedMs = Date.now();
  const scan = await loadTraceableScan(db, scanId);
  const form = scan.form;
  const chartStartMs = scan.chartStart.getTime();
  const fit = register(form, request, chartStartMs);

  const image = await decodePage(db, storage, scanId);
  // The same span as the offline pipeline (npm run digitize), so both follow the same line on the same scan.
  const trace = followInk(image, form, fit, {
    ...followSpanHours(form, chartStartMs, scan.chartOn?.getTime() ?? null, scan.chartOff?.getTime() ?? null),
    inkColour: request.inkColour ? (parseHexColour(request.inkColour) ?? undefined) : undefined,
    seed: request.seed,
  });
  const { knots, spans } = thinTrace(trace, KNOT_SPACING_MM * pixelsPerMm(form, fit));
  return {
    knots,
    spans,
    lineWidthPx: trace.lineWidthPx,
    elapsedMs: Date.now() - startedMs,
    inkModel: trace.contrastMode,
    inkModelReason: trace.contrastReason,
    coverage: trace.coverage,
    problem: trace.problem,
  };
}

function register(form: ChartForm, request: FollowInkRequest, chartStartMs: number): RegistrationFit {
  try {
    return registerDraft(form, { pins: request.pins, knots: [] }, chartStartMs);
  } catch (error) {
    if (!(error instanceof RegistrationError)) throw error;
    throw new AppError(HTTP.unprocessable, 'registration_failed', `The pins do not register the chart: ${error.message}.`, {
      reason: error.code,
    });
  }
}

/** Scan pixels per paper mm along the time direction, at the middle of the chart. */
function pixelsPerMm(form: ChartForm, fit: RegistrationFit): number {
  const pressure = (form.pressureMin + form.pressureMax) / 2;
  const a = readingToPixel(form, fit, { hours: form.drumHours / 2, pressure });
  const b = readingToPixel(form, fit, { hours: form.drumHours / 2 + 1, pressure });
  return Math.hypot(b.xPx - a.xPx, b.yPx - a.yPx) / form.mmPerHour;
}

/** The scan's page pixels (the page raster for PDF and TIFF pages, else the master), decoded to raw RGB or grey. */
async function decodePage(db: Db, storage: Storage, scanId: string): Promise<RawImage> {
  const file = await scansRepository.findScanFile(db, scanId);
  if (!file) throw new AppError(HTTP.notFound, 'scan_not_found', 'There is no scan with this id.');
  const source = await findPageSource(storage, file);
  if (!source) throw new AppError(HTTP.conflict, 'derivatives_not_ready', 'The page image of this scan is not made yet; try again in a minute.');
  const { data, info } = await source.open().removeAlpha().raw().toBuffer({ resolveWithObject: true });
  return { data, width: info.width, height: info.height, channels: info.channels as RawImage['channels'] };
}
