import { z } from 'zod';
import { SERIES_FLAGS } from './series';

/** Hours either side of a point that its chart region shows: enough grid to read the pen line's shape. */
export const POINT_CHART_HALF_SPAN_HOURS = 6;
/** A point further than this from the asked time is not "the point at that time". */
export const POINT_CHART_MAX_DISTANCE_HOURS = 3;

/** The query of GET /api/series/point-chart. */
export const pointChartQuerySchema = z.strictObject({
  stationId: z.uuid({ message: 'stationId must be a station id' }).meta({ description: 'Station id.' }),
  time: z.string().meta({ description: 'ISO 8601 instant (Z or an offset): the merged point nearest it is traced back.', example: '2026-03-03T12:00:00Z' }),
});

/**
 * One series point traced to its chart: the point, its ink line, scan and chart form, and the region of the
 * scan around it with the ink line's knots inside (canvas pixels) and the IIIF image of that region.
 */
export const pointChartSchema = z
  .object({
    stationId: z.uuid(),
    time: z.string().meta({ description: 'ISO 8601 UTC: the merged point’s time.' }),
    pressureHpa: z.number(),
    flag: z.enum(SERIES_FLAGS),
    uncertaintyHpa: z.number().nullable(),
    inkLineId: z.uuid(),
    scanId: z.uuid(),
    chartFormId: z.uuid().nullable(),
    chartFormName: z.string().nullable(),
    chartStart: z.string().nullable(),
    region: z
      .object({ xPx: z.number().int(), yPx: z.number().int(), widthPx: z.number().int(), heightPx: z.number().int() })
      .nullable()
      .meta({ description: 'IIIF region (canvas pixels) around the point; null when the line cannot be placed on its chart.' }),
    inkLine: z.array(z.object({ xPx: z.number(), yPx: z.number() })).meta({ description: 'The ink line’s knots inside the region, canvas pixels.' }),
    pointPx: z.object({ xPx: z.number(), yPx: z.number() }).nullable().meta({ description: 'Where the point sits on the chart, canvas pixels.' }),
    regionFrom: z.string().nullable(),
    regionTo: z.string().nullable(),
    imagePath: z.string().nullable().meta({ description: 'IIIF Image API request of the region (Bearer token as for the API).' }),
  })
  .meta({ id: 'PointChart' });
export type PointChart = z.infer<typeof pointChartSchema>;
