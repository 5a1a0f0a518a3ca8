import { isCalendarDate, isId, readInstant } from './parse-instant';

// The readers of instants, days and ids live in parse-instant.ts; these names stay for the parsers that import them here.
export { isCalendarDate, isId, normalizeInstant } from './parse-instant';

/** Adds a problem to `details` for each key of `record` not among `allowed` (`prefix` names where the record sits). */
export function refuseUnknownKeys(record: Record<string, unknown>, allowed: readonly string[], details: Record<string, string>, prefix = ''): void {
  for (const key of Object.keys(record)) {
    if (!allowed.includes(key)) details[`${prefix}${key}`] ??= `${key} is not a field of this request`;
  }
}

/** Result of a shared body parser: the value, or field problems keyed by field name. */
export type Parsed<T> = { ok: true; value: T } | { ok: false; details: Record<string, string> };

/** Longest free-text field the API keeps, characters (transcriptions and history notes can be long). */
export const MAX_TEXT_LENGTH = 20_000;
/** Longest one-line field (names, codes, references), characters. */
export const MAX_LINE_LENGTH = 300;

/**
 * Reads the fields of a JSON body one by one, collecting every problem in `details`.
 * Each reader returns undefined when the key is absent (a PATCH leaves that field alone).
 */
export class FieldReader {
  readonly details: Record<string, string> = {};
  private readonly record: Record<string, unknown>;
  /** Keys some reader has looked at: whatever else the body holds is unknown to this request. */
  private readonly seen = new Set<string>();

  constructor(body: unknown) {
    this.record = typeof body === 'object' && body !== null && !Array.isArray(body) ? (body as Record<string, unknown>) : {};
    if (this.record !== body) this.details['body'] = 'the body must be a JSON object';
  }

  /** Names each key of the body that is not among `allowed`: an unknown field is a mistake, not something to ignore. */
  refuseOtherKeys(allowed: readonly string[]): void {
    for (const key of Object.keys(this.record)) {
      if (!allowed.includes(key)) this.problem(key, `${key} is not a field of this request`);
    }
  }

  /**
   * Names each key of the body that no reader has looked at. Call it after the last read: a parser then
   * refuses unknown fields without a second list of its keys to keep in step.
   */
  refuseUnreadKeys(): void {
    for (const key of Object.keys(this.record)) {
      if (!this.seen.has(key)) this.problem(key, `${key} is not a field of this request`);
    }
  }

  /** The value as sent, for readers of shapes this class does not know. */
  raw(key: string): unknown {
    return this.value(key);
  }

  private value(key: string): unknown {
    this.seen.add(key);
    return this.record[key];
  }

  boolean(key: string): boolean | undefined {
    const value = this.value(key);
    if (value === undefined) return undefined;
    if (typeof value !== 'boolean') return this.fail(key, `${key} must be true or false`);
    return value;
  }

  has(key: string): boolean {
    return this.value(key) !== undefined;
  }

  problem(key: string, message: string): void {
    this.details[key] ??= message;
  }

  get isValid(): boolean {
    return Object.keys(this.details).length === 0;
  }

  /** A string, trimmed; `isRequired` refuses an empty one. */
  text(key: string, options: { isRequired?: boolean; maxLength?: number } = {}): string | undefined {
    const value = this.value(key);
    if (value === undefined) return undefined;
    const maxLength = options.maxLength ?? MAX_LINE_LENGTH;
    if (typeof value !== 'string') return this.fail(key, `${key} must be text`);
    const trimmed = value.trim();
    if (options.isRequired && trimmed === '') return this.fail(key, `${key} is required`);
    if (trimmed.length > maxLength) return this.fail(key, `${key} must be at most ${maxLength} characters`);
    return trimmed;
  }

  /** Text or null; an empty string reads as null. */
  nullableText(key: string, maxLength = MAX_LINE_LENGTH): string | null | undefined {
    if (this.value(key) === null) return null;
    const text = this.text(key, { maxLength });
    return text === '' ? null : text;
  }

  nullableNumber(key: string, range: { min?: number; max?: number; isPositive?: boolean } = {}): number | null | undefined {
    const value = this.value(key);
    if (value === undefined || value === null) return value as undefined | null;
    if (typeof value !== 'number' || !Number.isFinite(value)) return this.fail(key, `${key} must be a number or null`);
    if (range.isPositive && !(value > 0)) return this.fail(key, `${key} must be above 0`);
    if (range.min !== undefined && value < range.min) return this.fail(key, `${key} must be at least ${range.min}`);
    if (range.max !== undefined && value > range.max) return this.fail(key, `${key} must be at most ${range.max}`);
    return value;
  }

  integer(key: string, min = 0): number | undefined {
    const value = this.value(key);
    if (value === undefined) return undefined;
    if (typeof value !== 'number' || !Number.isInteger(value) || value < min) return this.fail(key, `${key} must be a whole number from ${min}`);
    return value;
  }

  /** A calendar date YYYY-MM-DD or null. */
  nullableDate(key: string): string | null | undefined {
    const value = this.value(key);
    if (value === undefined || value === null) return value as undefined | null;
    if (!isCalendarDate(value)) return this.fail(key, `${key} must be a date YYYY-MM-DD or null`);
    return value;
  }

  /** An instant (see readInstant), normalised to an ISO 8601 UTC string, or null. */
  nullableInstant(key: string): string | null | undefined {
    const value = this.value(key);
    if (value === undefined || value === null) return value as undefined | null;
    const reading = readInstant(value);
    if (!reading.ok) return this.fail(key, `${key} ${reading.problem}, or null`);
    return new Date(reading.ms).toISOString();
  }

  nullableId(key: string): string | null | undefined {
    const value = this.value(key);
    if (value === undefined || value === null) return value as undefined | null;
    if (!isId(value)) return this.fail(key, `${key} must be an id or null`);
    return value;
  }

  oneOf<T extends string>(key: string, values: readonly T[]): T | undefined {
    const value = this.value(key);
    if (value === undefined) return undefined;
    if (typeof value !== 'string' || !(values as readonly string[]).includes(value)) return this.fail(key, `${key} must be one of: ${values.join(', ')}`);
    return value as T;
  }

  /** A list of short strings, trimmed, empty ones dropped, duplicates removed. */
  textList(key: string, maxItems = 50): string[] | undefined {
    const value = this.value(key);
    if (value === undefined) return undefined;
    if (!Array.isArray(value) || value.length > maxItems || value.some((item) => typeof item !== 'string' || item.length > 100)) {
      return this.fail(key, `${key} must be a list of at most ${maxItems} texts of up to 100 characters`);
    }
    return [...new Set((value as string[]).map((item) => item.trim()).filter((item) => item !== ''))];
  }

  private fail(key: string, message: string): undefined {
    this.problem(key, message);
    return undefined;
  }
}
