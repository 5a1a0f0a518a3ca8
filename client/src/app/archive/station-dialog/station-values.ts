import type { AbstractControl, ValidationErrors } from '@angular/forms';
import { isTimeZone, STATION_CODE_PATTERN, WIGOS_ID_PATTERN, type StationInput, type StationSummary, type TimeStandard } from '@shared/api/stations';

/** The station form's text values. */
export interface StationValues {
  code: string;
  name: string;
  wigosId: string;
  latitude: string;
  longitude: string;
  elevationM: string;
  barometerHeightM: string;
  timeZone: string;
  timeStandard: TimeStandard;
  historyNotes: string;
}

export const EMPTY_STATION: StationValues = {
  code: '',
  name: '',
  wigosId: '',
  latitude: '',
  longitude: '',
  elevationM: '',
  barometerHeightM: '',
  timeZone: '',
  timeStandard: 'local_standard',
  historyNotes: '',
};

function numberText(n: number | null): string {
  return n === null ? '' : String(n);
}

export function valuesOfStation(station: StationSummary): StationValues {
  return {
    code: station.code,
    name: station.name,
    wigosId: station.wigosId ?? '',
    latitude: numberText(station.latitude),
    longitude: numberText(station.longitude),
    elevationM: numberText(station.elevationM),
    barometerHeightM: numberText(station.barometerHeightM),
    timeZone: station.timeZone,
    timeStandard: station.timeStandard,
    historyNotes: station.historyNotes,
  };
}

function numberOrNull(text: string): number | null {
  return text.trim() === '' ? null : Number(text);
}

export function stationInputOf(values: StationValues): StationInput {
  return {
    code: values.code.trim(),
    name: values.name.trim(),
    wigosId: values.wigosId.trim() === '' ? null : values.wigosId.trim(),
    latitude: numberOrNull(values.latitude),
    longitude: numberOrNull(values.longitude),
    elevationM: numberOrNull(values.elevationM),
    barometerHeightM: numberOrNull(values.barometerHeightM),
    timeZone: values.timeZone.trim(),
    timeStandard: values.timeStandard,
    historyNotes: values.historyNotes,
  };
}

/** A number within [min, max], or empty. */
export function numberInRange({ min, max }: { min: number; max: number }) {
  return (control: AbstractControl<string>): ValidationErrors | null => {
    if (control.value.trim() === '') return null;
    const n = Number(control.value);
    return Number.isFinite(n) && n >= min && n <= max ? null : { range: { min, max } };
  };
}

/** An IANA zone the browser knows (Intl throws a RangeError on unknown names). */
export function ianaZoneValidator(control: AbstractControl<string>): ValidationErrors | null {
  const zone = control.value.trim();
  if (zone === '') return null;
  return isTimeZone(zone) ? null : { ianaZone: true };
}

/** A WIGOS station identifier: series-issuer-issue number-local identifier, e.g. 0-20000-0-01492 (WMO-No. 1160). */
export function wigosIdValidator(control: AbstractControl<string>): ValidationErrors | null {
  const id = control.value.trim();
  if (id === '') return null;
  return WIGOS_ID_PATTERN.test(id) ? null : { wigosId: true };
}

/** A station code as the server takes it: 2–12 letters, digits or hyphens. */
export function stationCodeValidator(control: AbstractControl<string>): ValidationErrors | null {
  const code = control.value.trim();
  if (code === '') return null;
  return STATION_CODE_PATTERN.test(code) ? null : { stationCode: true };
}
