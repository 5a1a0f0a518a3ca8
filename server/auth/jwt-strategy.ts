import { ExtractJwt, Strategy as JwtStrategy } from 'passport-jwt';
import type { Db } from '../db/database';
import { loadSessionPerson } from './session-person';
import type { SignedInPerson } from './signed-in-person';
import { TOKEN_ALGORITHM } from './tokens';

/** What a strategy reports when a well-signed token no longer stands for a session. */
export const SESSION_ENDED = 'SessionEnded';

/** The bearer-token strategy: a signed JWT whose subject and session version still match the database. */
export function jwtStrategy(db: Db, jwtSecret: string): JwtStrategy {
  return new JwtStrategy(
    { jwtFromRequest: ExtractJwt.fromAuthHeaderAsBearerToken(), secretOrKey: jwtSecret, algorithms: [TOKEN_ALGORITHM] },
    (payload: { sub?: unknown; sv?: unknown }, done: (error: unknown, user?: SignedInPerson | false, info?: unknown) => void) => {
      loadSessionPerson(db, payload.sub, payload.sv).then(
        (person) => (person ? done(null, person) : done(null, false, { name: SESSION_ENDED })),
        (error: unknown) => done(error),
      );
    },
  );
}
