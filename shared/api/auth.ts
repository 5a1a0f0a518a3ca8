import type { Role } from './roles';

export interface SignInRequest {
  email: string;
  password: string;
}

export interface Person {
  id: string;
  email: string;
  displayName: string;
  roles: Role[];
}

export interface SignInResponse {
  /** JWT bearer token for the Authorization header. */
  token: string;
  /** ISO 8601 UTC instant after which the token is refused. */
  expiresAt: string;
  person: Person;
}
