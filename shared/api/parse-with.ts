import type { z } from 'zod';
import type { Parsed } from './field-reader';

/** Runs a schema and reports its problems as `details` keyed by dotted path (`notes.2.time`), as the other parsers do. */
export function parseWith<S extends z.ZodType>(schema: S, body: unknown): Parsed<z.output<S>> {
  const result = schema.safeParse(body);
  if (result.success) return { ok: true, value: result.data };
  const details: Record<string, string> = {};
  for (const issue of result.error.issues) {
    if (issue.code === 'unrecognized_keys') {
      // Each unknown field is named under its own path, as the other parsers name theirs.
      for (const field of issue.keys) details[[...issue.path, field].join('.')] ??= `${field} is not a field of this request`;
      continue;
    }
    const key = issue.path.length > 0 ? issue.path.join('.') : 'body';
    details[key] ??= issue.message;
  }
  return { ok: false, details };
}
