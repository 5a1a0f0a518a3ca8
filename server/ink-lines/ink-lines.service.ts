import type { InkLineDraft, InkLineSaved } from '@shared/api/ink-lines';
import { RegistrationError } from '@shared/domain/registration';
import * as auditRepository from '../audit/scan-audit.repository';
import * as chartFormsRepository from '../chart-forms/chart-forms.repository';
import type { Db } from '../db/database';
import { AppError, HTTP } from '../errors/app-error';
import * as scansRepository from '../scans/scans.repository';
import * as seriesRepository from '../series/series.repository';
import { releaseClaim } from '../desk/chart-claims';
import { checkMayHandIn, compareWithOtherLines } from '../review/cross-trace';
import * as inkLinesRepository from './ink-lines.repository';
import { checkInsideImage, checkKnotTimes, checkRegistration } from './hand-in-checks';
import { readSeriesPoints, registerDraft } from './ink-line-reading';

const TRACEABLE_STATUSES = ['ready_to_trace', 'traced'];

/**
 * Hands in a trace: checks it (pins and knots on the image, a registration within the chart form's limit, knots
 * forward in time inside the drum period, no second line by the same volunteer), fits the pins, reads the knots
 * into hourly series points and, in one transaction, stores the pin set, the ink line (handed in; the author's
 * draft row when there is one) and its points, compares it with a cross-trace, ends the author's claim and marks
 * the scan traced. A handed-in line waits for review: it reaches no station series until approved.
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
    const { draftId } = await checkMayHandIn(trx, scan, authorId);
    checkInsideImage(draft, scan);
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
    checkRegistration(form, fit);
    checkKnotTimes(form, fit, draft);
    const points = readSeriesPoints(form, fit, draft, chartStartMs);

    const pinSetId = await inkLinesRepository.insertPinSet(trx, { scanId, createdBy: authorId, pins: draft.pins, fit });
    const inkLine = draftId
      ? await inkLinesRepository.handInDraftRow(trx, { inkLineId: draftId, pinSetId, knots: draft.knots })
      : await inkLinesRepository.insertInkLine(trx, { scanId, pinSetId, authorId, status: 'handed_in', knots: draft.knots });
    await seriesRepository.insertSeriesPoints(trx, inkLine.id, scan.stationId, points);
    await compareWithOtherLines(trx, scanId, inkLine.id);
    await releaseClaim(trx, scanId, authorId);
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
