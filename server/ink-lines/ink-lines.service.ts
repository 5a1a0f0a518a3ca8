import type { InkLineDraft, InkLineSaved } from '@shared/api/ink-lines';
import { RegistrationError } from '@shared/domain/registration';
import * as auditRepository from '../audit/scan-audit.repository';
import type { Db } from '../db/database';
import { AppError, HTTP } from '../errors/app-error';
import * as scansRepository from '../scans/scans.repository';
import * as seriesRepository from '../series/series.repository';
import { loadTraceableScan } from '../tracing/traceable-scan';
import * as inkLinesRepository from './ink-lines.repository';
import { readSeriesPoints, registerDraft } from './ink-line-reading';

/**
 * Hands in a trace: fits the pins, reads the knots into hourly series points and, in one transaction,
 * stores the pin set, the ink line (handed in, version 1) and its points and marks the scan traced.
 */
export async function handInInkLine(db: Db, scanId: string, draft: InkLineDraft, authorId: string): Promise<InkLineSaved> {
  return db.transaction().execute(async (trx) => {
    const scan = await loadTraceableScan(trx, scanId, { needsStation: true, forUpdate: true });
    const form = scan.form;
    const chartStartMs = scan.chartStart.getTime();

    let fit;
    try {
      fit = registerDraft(form, draft, chartStartMs);
    } catch (error) {
      if (!(error instanceof RegistrationError)) throw error;
      throw new AppError(HTTP.unprocessable, 'registration_failed', `The pins do not register the chart: ${error.message}.`, {
        reason: error.code,
      });
    }
    const points = readSeriesPoints(form, fit, draft, chartStartMs);

    const pinSetId = await inkLinesRepository.insertPinSet(trx, { scanId, createdBy: authorId, pins: draft.pins, fit });
    const inkLine = await inkLinesRepository.insertInkLine(trx, {
      scanId,
      pinSetId,
      authorId,
      status: 'handed_in',
      knots: draft.knots,
    });
    await seriesRepository.insertSeriesPoints(trx, inkLine.id, scan.stationId, points);
    if (scan.status !== 'traced') {
      await scansRepository.updateScanStatus(trx, scanId, 'traced');
      await auditRepository.insertScanAudit(trx, { scanId, personId: authorId, action: 'status', changes: { status: { before: scan.status, after: 'traced' } } });
    }

    const first = points[0];
    return {
      inkLineId: inkLine.id,
      scanId,
      status: inkLine.status,
      version: inkLine.version,
      registrationModel: fit.model,
      registrationRmsHpa: fit.rmsHpa,
      registrationRmsMinutes: fit.rmsMinutes,
      pinResiduals: fit.residuals.map((residual) => ({ index: residual.index, pressureHpa: residual.pressureHpa, minutes: residual.minutes })),
      seriesPointCount: points.length,
      firstPoint: first ? { time: new Date(first.timeMs).toISOString(), pressureHpa: first.pressureHpa, flag: first.flag } : null,
    };
  });
}
