import { createHash, randomBytes } from 'node:crypto';

/** The secret of a mailed link (invitation, password reset): 32 random bytes, base64url. */
export function newLinkSecret(): { token: string; tokenHash: string } {
  const token = randomBytes(32).toString('base64url');
  return { token, tokenHash: hashLinkSecret(token) };
}

/** Only this hash is stored, so a copy of the database opens no account. */
export function hashLinkSecret(token: string): string {
  return createHash('sha256').update(token).digest('hex');
}

/** True for text shaped like a link secret (43 base64url characters); anything else names no link. */
export function isLinkSecret(value: unknown): value is string {
  return typeof value === 'string' && /^[A-Za-z0-9_-]{43}$/.test(value);
}
