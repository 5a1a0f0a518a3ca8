import jwt from 'jsonwebtoken';

export const TOKEN_ALGORITHM = 'HS256';

/**
 * Claims Isallo puts in a token besides `sub`, `iat` and `exp`. Roles are not among them: they are read
 * from the database on each request, so that a change takes effect at once.
 */
export interface TokenClaims {
  /** The person's session version when the token was issued; a bump of it ends the token. */
  sv: number;
}

/** Signs a bearer token for a person; `expiresAt` is when it stops being accepted. */
export function issueToken(
  secret: string,
  session: { personId: string; sessionVersion: number },
  ttlSeconds: number,
  nowMs = Date.now(),
): { token: string; expiresAt: Date } {
  const issuedAtSeconds = Math.floor(nowMs / 1000);
  const expiresAtSeconds = issuedAtSeconds + ttlSeconds;
  const claims: TokenClaims & { iat: number; exp: number } = { sv: session.sessionVersion, iat: issuedAtSeconds, exp: expiresAtSeconds };
  const token = jwt.sign(claims, secret, { algorithm: TOKEN_ALGORITHM, subject: session.personId });
  return { token, expiresAt: new Date(expiresAtSeconds * 1000) };
}
