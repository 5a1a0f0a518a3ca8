import { ApiError } from './api-error';

/** The message to show for a failed call: the server's words and its field problems, or a fallback. */
export function problemText(error: unknown, fallback: string): string {
  if (!(error instanceof ApiError)) return fallback;
  const fields = Object.values(error.details);
  return fields.length > 0 ? fields.join(' ') : error.message;
}
