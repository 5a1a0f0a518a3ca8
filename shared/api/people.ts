import { PASSWORD_MAX_LENGTH, type Person } from './auth';
import { FieldReader, type Parsed } from './field-reader';
import { isRole, type Role } from './roles';

export type PersonSummary = Person & { createdAt: string; isDisabled: boolean; version: number };

export const PEOPLE_SORT_KEYS = ['email', 'displayName', 'createdAt'] as const;
export type PeopleSortKey = (typeof PEOPLE_SORT_KEYS)[number];

/** An admin's change to a person: any of roles and enabled state, at the version read. */
export interface PersonPatch {
  version: number;
  roles?: Role[];
  isDisabled?: boolean;
}

export interface InvitationInput {
  email: string;
  roles: Role[];
}

export const INVITATION_STATES = ['pending', 'expired', 'accepted', 'withdrawn'] as const;
export type InvitationState = (typeof INVITATION_STATES)[number];

export interface InvitationSummary {
  id: string;
  email: string;
  roles: Role[];
  state: InvitationState;
  invitedByName: string | null;
  createdAt: string;
  /** When the last mail (first or resent) went. */
  sentAt: string;
  expiresAt: string;
}

export const INVITATION_SORT_KEYS = ['email', 'sentAt', 'expiresAt'] as const;
export type InvitationSortKey = (typeof INVITATION_SORT_KEYS)[number];

/** What the invitee sees before accepting (read with the link's secret, no sign-in). */
export interface InvitationPreview {
  email: string;
  roles: Role[];
  expiresAt: string;
}

export interface InvitationAcceptance {
  displayName: string;
  password: string;
}

export const PEOPLE_CHANGE_ACTIONS = [
  'invite',
  'resend_invitation',
  'withdraw_invitation',
  'accept_invitation',
  'change_roles',
  'disable',
  'enable',
  'change_name',
  'change_password',
  'reset_password',
  'sign_out_everywhere',
] as const;
export type PeopleChangeAction = (typeof PEOPLE_CHANGE_ACTIONS)[number];

/** One entry of the people change log. */
export interface PeopleChange {
  id: string;
  at: string;
  /** Who made the change; null when nobody was signed in (a reset by mail). */
  actorName: string | null;
  email: string;
  action: PeopleChangeAction;
  /** { field: { before, after } }; passwords appear only as "changed". */
  changes: Record<string, { before: unknown; after: unknown }>;
}

const EMAIL_PATTERN = /^[^\s@]+@[^\s@]+\.[^\s@]+$/;
const MAX_EMAIL_LENGTH = 254;

function readRoles(reader: FieldReader, key: string, isRequired: boolean): Role[] | undefined {
  const value = reader.raw(key);
  if (value === undefined) {
    if (isRequired) reader.problem(key, `${key} is required`);
    return undefined;
  }
  if (!Array.isArray(value) || !value.every(isRole)) {
    reader.problem(key, `${key} must be a list of roles (admin, archivist, volunteer, climatologist, teacher)`);
    return undefined;
  }
  return [...new Set(value as Role[])].sort();
}

export function isEmail(value: string): boolean {
  return value.length <= MAX_EMAIL_LENGTH && EMAIL_PATTERN.test(value);
}

export function parseInvitationInput(body: unknown): Parsed<InvitationInput> {
  const reader = new FieldReader(body);
  reader.refuseOtherKeys(['email', 'roles']);
  const email = reader.text('email', { isRequired: true, maxLength: MAX_EMAIL_LENGTH });
  if (email !== undefined && email !== '' && !isEmail(email)) reader.problem('email', 'email must be an e-mail address');
  if (email === undefined) reader.problem('email', 'email is required');
  const roles = readRoles(reader, 'roles', true);
  if (!reader.isValid) return { ok: false, details: reader.details };
  return { ok: true, value: { email: email as string, roles: roles as Role[] } };
}

export function parsePersonPatch(body: unknown): Parsed<PersonPatch> {
  const reader = new FieldReader(body);
  reader.refuseOtherKeys(['version', 'roles', 'isDisabled']);
  const version = reader.integer('version', 1);
  if (version === undefined) reader.problem('version', 'version is required (the version you read)');
  const roles = readRoles(reader, 'roles', false);
  const isDisabled = reader.boolean('isDisabled');
  if (!reader.isValid) return { ok: false, details: reader.details };
  return { ok: true, value: { version: version as number, ...(roles ? { roles } : {}), ...(isDisabled !== undefined ? { isDisabled } : {}) } };
}

export function parseInvitationAcceptance(body: unknown): Parsed<InvitationAcceptance> {
  const reader = new FieldReader(body);
  reader.refuseOtherKeys(['displayName', 'password']);
  const displayName = reader.text('displayName', { isRequired: true, maxLength: 100 });
  if (displayName === undefined) reader.problem('displayName', 'displayName is required');
  const password = reader.raw('password');
  if (typeof password !== 'string' || password === '') reader.problem('password', 'password is required');
  else if (password.length > PASSWORD_MAX_LENGTH) reader.problem('password', `password must be at most ${PASSWORD_MAX_LENGTH} characters`);
  if (!reader.isValid) return { ok: false, details: reader.details };
  return { ok: true, value: { displayName: displayName as string, password: password as string } };
}
