import { FieldReader, MAX_TEXT_LENGTH, type Parsed } from './field-reader';

/** The time standard a station's charts were kept in: local standard time (no summer time) or UTC. */
export const TIME_STANDARDS = ['local_standard', 'utc'] as const;
export type TimeStandard = (typeof TIME_STANDARDS)[number];

export interface StationSummary {
  id: string;
  /** Isallo's own short identifier, e.g. "KRV". Unique. */
  code: string;
  name: string;
  /** Decimal degrees, WGS 84, −90..90; null when unknown. */
  latitude: number | null;
  /** Decimal degrees, WGS 84, −180..180; null when unknown. */
  longitude: number | null;
  /** Station elevation above mean sea level, metres. */
  elevationM: number | null;
  /** IANA time zone name of the station, e.g. "Europe/Oslo". */
  timeZone: string;
  /** WIGOS station identifier, e.g. "0-20000-0-01492"; null when the station has none. */
  wigosId: string | null;
  /** Height of the barometer's cistern (or the barograph) above mean sea level, metres. */
  barometerHeightM: number | null;
  /** Time standard the station's charts were kept in. */
  timeStandard: TimeStandard;
  /** Free-text history: moves, instrument changes, observers. Empty string when none. */
  historyNotes: string;
  /** Optimistic-edit counter; send it back with a PATCH. */
  version: number;
}

/** Body of POST /api/stations. */
export interface StationInput {
  code: string;
  name: string;
  latitude: number | null;
  longitude: number | null;
  elevationM: number | null;
  timeZone: string;
  wigosId: string | null;
  barometerHeightM: number | null;
  timeStandard: TimeStandard;
  historyNotes: string;
}

/** Body of PATCH /api/stations/:id: any StationInput fields plus the version last read (stale → 409 version_conflict). */
export type StationPatch = Partial<StationInput> & { version: number };

export const STATION_SORT_KEYS = ['name', 'code'] as const;
export type StationSortKey = (typeof STATION_SORT_KEYS)[number];

/** A station code: letters, digits and hyphens, 2–12 characters. */
export const STATION_CODE_PATTERN = /^[A-Za-z0-9-]{2,12}$/;
/** A WIGOS station identifier: series-issuer-issue number-local identifier, e.g. 0-20000-0-01492 (WMO-No. 1160). */
export const WIGOS_ID_PATTERN = /^\d+-\d+-\d+-[A-Za-z0-9]{1,16}$/;

/** The ranges a station's numbers must fall in; degrees and metres (from the lowest land to above the highest station). */
export const STATION_NUMBER_RANGES = {
  latitude: { min: -90, max: 90 },
  longitude: { min: -180, max: 180 },
  elevationM: { min: -500, max: 9000 },
  barometerHeightM: { min: -500, max: 9000 },
} as const;

/** True for a time zone name the runtime's IANA database knows. */
export function isTimeZone(name: string): boolean {
  try {
    new Intl.DateTimeFormat('en', { timeZone: name });
    return true;
  } catch {
    // RangeError: not a zone name.
    return false;
  }
}

function readStationFields(reader: FieldReader): Partial<StationInput> {
  const fields: Partial<StationInput> = {};
  const code = reader.text('code', { isRequired: true, maxLength: 12 });
  if (code !== undefined && !STATION_CODE_PATTERN.test(code)) reader.problem('code', 'code must be 2–12 letters, digits or hyphens');
  else if (code !== undefined) fields.code = code.toUpperCase();
  const name = reader.text('name', { isRequired: true });
  if (name !== undefined) fields.name = name;
  const latitude = reader.nullableNumber('latitude', STATION_NUMBER_RANGES.latitude);
  if (latitude !== undefined) fields.latitude = latitude;
  const longitude = reader.nullableNumber('longitude', STATION_NUMBER_RANGES.longitude);
  if (longitude !== undefined) fields.longitude = longitude;
  const elevationM = reader.nullableNumber('elevationM', STATION_NUMBER_RANGES.elevationM);
  if (elevationM !== undefined) fields.elevationM = elevationM;
  const barometerHeightM = reader.nullableNumber('barometerHeightM', STATION_NUMBER_RANGES.barometerHeightM);
  if (barometerHeightM !== undefined) fields.barometerHeightM = barometerHeightM;
  const timeZone = reader.text('timeZone', { isRequired: true, maxLength: 64 });
  if (timeZone !== undefined && !isTimeZone(timeZone)) reader.problem('timeZone', 'timeZone must be an IANA zone name such as Europe/Oslo');
  else if (timeZone !== undefined) fields.timeZone = timeZone;
  const wigosId = reader.nullableText('wigosId', 40);
  if (wigosId && !WIGOS_ID_PATTERN.test(wigosId)) reader.problem('wigosId', 'wigosId must look like 0-20000-0-01492');
  else if (wigosId !== undefined) fields.wigosId = wigosId;
  const timeStandard = reader.oneOf('timeStandard', TIME_STANDARDS);
  if (timeStandard !== undefined) fields.timeStandard = timeStandard;
  const historyNotes = reader.text('historyNotes', { maxLength: MAX_TEXT_LENGTH });
  if (historyNotes !== undefined) fields.historyNotes = historyNotes;
  return fields;
}

/** Checks a POST /api/stations body; absent optional fields default to null, 'local_standard' and ''. */
export function parseStationInput(body: unknown): Parsed<StationInput> {
  const reader = new FieldReader(body);
  const fields = readStationFields(reader);
  for (const key of ['code', 'name', 'timeZone'] as const) if (!reader.has(key)) reader.problem(key, `${key} is required`);
  reader.refuseUnreadKeys();
  if (!reader.isValid) return { ok: false, details: reader.details };
  return {
    ok: true,
    value: {
      code: fields.code as string,
      name: fields.name as string,
      latitude: fields.latitude ?? null,
      longitude: fields.longitude ?? null,
      elevationM: fields.elevationM ?? null,
      timeZone: fields.timeZone as string,
      wigosId: fields.wigosId ?? null,
      barometerHeightM: fields.barometerHeightM ?? null,
      timeStandard: fields.timeStandard ?? 'local_standard',
      historyNotes: fields.historyNotes ?? '',
    },
  };
}

/** Checks a PATCH /api/stations/:id body: only the fields present change; `version` is required. */
export function parseStationPatch(body: unknown): Parsed<StationPatch> {
  const reader = new FieldReader(body);
  const fields = readStationFields(reader);
  const version = reader.integer('version', 1);
  if (version === undefined) reader.problem('version', 'version (the one you last read) is required');
  reader.refuseUnreadKeys();
  if (!reader.isValid) return { ok: false, details: reader.details };
  return { ok: true, value: { ...fields, version: version as number } };
}
