import { scanDetailForTest } from '../../core/api/scan-for-test';
import { instantText, parseTags, scanMetadataChanges, valuesOfScan } from './scan-metadata-changes';

describe('scanMetadataChanges', () => {
  it('when nothing was changed, then only the version is sent', () => {
    const scan = scanDetailForTest({ observer: 'R. Pellow', tags: ['gale'] });

    const changes = scanMetadataChanges(scan, valuesOfScan(scan));

    expect(changes).toEqual({ version: 3 });
  });

  it('when some fields were changed, then exactly those go with the version read', () => {
    const scan = scanDetailForTest({ box: '14' });
    const values = { ...valuesOfScan(scan), box: '15', chartOn: '2026-03-02T09:05Z', tags: 'Gale, torn corner, gale', dpi: '300' };

    const changes = scanMetadataChanges(scan, values);

    expect(changes).toEqual({ version: 3, box: '15', chartOn: '2026-03-02T09:05:00.000Z', tags: ['gale', 'torn corner'], dpi: 300 });
  });

  it('when a field is emptied, then it is sent as null so the server clears it', () => {
    const scan = scanDetailForTest({ stationId: 'st-kro', chartOn: '2026-03-02T09:05:00.000Z' });
    const values = { ...valuesOfScan(scan), stationId: '', chartOn: '' };

    const changes = scanMetadataChanges(scan, values);

    expect(changes).toEqual({ version: 3, stationId: null, chartOn: null });
  });
});

describe('instantText and parseTags', () => {
  it('when an instant is shown, then it is ISO 8601 UTC to the minute', () => {
    expect(instantText('2026-03-02T09:05:00.000Z')).toBe('2026-03-02T09:05Z');
    expect(instantText(null)).toBe('');
  });

  it('when tags are typed with stray commas and case, then they come out lower case without blanks or repeats', () => {
    expect(parseTags(' Gale,, torn corner ,GALE,')).toEqual(['gale', 'torn corner']);
  });
});
