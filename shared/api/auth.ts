import { FieldReader, type Parsed } from './field-reader';
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

/** Shortest password taken (NIST SP 800-63B, 5.1.1.2, asks for at least 8; Isallo asks for 12). */
export const PASSWORD_MIN_LENGTH = 12;
/** Longest password taken; long enough for any passphrase, short enough to hash cheaply. */
export const PASSWORD_MAX_LENGTH = 256;

export interface MePatch {
  displayName: string;
}

export interface PasswordChangeRequest {
  currentPassword: string;
  newPassword: string;
}

/** Asks for a reset link by mail; the answer is the same whether or not the address is known. */
export interface PasswordResetRequest {
  email: string;
}

/** Sets a new password with the secret of a reset link. */
export interface PasswordResetCompletion {
  token: string;
  newPassword: string;
}

function result<T>(reader: FieldReader, value: () => T): Parsed<T> {
  return reader.isValid ? { ok: true, value: value() } : { ok: false, details: reader.details };
}

/** A password field: present and of a length the server takes (whether it is common is the server's check). */
function readPassword(reader: FieldReader, key: string): string | undefined {
  const value = reader.raw(key);
  if (typeof value !== 'string' || value === '') {
    reader.problem(key, `${key} is required`);
    return undefined;
  }
  if (value.length > PASSWORD_MAX_LENGTH) reader.problem(key, `${key} must be at most ${PASSWORD_MAX_LENGTH} characters`);
  return value;
}

export function parseMePatch(body: unknown): Parsed<MePatch> {
  const reader = new FieldReader(body);
  reader.refuseOtherKeys(['displayName']);
  const displayName = reader.text('displayName', { isRequired: true, maxLength: 100 });
  if (displayName === undefined) reader.problem('displayName', 'displayName is required');
  return result(reader, () => ({ displayName: displayName as string }));
}

export function parsePasswordChange(body: unknown): Parsed<PasswordChangeRequest> {
  const reader = new FieldReader(body);
  reader.refuseOtherKeys(['currentPassword', 'newPassword']);
  const currentPassword = readPassword(reader, 'currentPassword');
  const newPassword = readPassword(reader, 'newPassword');
  return result(reader, () => ({ currentPassword: currentPassword as string, newPassword: newPassword as string }));
}

export function parsePasswordResetRequest(body: unknown): Parsed<PasswordResetRequest> {
  const reader = new FieldReader(body);
  reader.refuseOtherKeys(['email']);
  const email = reader.text('email', { isRequired: true, maxLength: 254 });
  if (email === undefined) reader.problem('email', 'email is required');
  return result(reader, () => ({ email: email as string }));
}

export function parsePasswordResetCompletion(body: unknown): Parsed<PasswordResetCompletion> {
  const reader = new FieldReader(body);
  reader.refuseOtherKeys(['token', 'newPassword']);
  const token = reader.text('token', { isRequired: true, maxLength: 200 });
  if (token === undefined) reader.problem('token', 'token is required');
  const newPassword = readPassword(reader, 'newPassword');
  return result(reader, () => ({ token: token as string, newPassword: newPassword as string }));
}
