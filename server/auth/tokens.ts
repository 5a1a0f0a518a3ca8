import jwt from 'jsonwebtoken';
import type { Role } from '@shared/api/roles';

export const TOKEN_ALGORITHM = 'HS256';

/** Claims Isallo puts in a token besides `sub` and `exp`. */
export interface TokenClaims {
  roles: Role[];
}

/** Signs a bearer token for a person; `expiresAt` is when it stops being accepted. */
export function issueToken(
  secret: string,
  personId: string,
  roles: Role[],
  ttlSeconds: number,
  nowMs = Date.now(),
): { token: string; expiresAt: Date } {
  const issuedAtSeconds = Math.floor(nowMs / 1000);
  const expiresAtSeconds = issuedAtSeconds + ttlSeconds;
  const claims: TokenClaims & { iat: number; exp: number } = { roles, iat: issuedAtSeconds, exp: expiresAtSeconds };
  const token = jwt.sign(claims, secret, { algorithm: TOKEN_ALGORITHM, subject: personId });
  return { token, expiresAt: new Date(expiresAtSeconds * 1000) };
}
