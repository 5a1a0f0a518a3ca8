import { FieldReader, MAX_TEXT_LENGTH, type Parsed } from './field-reader';

/** A barograph a station used. */
export interface InstrumentSummary {
  id: string;
  stationId: string;
  /** Serial number as engraved, free text. */
  serial: string;
  /** Maker as free text, e.g. "Fennick & Sons". */
  maker: string;
  /** Calendar date (YYYY-MM-DD) the instrument was installed at the station; null when unknown. */
  installedOn: string | null;
  /** Calendar date (YYYY-MM-DD) it was removed; null while in use or unknown. */
  removedOn: string | null;
  /** Free-text notes; empty string when none. */
  notes: string;
  /** Optimistic-edit counter; send it back with a PATCH. */
  version: number;
}

/** Body of POST /api/stations/:id/instruments. */
export interface InstrumentInput {
  serial: string;
  maker: string;
  installedOn: string | null;
  removedOn: string | null;
  notes: string;
}

/** Body of PATCH /api/instruments/:id (stale version → 409 version_conflict). */
export type InstrumentPatch = Partial<InstrumentInput> & { version: number };

export const INSTRUMENT_SORT_KEYS = ['serial', 'installedOn'] as const;
export type InstrumentSortKey = (typeof INSTRUMENT_SORT_KEYS)[number];

function readInstrumentFields(reader: FieldReader): Partial<InstrumentInput> {
  const fields: Partial<InstrumentInput> = {};
  const serial = reader.text('serial', { isRequired: true, maxLength: 100 });
  if (serial !== undefined) fields.serial = serial;
  const maker = reader.text('maker');
  if (maker !== undefined) fields.maker = maker;
  const installedOn = reader.nullableDate('installedOn');
  if (installedOn !== undefined) fields.installedOn = installedOn;
  const removedOn = reader.nullableDate('removedOn');
  if (removedOn !== undefined) fields.removedOn = removedOn;
  const notes = reader.text('notes', { maxLength: MAX_TEXT_LENGTH });
  if (notes !== undefined) fields.notes = notes;
  return fields;
}

/** Checks a POST /api/stations/:id/instruments body (serial required; the rest default to '' or null). */
export function parseInstrumentInput(body: unknown): Parsed<InstrumentInput> {
  const reader = new FieldReader(body);
  const fields = readInstrumentFields(reader);
  if (!reader.has('serial')) reader.problem('serial', 'serial is required');
  reader.refuseUnreadKeys();
  const value: InstrumentInput = {
    serial: fields.serial ?? '',
    maker: fields.maker ?? '',
    installedOn: fields.installedOn ?? null,
    removedOn: fields.removedOn ?? null,
    notes: fields.notes ?? '',
  };
  const order = checkInstrumentDates(value.installedOn, value.removedOn);
  if (order) reader.problem('removedOn', order);
  return reader.isValid ? { ok: true, value } : { ok: false, details: reader.details };
}

/** Checks a PATCH /api/instruments/:id body; `version` is required. */
export function parseInstrumentPatch(body: unknown): Parsed<InstrumentPatch> {
  const reader = new FieldReader(body);
  const fields = readInstrumentFields(reader);
  const version = reader.integer('version', 1);
  if (version === undefined) reader.problem('version', 'version (the one you last read) is required');
  reader.refuseUnreadKeys();
  return reader.isValid ? { ok: true, value: { ...fields, version: version as number } } : { ok: false, details: reader.details };
}

/** The problem with an installed/removed pair, or null; YYYY-MM-DD strings compare in date order. */
export function checkInstrumentDates(installedOn: string | null, removedOn: string | null): string | null {
  return installedOn !== null && removedOn !== null && removedOn < installedOn ? 'removedOn must not be before installedOn' : null;
}
