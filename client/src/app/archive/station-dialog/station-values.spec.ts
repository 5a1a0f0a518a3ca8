import { FormControl } from '@angular/forms';

import { STATION_NUMBER_RANGES } from '@shared/api/stations';
import { ianaZoneValidator, numberInRange, stationCodeValidator, stationInputOf, valuesOfStation, wigosIdValidator, EMPTY_STATION } from './station-values';

describe('station form values', () => {
  it('when a station is typed with blanks, then blanks become nulls and text is trimmed', () => {
    const input = stationInputOf({ ...EMPTY_STATION, code: ' KRO ', name: 'Kestrel Ridge Observatory', latitude: '54.612', elevationM: '412', timeZone: 'Europe/London' });

    expect(input).toEqual({
      code: 'KRO',
      name: 'Kestrel Ridge Observatory',
      wigosId: null,
      latitude: 54.612,
      longitude: null,
      elevationM: 412,
      barometerHeightM: null,
      timeZone: 'Europe/London',
      timeStandard: 'local_standard',
      historyNotes: '',
    });
  });

  it('when a station goes to the form and back, then it is unchanged', () => {
    const station = { ...stationInputOf({ ...EMPTY_STATION, code: 'SBS', name: 'Saltmere Bay School', latitude: '50.734', longitude: '-3.405', timeZone: 'Europe/London' }) };

    const back = stationInputOf(valuesOfStation({ ...station, id: 'st-1', version: 2 }));

    expect(back).toEqual(station);
  });
});

describe('station validators', () => {
  // WMO-No. 1160 (Manual on WIGOS) Attachment 1: series-issuer-issue number-local identifier.
  it.each<[string, boolean]>([
    ['0-20000-0-01492', true],
    ['0-826-0-KRO1', true],
    ['01492', false],
    ['0-20000-01492', false],
    ['', true],
  ])('when the WIGOS id is %p, then it is accepted: %p', (id, isValid) => {
    expect(wigosIdValidator(new FormControl(id, { nonNullable: true })) === null).toBe(isValid);
  });

  it.each<[string, boolean]>([
    ['Europe/London', true],
    ['Atlantic/Reykjavik', true],
    ['Europe/Atlantis', false],
    ['GMT+1 summer', false],
  ])('when the zone is %p, then it is accepted: %p', (zone, isValid) => {
    expect(ianaZoneValidator(new FormControl(zone, { nonNullable: true })) === null).toBe(isValid);
  });

  it.each<[string, boolean]>([
    ['KRO', true],
    ['kro-2', true],
    ['K', false],
    ['KESTREL-RIDGE-OBS', false],
    ['KR O', false],
  ])('when the station code is %p, then it is accepted as the server accepts it: %p', (code, isValid) => {
    expect(stationCodeValidator(new FormControl(code, { nonNullable: true })) === null).toBe(isValid);
  });

  it('when a latitude is beyond the pole, then it is refused', () => {
    const latitude = numberInRange(STATION_NUMBER_RANGES.latitude);

    expect(latitude(new FormControl('91', { nonNullable: true }))).toEqual({ range: { min: -90, max: 90 } });
    expect(latitude(new FormControl('-90', { nonNullable: true }))).toBeNull();
  });
});
