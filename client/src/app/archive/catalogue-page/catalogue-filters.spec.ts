import { convertToParamMap, type Params } from '@angular/router';

import { catalogueStateFromParams, DEFAULT_QUERY, NO_FILTERS, paramsFromCatalogueState, scanFiltersOf } from './catalogue-filters';

/** What Angular does with the params on navigation: null and undefined drop out, numbers become strings. */
function roundTrip(params: Params) {
  const kept: Params = {};
  for (const [key, value] of Object.entries(params)) {
    if (value === null || value === undefined) continue;
    kept[key] = Array.isArray(value) ? value.map(String) : String(value);
  }
  return kept;
}

describe('catalogue filters in the address', () => {
  it('when every filter, the page and a sort are set, then they survive the trip through the address', () => {
    const state = {
      filters: {
        stationId: 'st-kro',
        fromDay: '2026-04-06',
        toDay: '2026-04-12',
        status: 'received' as const,
        instrumentId: 'in-7',
        chartFormId: 'cf-1',
        tags: ['gale', 'torn corner'],
        q: 'box 14',
        batchId: 'b-1',
      },
      query: { page: 3, pageSize: 50, sort: 'chartStart' as const, direction: 'asc' as const },
    };

    const params = roundTrip(paramsFromCatalogueState(state));
    const back = catalogueStateFromParams(convertToParamMap(params));

    expect(params['tag']).toEqual(['gale', 'torn corner']);
    expect(params['from']).toBe('2026-04-06');
    expect(back).toEqual(state);
  });

  it('when nothing is chosen, then the address carries no query at all', () => {
    const params = roundTrip(paramsFromCatalogueState({ filters: NO_FILTERS, query: DEFAULT_QUERY }));

    expect(params).toEqual({});
  });

  it('when the sort is switched off, then "none" keeps it apart from the default sort', () => {
    const params = roundTrip(paramsFromCatalogueState({ filters: NO_FILTERS, query: { ...DEFAULT_QUERY, sort: undefined, direction: 'asc' } }));
    const back = catalogueStateFromParams(convertToParamMap(params));

    expect(params['sort']).toBe('none');
    expect(back.query.sort).toBeUndefined();
  });

  it('when the address holds nonsense, then each bad value falls back to its default', () => {
    const state = catalogueStateFromParams(
      convertToParamMap({ status: 'lost', from: '2026-02-30', page: '-2', pageSize: '9000', sort: 'sha256', tag: ['  ', 'Gale', 'gale'] }),
    );

    expect(state.filters.status).toBeNull();
    expect(state.filters.fromDay).toBeNull();
    expect(state.filters.tags).toEqual(['gale']);
    expect(state.query).toEqual({ ...DEFAULT_QUERY, direction: 'asc', sort: 'uploadedAt' });
  });
});

describe('scanFiltersOf', () => {
  it('when a day range is set, then it becomes instants from midnight of the first day to midnight after the last', () => {
    const filters = scanFiltersOf({ ...NO_FILTERS, fromDay: '2026-04-06', toDay: '2026-04-12' });

    expect(filters).toEqual({ from: '2026-04-06T00:00:00.000Z', to: '2026-04-13T00:00:00.000Z' });
  });

  it('when no filter is set, then the API gets none', () => {
    const filters = scanFiltersOf(NO_FILTERS);

    expect(filters).toEqual({});
  });
});
