import { OpenAPIRegistry, OpenApiGeneratorV31 } from '@asteasolutions/zod-to-openapi';
import { z } from 'zod';
import { apiTokenCreatedSchema, apiTokenCreateSchema, apiTokenSummarySchema } from '@shared/api/api-tokens';
import { pointChartQuerySchema, pointChartSchema } from '@shared/api/series-point-chart';
import { seriesQueryResponseSchema, seriesQuerySchema, stationCoverageSchema } from '@shared/api/series-query';

/** The error body every route answers with (shared/api/errors.ts). */
const errorSchema = z
  .object({
    error: z.object({
      code: z.string().meta({ description: 'A stable code from the ApiErrorCode list, e.g. series_range_too_large.' }),
      message: z.string(),
      details: z.unknown().optional(),
    }),
  })
  .meta({ id: 'ApiError' });

const errors = (...statuses: number[]) =>
  Object.fromEntries(statuses.map((status) => [status, { description: ERROR_TEXT[status], content: { 'application/json': { schema: errorSchema } } }]));
const ERROR_TEXT: Record<number, string> = {
  400: 'Invalid parameters; details name each (or the range limit).',
  401: 'No valid sign-in or API token.',
  403: 'The role, or an API token where tokens do not work.',
  404: 'Unknown station, token or an empty NetCDF range.',
};

const pathStationId = z.object({ stationId: z.uuid().meta({ description: 'Station id.' }) });

/**
 * The OpenAPI 3.1 description of the routes whose schemas live in zod (series query, coverage, API
 * tokens), generated from the very schemas the server validates with.
 */
export function buildOpenApiDocument(): ReturnType<OpenApiGeneratorV31['generateDocument']> {
  const registry = new OpenAPIRegistry();
  registry.registerComponent('securitySchemes', 'bearer', {
    type: 'http',
    scheme: 'bearer',
    description: 'A sign-in token (POST /api/auth/sign-in) or a personal API token (isallo_pat_…, series, coverage and station reads only).',
  });
  const security = [{ bearer: [] }];
  registry.registerPath({
    method: 'get',
    path: '/api/series/query',
    summary: 'Station series over a range at a step, as JSON, CSV or CF NetCDF',
    description:
      'Steps raw, 10min, hourly, daily, monthly (UTC buckets); aggregate mean, min or max; flags to include or exclude; ' +
      'several stations for JSON and CSV. A range too long for the step answers 400 series_range_too_large with the limit.',
    security,
    request: { query: seriesQuerySchema },
    responses: {
      200: {
        description: 'The series of each station, with its version and build time.',
        content: {
          'application/json': { schema: seriesQueryResponseSchema },
          'text/csv': { schema: z.string().meta({ description: 'A commented header (# lines: station, units, flags, version, licence, citation), then the rows.' }) },
          'application/x-netcdf': { schema: z.string().meta({ format: 'binary', description: 'CF-1.10 NetCDF classic, featureType timeSeries.' }) },
        },
      },
      ...errors(400, 401, 403, 404),
    },
  });
  registry.registerPath({
    method: 'get',
    path: '/api/stations/{stationId}/coverage',
    summary: 'What exists for a station: months with data, charts by state',
    security,
    request: { params: pathStationId },
    responses: { 200: { description: 'The coverage.', content: { 'application/json': { schema: stationCoverageSchema } } }, ...errors(401, 403, 404) },
  });
  registry.registerPath({
    method: 'get',
    path: '/api/series/point-chart',
    summary: 'The chart behind a series point: its ink line, scan, chart form and the scan region around it (IIIF)',
    security,
    request: { query: pointChartQuerySchema },
    responses: { 200: { description: 'The point and its chart region.', content: { 'application/json': { schema: pointChartSchema } } }, ...errors(400, 401, 403, 404) },
  });
  registry.registerPath({
    method: 'get',
    path: '/api/tokens',
    summary: 'Your API tokens (paged, newest first)',
    security,
    request: { query: z.object({ page: z.string().optional(), pageSize: z.string().optional() }) },
    responses: {
      200: {
        description: 'A page of tokens (the tokens themselves are never shown again).',
        content: {
          'application/json': {
            schema: z.object({ items: z.array(apiTokenSummarySchema), total: z.number().int(), page: z.number().int(), pageSize: z.number().int() }).meta({ id: 'ApiTokenPage' }),
          },
        },
      },
      ...errors(401, 403),
    },
  });
  registry.registerPath({
    method: 'post',
    path: '/api/tokens',
    summary: 'Create a personal read-only API token (climatologists)',
    security,
    request: { body: { content: { 'application/json': { schema: apiTokenCreateSchema } } } },
    responses: { 201: { description: 'The token, shown this once.', content: { 'application/json': { schema: apiTokenCreatedSchema } } }, ...errors(400, 401, 403) },
  });
  registry.registerPath({
    method: 'delete',
    path: '/api/tokens/{tokenId}',
    summary: 'Revoke one of your API tokens',
    security,
    request: { params: z.object({ tokenId: z.uuid() }) },
    responses: { 200: { description: 'The revoked token.', content: { 'application/json': { schema: apiTokenSummarySchema } } }, ...errors(401, 403, 404) },
  });
  return new OpenApiGeneratorV31(registry.definitions).generateDocument({
    openapi: '3.1.0',
    info: { title: 'Isallo API', version: '1', description: 'Station series of digitized barograph charts, and the tokens to script them.' },
  });
}
