import type { Request, RequestHandler } from 'express';
import { ipKeyGenerator, rateLimit } from 'express-rate-limit';
import { AppError, HTTP } from '../errors/app-error';

/**
 * The app's request limits, in one place (express-rate-limit, in-memory per process). Each answers
 * 429 rate_limited with Retry-After and the RateLimit headers (IETF draft 8) once its limit is reached.
 */
interface LimitOptions {
  windowMs: number;
  limit: number;
  /** Said in the 429 message, e.g. "sign-in attempts from your address". */
  what: string;
  /** Only failed requests (status ≥ 400) count: a right password or a shown page uses up nothing. */
  failuresOnly?: boolean;
  /** The key to count under; default the client address (IPv6 by /56 subnet, as the library advises). */
  keyOf?: (req: Request) => string;
}

function limiter(options: LimitOptions): RequestHandler {
  const minutes = Math.ceil(options.windowMs / 60_000);
  return rateLimit({
    windowMs: options.windowMs,
    limit: options.limit,
    standardHeaders: 'draft-8',
    legacyHeaders: false,
    skipSuccessfulRequests: options.failuresOnly ?? false,
    keyGenerator: options.keyOf ?? ((req) => ipKeyGenerator(req.ip ?? '')),
    handler: (_req, res, next) =>
      next(new AppError(HTTP.tooManyRequests, 'rate_limited', `Too many ${options.what}; try again in ${res.getHeader('Retry-After') ?? minutes * 60} seconds.`)),
  });
}

/** The e-mail a body names, lower-cased, for limits per account; '' when there is none. */
function bodyEmail(req: Request): string {
  const email = (req.body as { email?: unknown } | undefined)?.email;
  return typeof email === 'string' ? email.trim().toLowerCase() : '';
}

/** Failed sign-ins from one address: enough for typos, far too few to guess (and argon2 work stays bounded). */
export const SIGN_IN_FAILURES_PER_ADDRESS = 20;
/** Failed sign-ins to one account from anywhere, per 15 minutes. */
export const SIGN_IN_FAILURES_PER_ACCOUNT = 10;
/** Reset mails asked for one account, and from one address, per 15 minutes. */
export const RESET_REQUESTS_PER_ACCOUNT = 5;
export const RESET_REQUESTS_PER_ADDRESS = 20;
/** Requests one address may make to share links per minute (a class of thirty opening a page and its charts). */
export const SHARED_REQUESTS_PER_MINUTE = 300;

const FIFTEEN_MINUTES = 15 * 60_000;

/** Sign-in: per address and per account, each counting failures only. */
export function signInLimits(): RequestHandler[] {
  return [
    limiter({ windowMs: FIFTEEN_MINUTES, limit: SIGN_IN_FAILURES_PER_ADDRESS, what: 'failed sign-ins from your address', failuresOnly: true }),
    limiter({ windowMs: FIFTEEN_MINUTES, limit: SIGN_IN_FAILURES_PER_ACCOUNT, what: 'failed sign-ins to this account', failuresOnly: true, keyOf: (req) => `account:${bodyEmail(req)}` }),
  ];
}

/** Password reset requests, and the pages a mailed link opens (invitation, reset): per address; requests also per account. */
export function resetRequestLimits(): RequestHandler[] {
  return [
    limiter({ windowMs: FIFTEEN_MINUTES, limit: RESET_REQUESTS_PER_ADDRESS, what: 'reset requests from your address' }),
    limiter({ windowMs: FIFTEEN_MINUTES, limit: RESET_REQUESTS_PER_ACCOUNT, what: 'reset requests for this account', keyOf: (req) => `account:${bodyEmail(req)}` }),
  ];
}

/** Using a mailed link (accepting an invitation, setting a password): per address, failures only. */
export function mailedLinkLimit(): RequestHandler {
  return limiter({ windowMs: FIFTEEN_MINUTES, limit: SIGN_IN_FAILURES_PER_ADDRESS, what: 'failed uses of mailed links from your address', failuresOnly: true });
}

/** Share-link pages and their chart regions, per address. */
export function sharedLinkLimit(): RequestHandler {
  return limiter({ windowMs: 60_000, limit: SHARED_REQUESTS_PER_MINUTE, what: 'requests to share links from your address' });
}
