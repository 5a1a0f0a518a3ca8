import type { InkLineDraft, InkLineSaved } from '@shared/api/ink-lines';
import { RegistrationError } from '@shared/domain/registration';
import * as auditRepository from '../audit/scan-audit.repository';
import * as chartFormsRepository from '../chart-forms/chart-forms.repository';
import type { Db } from '../db/database';
import { AppError, HTTP } from '../errors/app-error';
import * as scansRepository from '../scans/scans.repository';
import { recordSeriesChanges } from '../series/series-change';
import * as seriesRepository from '../series/series.repository';
import * as inkLinesRepository from './ink-lines.repository';
import { readSeriesPoints, registerDraft } from './ink-line-reading';

const TRACEABLE_STATUSES = ['ready_to_trace', 'traced'];

/**
 * Hands in a trace: fits the pins, reads the knots into hourly series points and, in one transaction,
 * stores the pin set, the ink line (handed in, version 1) and its points, records its entry into the station
 * series (series_change, which the series job builds from) and marks the scan traced.
 */
export async function handInInkLine(db: Db, scanId: string, draft: InkLineDraft, authorId: string): Promise<InkLineSaved> {
  return db.transaction().execute(async (trx) => {
    const scan = await scansRepository.findScanForTracing(trx, scanId);
    if (!scan) throw new AppError(HTTP.notFound, 'scan_not_found', 'There is no scan with this id.');
    if (!TRACEABLE_STATUSES.includes(scan.status)) {
      throw new AppError(HTTP.conflict, 'conflict', `A scan that is ${scan.status.replace(/_/g, ' ')} cannot be traced.`);
    }
    if (!scan.stationId || !scan.chartFormId || !scan.chartStart) {
      throw new AppError(HTTP.conflict, 'conflict', 'This scan has no station, chart form or chart start yet; catalogue it before tracing.');
    }
    const form = await chartFormsRepository.findChartFormById(trx, scan.chartFormId);
    if (!form) throw new AppError(HTTP.notFound, 'chart_form_not_found', 'The chart form of this scan is missing.');
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
    // Whether a handed-in line counts is the series predicate's call (series.repository.ts); the build reads this record.
    await recordSeriesChanges(trx, [{ stationId: scan.stationId, inkLineId: inkLine.id, change: 'added', personId: authorId, reason: 'handed in' }]);
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
