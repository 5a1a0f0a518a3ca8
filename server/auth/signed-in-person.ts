import type { Role } from '@shared/api/roles';

/** Who made the request, as the verified token says. passport puts it on `req.user`. */
export interface SignedInPerson {
  id: string;
  roles: Role[];
}

declare global {
  // eslint-disable-next-line @typescript-eslint/no-namespace
  namespace Express {
    // Express.User is the type passport gives req.user; ours is always a SignedInPerson.
    // eslint-disable-next-line @typescript-eslint/no-empty-object-type
    interface User extends SignedInPerson {}
  }
}
