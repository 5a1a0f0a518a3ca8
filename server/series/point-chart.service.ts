import { IIIF } from '@shared/api/routes';
import { POINT_CHART_HALF_SPAN_HOURS, POINT_CHART_MAX_DISTANCE_HOURS, type PointChart } from '@shared/api/series-point-chart';
import type { ChartForm } from '@shared/domain/chart-form';
import { pixelToReading } from '@shared/domain/registration';
import * as chartFormsRepository from '../chart-forms/chart-forms.repository';
import type { Db } from '../db/database';
import { AppError, HTTP } from '../errors/app-error';
import { chartRegionsOf, regionImageSize } from '../lessons/lesson-passage';
import * as lessonsRepository from '../lessons/lessons.repository';
import * as stationsService from '../stations/stations.service';
import * as seriesReadRepository from './series-read.repository';
import { currentSeriesVersion } from './series.service';

const HOUR_MS = 3_600_000;

/**
 * The merged point nearest timeMs (within POINT_CHART_MAX_DISTANCE_HOURS) traced to its chart: its ink line,
 * scan and chart form, and the scan region ± POINT_CHART_HALF_SPAN_HOURS around it with the line's knots,
 * served through IIIF. 404 station_not_found, or not_found when no point is near that time.
 */
export async function getPointChart(db: Db, stationId: string, timeMs: number): Promise<PointChart> {
  await stationsService.getStation(db, stationId);
  await currentSeriesVersion(db, stationId);
  const reach = POINT_CHART_MAX_DISTANCE_HOURS * HOUR_MS;
  const near = await seriesReadRepository.readRawPoints(db, { stationId, fromMs: timeMs - reach, toMs: timeMs + reach, flags: null }, true);
  const point = near.filter((candidate) => candidate.provenance).sort((a, b) => Math.abs(Date.parse(a.time) - timeMs) - Math.abs(Date.parse(b.time) - timeMs))[0];
  if (!point?.provenance) {
    throw new AppError(HTTP.notFound, 'not_found', `This station has no traced point within ${POINT_CHART_MAX_DISTANCE_HOURS} hours of that time.`);
  }
  const pointMs = Date.parse(point.time);
  const [source] = await lessonsRepository.findChartSources(db, [point.inkLineId]);
  const storedForm = source ? await chartFormsRepository.findChartFormById(db, source.chartFormId) : undefined;
  const forms = new Map<string, ChartForm>(storedForm && source ? [[source.chartFormId, storedForm]] : []);
  const spanMs = POINT_CHART_HALF_SPAN_HOURS * HOUR_MS;
  const [region] = source ? chartRegionsOf([source], forms, pointMs - spanMs, pointMs + spanMs, () => '') : [];
  const base = {
    stationId,
    time: point.time,
    pressureHpa: point.pressureHpa,
    flag: point.flag,
    uncertaintyHpa: point.uncertaintyHpa,
    inkLineId: point.inkLineId,
    scanId: point.provenance.scanId,
    chartFormId: point.provenance.chartFormId,
    chartFormName: point.provenance.chartFormName,
    chartStart: point.provenance.chartStart,
  };
  if (!region || !source || !storedForm) {
    return { ...base, region: null, inkLine: [], pointPx: null, regionFrom: null, regionTo: null, imagePath: null };
  }
  const box = region.region;
  // The knot of the line nearest the point in time marks it on the chart.
  const pointHours = (pointMs - source.chartStartMs) / HOUR_MS;
  const pointPx = region.inkLine.reduce((best, knot) =>
    Math.abs(pixelToReading(storedForm, source.fit, knot.xPx, knot.yPx).hours - pointHours) < Math.abs(pixelToReading(storedForm, source.fit, best.xPx, best.yPx).hours - pointHours)
      ? knot
      : best,
  );
  return {
    ...base,
    region: box,
    inkLine: region.inkLine,
    pointPx,
    regionFrom: region.from,
    regionTo: region.to,
    imagePath: IIIF.image(source.scanId, `${box.xPx},${box.yPx},${box.widthPx},${box.heightPx}`, regionImageSize(box)),
  };
}
