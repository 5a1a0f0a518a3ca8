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
