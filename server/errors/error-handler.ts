import type { ErrorRequestHandler } from 'express';
import { MulterError } from 'multer';
import type { Logger } from 'pino';
import type { ApiErrorBody } from '@shared/api/errors';
import { AppError, HTTP } from './app-error';

/** body-parser marks its errors with `type`; these are the client's fault, not ours. */
function fromBodyParser(err: unknown): AppError | null {
  const type = (err as { type?: unknown })?.type;
  if (type === 'entity.too.large') return new AppError(HTTP.payloadTooLarge, 'bad_request', 'The request body is too large.');
  if (type === 'entity.parse.failed') return new AppError(HTTP.badRequest, 'bad_request', 'The request body is not valid JSON.');
  if (type === 'encoding.unsupported' || type === 'charset.unsupported') {
    return new AppError(HTTP.unsupportedMediaType, 'bad_request', 'The request body encoding is not supported.');
  }
  return null;
}

function fromMulter(err: unknown, maxUploadBytes: number): AppError | null {
  if (!(err instanceof MulterError)) return null;
  if (err.code === 'LIMIT_FILE_SIZE') {
    return new AppError(HTTP.payloadTooLarge, 'file_too_large', `The file is larger than the limit of ${maxUploadBytes} bytes.`);
  }
  return new AppError(HTTP.badRequest, 'bad_request', `The upload was not understood: ${err.message}.`, { field: err.field });
}

/** PostgreSQL refuses NUL in text (22021) and in jsonb (22P05): the client's text, not our fault. */
function fromPostgres(err: unknown): AppError | null {
  const code = (err as { code?: unknown } | null)?.code;
  if (code === '22021' || code === '22P05') return new AppError(HTTP.badRequest, 'validation_failed', 'A text field holds a NUL character (U+0000), which no field may hold.');
  return null;
}

/** The AppError an error stands for (ours, body-parser's or multer's), or null for a fault of the server. */
export function knownError(err: unknown, maxUploadBytes: number): AppError | null {
  return err instanceof AppError ? err : (fromBodyParser(err) ?? fromMulter(err, maxUploadBytes) ?? fromPostgres(err));
}

/** The one place that turns errors into `{ error: { code, message, details? } }`; never sends a stack. */
export function errorHandler(logger: Logger, maxUploadBytes: number): ErrorRequestHandler {
  return (err, req, res, next) => {
    if (res.headersSent) {
      next(err);
      return;
    }
    const known = knownError(err, maxUploadBytes);
    if (known) {
      const body: ApiErrorBody = { error: { code: known.code, message: known.message } };
      if (known.details !== undefined) body.error.details = known.details;
      // A throttle of our own (not express-rate-limit, which sets its own) still tells the client when to come back.
      if (known.status === HTTP.tooManyRequests && !res.getHeader('Retry-After')) res.set('Retry-After', '1');
      res.status(known.status).json(body);
      return;
    }
    logger.error({ err, method: req.method, url: req.originalUrl }, 'unhandled error');
    const body: ApiErrorBody = { error: { code: 'internal_error', message: 'Something went wrong on the server.' } };
    res.status(HTTP.internal).json(body);
  };
}
