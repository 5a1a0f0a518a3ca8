import type { ApiErrorCode } from '@shared/api/errors';

/** HTTP statuses the API answers with, by name, so that handlers carry no bare numbers. */
export const HTTP = {
  ok: 200,
  created: 201,
  badRequest: 400,
  unauthorized: 401,
  forbidden: 403,
  notFound: 404,
  conflict: 409,
  payloadTooLarge: 413,
  unsupportedMediaType: 415,
  unprocessable: 422,
  tooManyRequests: 429,
  internal: 500,
  serviceUnavailable: 503,
} as const;

/** An error the client is meant to see: status, stable code, plain message and optional details. */
export class AppError extends Error {
  constructor(
    readonly status: number,
    readonly code: ApiErrorCode,
    message: string,
    readonly details?: unknown,
  ) {
    super(message);
    this.name = 'AppError';
  }
}

/** 400 validation_failed with field-level details, as the shared parsers report them. */
export function validationFailed(details: Record<string, string>, message = 'The request has invalid fields.'): AppError {
  return new AppError(HTTP.badRequest, 'validation_failed', message, details);
}
