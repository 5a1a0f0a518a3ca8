/**
 * Reads a chart start out of a scan's file name by a pattern the archivist types, e.g. `KRO_{yyyy}-{MM}-{dd}`
 * or `{yyyy}{MM}{dd}_{HH}{mm}`. Text outside the braces must appear as written (case ignored); the pattern may
 * sit anywhere in the name. Without {HH}/{mm} the chart starts at 00:00. Times in the name are taken as UTC
 * unless an offset (the station's time standard, minutes east of UTC) is given.
 */

/** The fields a pattern may name, each with its digit count. */
const FIELD_DIGITS = { yyyy: 4, MM: 2, dd: 2, HH: 2, mm: 2 } as const;
type PatternField = keyof typeof FIELD_DIGITS;

export interface CompiledFileNamePattern {
  regex: RegExp;
  fields: PatternField[];
}


/** Turns a pattern into a regular expression, or answers what is wrong with it. */
export function compileFileNamePattern(pattern: string): CompiledFileNamePattern | string {
  const fields: PatternField[] = [];
  let source = '';
  const parts = pattern.split(/(\{[^}]*\})/);
  for (const part of parts) {
    if (part.startsWith('{') && part.endsWith('}')) {
      const name = part.slice(1, -1);
      if (!(name in FIELD_DIGITS)) return `unknown field ${part}: use {yyyy}, {MM}, {dd}, {HH} or {mm}`;
      const field = name as PatternField;
      if (fields.includes(field)) return `${part} appears twice`;
      fields.push(field);
      source += `(\\d{${FIELD_DIGITS[field]}})`;
    } else {
      if (part.includes('{') || part.includes('}')) return 'a brace is not closed';
      source += part.replace(/[.*+?^${}()|[\]\\]/g, '\\$&');
    }
  }
  for (const needed of ['yyyy', 'MM', 'dd'] as const) if (!fields.includes(needed)) return `the pattern needs {${needed}}`;
  if (fields.includes('mm') && !fields.includes('HH')) return 'the pattern has {mm} without {HH}';
  return { regex: new RegExp(source, 'i'), fields };
}

/**
 * The chart start (ISO 8601 UTC) a file name gives by the pattern, or null when the name does not match or
 * gives an impossible date (2026-02-30, hour 25).
 */
export function chartStartFromFileName(fileName: string, pattern: CompiledFileNamePattern, utcOffsetMinutes = 0): string | null {
  const match = pattern.regex.exec(fileName);
  if (!match) return null;
  const value: Record<PatternField, number> = { yyyy: 0, MM: 1, dd: 1, HH: 0, mm: 0 };
  pattern.fields.forEach((field, index) => (value[field] = Number(match[index + 1])));
  const { yyyy, MM, dd, HH, mm } = value;
  if (MM < 1 || MM > 12 || dd < 1 || HH > 23 || mm > 59) return null;
  const local = Date.UTC(yyyy, MM - 1, dd, HH, mm);
  // Date.UTC rolls 30 February over into March: a day past the month's end is no date.
  if (new Date(local).getUTCDate() !== dd) return null;
  return new Date(local - utcOffsetMinutes * 60_000).toISOString();
}
