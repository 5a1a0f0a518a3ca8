import type { Params } from '@angular/router';
import { DEFAULT_PAGE_SIZE, MAX_PAGE_SIZE, type PageQuery } from '@shared/api/paging';
import { SCAN_SORT_KEYS, SCAN_STATUSES, type ScanFilters, type ScanSortKey, type ScanStatus } from '@shared/api/scans';

import { parseUtcDay } from '../../series/series-range';

const DAY_MS = 24 * 60 * 60 * 1000;

/** The catalogue's filters as the archivist sets them: days rather than instants, so the address stays readable. */
export interface CatalogueFilters {
  stationId: string | null;
  /** YYYY-MM-DD, UTC day, included. */
  fromDay: string | null;
  /** YYYY-MM-DD, UTC day, included. */
  toDay: string | null;
  status: ScanStatus | null;
  instrumentId: string | null;
  chartFormId: string | null;
  tags: string[];
  q: string | null;
  batchId: string | null;
}

export interface CatalogueState {
  filters: CatalogueFilters;
  query: PageQuery<ScanSortKey>;
}

export const NO_FILTERS: CatalogueFilters = {
  stationId: null,
  fromDay: null,
  toDay: null,
  status: null,
  instrumentId: null,
  chartFormId: null,
  tags: [],
  q: null,
  batchId: null,
};

export const DEFAULT_QUERY: PageQuery<ScanSortKey> = { page: 0, pageSize: DEFAULT_PAGE_SIZE, sort: 'uploadedAt', direction: 'desc' };

/** What the router's query-param map offers. */
export interface QueryParamSource {
  get(name: string): string | null;
  getAll(name: string): string[];
}

function text(value: string | null): string | null {
  const trimmed = value?.trim() ?? '';
  return trimmed === '' ? null : trimmed;
}

function day(value: string | null): string | null {
  const trimmed = text(value);
  return trimmed !== null && parseUtcDay(trimmed) !== null ? trimmed : null;
}

function whole(value: string | null, min: number, max: number, fallback: number): number {
  const n = Number(value);
  return value !== null && Number.isInteger(n) && n >= min && n <= max ? n : fallback;
}

/** Reads the catalogue's state from the address; anything unreadable falls back to its default rather than failing. */
export function catalogueStateFromParams(params: QueryParamSource): CatalogueState {
  const status = params.get('status');
  const sort = params.get('sort');
  const direction = params.get('direction');
  const tags = params
    .getAll('tag')
    .map((tag) => tag.trim().toLowerCase())
    .filter((tag) => tag !== '');
  return {
    filters: {
      stationId: text(params.get('stationId')),
      fromDay: day(params.get('from')),
      toDay: day(params.get('to')),
      status: (SCAN_STATUSES as readonly string[]).includes(status ?? '') ? (status as ScanStatus) : null,
      instrumentId: text(params.get('instrumentId')),
      chartFormId: text(params.get('chartFormId')),
      tags: [...new Set(tags)],
      q: text(params.get('q')),
      batchId: text(params.get('batchId')),
    },
    query: {
      page: whole(params.get('page'), 0, Number.MAX_SAFE_INTEGER, DEFAULT_QUERY.page),
      pageSize: whole(params.get('pageSize'), 1, MAX_PAGE_SIZE, DEFAULT_QUERY.pageSize),
      sort: sort === 'none' ? undefined : (SCAN_SORT_KEYS as readonly string[]).includes(sort ?? '') ? (sort as ScanSortKey) : DEFAULT_QUERY.sort,
      direction: direction === 'asc' || direction === 'desc' ? direction : sort === null ? DEFAULT_QUERY.direction : 'asc',
    },
  };
}

/**
 * The address's query params for a state. Defaults are written as null so that Angular drops them and a
 * plain catalogue keeps a plain address; `sort=none` keeps "no sort" apart from the default sort.
 */
export function paramsFromCatalogueState(state: CatalogueState): Params {
  const { filters, query } = state;
  const isDefaultSort = query.sort === DEFAULT_QUERY.sort && query.direction === DEFAULT_QUERY.direction;
  return {
    stationId: filters.stationId,
    from: filters.fromDay,
    to: filters.toDay,
    status: filters.status,
    instrumentId: filters.instrumentId,
    chartFormId: filters.chartFormId,
    tag: filters.tags.length > 0 ? filters.tags : null,
    q: filters.q,
    batchId: filters.batchId,
    page: query.page === 0 ? null : query.page,
    pageSize: query.pageSize === DEFAULT_QUERY.pageSize ? null : query.pageSize,
    sort: isDefaultSort ? null : (query.sort ?? 'none'),
    direction: isDefaultSort ? null : query.direction,
  };
}

/** The API's filters: days become instants (from midnight of fromDay to midnight after toDay, UTC). */
export function scanFiltersOf(filters: CatalogueFilters): ScanFilters {
  const result: ScanFilters = {};
  if (filters.stationId) result.stationId = filters.stationId;
  const fromMs = filters.fromDay ? parseUtcDay(filters.fromDay) : null;
  const toMs = filters.toDay ? parseUtcDay(filters.toDay) : null;
  if (fromMs !== null) result.from = new Date(fromMs).toISOString();
  if (toMs !== null) result.to = new Date(toMs + DAY_MS).toISOString();
  if (filters.status) result.status = filters.status;
  if (filters.instrumentId) result.instrumentId = filters.instrumentId;
  if (filters.chartFormId) result.chartFormId = filters.chartFormId;
  if (filters.tags.length > 0) result.tag = [...filters.tags];
  if (filters.q) result.q = filters.q;
  if (filters.batchId) result.batchId = filters.batchId;
  return result;
}

/** The same filters without the status: the status counts are shown for every status at once. */
export function withoutStatus(filters: CatalogueFilters): CatalogueFilters {
  return { ...filters, status: null };
}
