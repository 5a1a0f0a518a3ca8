import { parseInstrumentInput } from './instruments';
import { parseScanMetadataInput, parseScanStatusChange } from './parse-scan-metadata';
import { parseStationInput, parseStationPatch } from './stations';

function problemKeys(parsed: { ok: boolean; details?: Record<string, string> }): string[] {
  return parsed.ok ? [] : Object.keys(parsed.details ?? {}).sort();
}

describe('shared body parsers', () => {
  it.each([
    ['a minimal station', { code: 'kro', name: 'Kestrel Ridge', timeZone: 'Europe/London' }, []],
    ['a WIGOS id of the wrong shape', { code: 'KRO', name: 'K', timeZone: 'UTC', wigosId: '03999' }, ['wigosId']],
    ['an unknown time zone', { code: 'KRO', name: 'K', timeZone: 'Europe/Atlantis' }, ['timeZone']],
    ['a longitude past 180', { code: 'KRO', name: 'K', timeZone: 'UTC', longitude: 181 }, ['longitude']],
    ['missing required fields', {}, ['code', 'name', 'timeZone']],
    ['not an object', 'KRO', ['body', 'code', 'name', 'timeZone']],
  ])('when a station body is %s, then the problems are %j', (_case, body, expected) => {
    const parsed = parseStationInput(body);

    expect(problemKeys(parsed)).toEqual(expected);
  });

  it('when a station body is minimal, then the defaults fill the rest and the code is upper case', () => {
    const parsed = parseStationInput({ code: 'kro', name: ' Kestrel Ridge ', timeZone: 'Europe/London' });

    expect(parsed).toEqual({
      ok: true,
      value: {
        code: 'KRO',
        name: 'Kestrel Ridge',
        latitude: null,
        longitude: null,
        elevationM: null,
        timeZone: 'Europe/London',
        wigosId: null,
        barometerHeightM: null,
        timeStandard: 'local_standard',
        historyNotes: '',
      },
    });
  });

  it('when a station patch carries only a version and one field, then only that field is in the value', () => {
    const parsed = parseStationPatch({ version: 4, barometerHeightM: 12.5 });

    expect(parsed).toEqual({ ok: true, value: { version: 4, barometerHeightM: 12.5 } });
  });

  it.each([
    ['dates in order', { serial: 'B-1', installedOn: '1929-05-01', removedOn: '1936-10-12' }, []],
    ['a removal before the installation', { serial: 'B-1', installedOn: '1929-05-01', removedOn: '1928-01-01' }, ['removedOn']],
    ['a date that does not exist', { serial: 'B-1', installedOn: '1929-02-30' }, ['installedOn']],
    ['no serial', { maker: 'Fennick' }, ['serial']],
  ])('when an instrument body has %s, then the problems are %j', (_case, body, expected) => {
    const parsed = parseInstrumentInput(body);

    expect(problemKeys(parsed)).toEqual(expected);
  });

  it.each([
    ['a zoned chart start', { version: 1, chartStart: '1931-03-02T08:00+01:00' }, []],
    ['a time without a zone (read as UTC)', { version: 1, chartStart: '1931-03-02 08:00' }, []],
    ['a date written day first', { version: 1, chartStart: '02.03.1931 08:00' }, ['chartStart']],
    ['chart off before chart on', { version: 1, chartOn: '1931-03-09T08:00Z', chartOff: '1931-03-02T08:00Z' }, ['chartOff']],
    ['a zero dpi', { version: 1, dpi: 0 }, ['dpi']],
    ['no version', { observer: 'A. Q.' }, ['version']],
    ['tags that are not a list', { version: 1, tags: 'gale' }, ['tags']],
  ])('when scan metadata has %s, then the problems are %j', (_case, body, expected) => {
    const parsed = parseScanMetadataInput(body);

    expect(problemKeys(parsed)).toEqual(expected);
  });

  it('when scan metadata has a zoned time and mixed-case tags, then the time is UTC and the tags are lower case once each', () => {
    const parsed = parseScanMetadataInput({ version: 2, chartStart: '1931-03-02T08:00+01:00', tags: ['Gale', 'gale', ' Snow '] });

    expect(parsed).toEqual({ ok: true, value: { version: 2, chartStart: '1931-03-02T07:00:00.000Z', tags: ['gale', 'snow'] } });
  });

  it.each([
    [{ status: 'withdrawn', reason: 'water damage' }, []],
    [{ status: 'withdrawn' }, ['reason']],
    [{ status: 'lost' }, ['status']],
  ])('when a status change is %j, then the problems are %j', (body, expected) => {
    const parsed = parseScanStatusChange(body);

    expect(problemKeys(parsed)).toEqual(expected);
  });
});
