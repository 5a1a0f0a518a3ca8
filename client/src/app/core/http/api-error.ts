import { HttpErrorResponse } from '@angular/common/http';
import type { ApiErrorBody, ApiErrorCode } from '@shared/api/errors';

/** A failed API call as the rest of the client sees it: the status plus the shared error body's fields. */
export class ApiError extends Error {
  constructor(
    readonly status: number,
    readonly code: ApiErrorCode,
    message: string,
    readonly details: Record<string, string> = {},
    /** The answer's body as parsed, for routes whose 4xx answers carry more than the error body. */
    readonly body: unknown = null,
  ) {
    super(message);
    this.name = 'ApiError';
  }
}

export function isApiErrorBody(x: unknown): x is ApiErrorBody {
  if (typeof x !== 'object' || x === null) return false;
  const error = (x as Record<string, unknown>)['error'];
  return (
    typeof error === 'object' &&
    error !== null &&
    typeof (error as Record<string, unknown>)['code'] === 'string' &&
    typeof (error as Record<string, unknown>)['message'] === 'string'
  );
}

/** Maps an HttpErrorResponse whose body is already parsed (or absent) to an ApiError. */
export function toApiError(response: HttpErrorResponse, body: unknown = response.error): ApiError {
  if (isApiErrorBody(body)) {
    return new ApiError(response.status, body.error.code, body.error.message, toDetails(body.error.details), body);
  }
  if (response.status === 0) {
    return new ApiError(0, 'internal_error', 'The server could not be reached. Check the connection and try again.');
  }
  return new ApiError(response.status, codeForStatus(response.status), `The server answered ${response.status} ${response.statusText}`.trim(), {}, body);
}

/** Error bodies of blob requests (previews, CSV) arrive as a Blob; read them so they map like any other. */
export async function readErrorBody(response: HttpErrorResponse): Promise<unknown> {
  const body: unknown = response.error;
  if (typeof Blob !== 'undefined' && body instanceof Blob) return parseJson(await readBlobText(body));
  if (typeof body === 'string') return parseJson(body);
  return body;
}

// FileReader rather than Blob.text(): the same code then runs in jsdom, which lacks Blob.text().
function readBlobText(blob: Blob): Promise<string> {
  return new Promise((resolve, reject) => {
    const reader = new FileReader();
    reader.onload = () => resolve(String(reader.result ?? ''));
    reader.onerror = () => reject(reader.error);
    reader.readAsText(blob);
  });
}

function parseJson(text: string): unknown {
  try {
    return JSON.parse(text);
  } catch {
    // Not JSON (a proxy's HTML page, say): map by status alone.
    return null;
  }
}

function toDetails(details: unknown): Record<string, string> {
  if (typeof details !== 'object' || details === null) return {};
  const entries = Object.entries(details as Record<string, unknown>).map(([key, value]) => [key, String(value)]);
  return Object.fromEntries(entries);
}

function codeForStatus(status: number): ApiErrorCode {
  if (status === 401) return 'unauthenticated';
  if (status === 403) return 'forbidden';
  if (status === 404) return 'not_found';
  if (status >= 400 && status < 500) return 'bad_request';
  return 'internal_error';
}
