import { computed, Injectable, signal } from '@angular/core';
import type { Person, SignInResponse } from '@shared/api/auth';
import type { Role } from '@shared/api/roles';

const STORAGE_KEY = 'isallo.session';

export const SESSION_EXPIRED_MESSAGE = 'Your session has expired. Please sign in again.';

interface StoredSession {
  token: string;
  expiresAt: string;
  person: Person;
}

/** The signed-in person and their token, kept in localStorage so a reload stays signed in. */
@Injectable({ providedIn: 'root' })
export class AuthSession {
  private readonly session = signal<StoredSession | null>(readStoredSession());
  private readonly noticeText = signal<string | null>(null);

  readonly person = computed(() => this.session()?.person ?? null);
  readonly token = computed(() => this.session()?.token ?? null);
  /** Epoch ms after which the token is refused, or null when signed out. */
  readonly expiresAtMs = computed(() => {
    const session = this.session();
    return session ? Date.parse(session.expiresAt) : null;
  });
  readonly isSignedIn = computed(() => this.session() !== null);
  readonly roles = computed<readonly Role[]>(() => this.session()?.person.roles ?? []);
  /** A message for the sign-in screen, e.g. after the session expired. */
  readonly notice = this.noticeText.asReadonly();

  start(response: SignInResponse): void {
    const session: StoredSession = { token: response.token, expiresAt: response.expiresAt, person: response.person };
    localStorage.setItem(STORAGE_KEY, JSON.stringify(session));
    this.noticeText.set(null);
    this.session.set(session);
  }

  signOut(): void {
    localStorage.removeItem(STORAGE_KEY);
    this.session.set(null);
  }

  /** Signs out because the server (or the clock) says the token is no longer good. */
  expire(): void {
    this.signOut();
    this.noticeText.set(SESSION_EXPIRED_MESSAGE);
  }

  clearNotice(): void {
    this.noticeText.set(null);
  }

  hasAnyRole(roles: readonly Role[]): boolean {
    const held = this.roles();
    return roles.some((role) => held.includes(role));
  }
}

function readStoredSession(): StoredSession | null {
  const raw = localStorage.getItem(STORAGE_KEY);
  if (raw === null) return null;
  let parsed: unknown;
  try {
    parsed = JSON.parse(raw);
  } catch {
    // A damaged entry (hand-edited, older format) just means signed out.
    localStorage.removeItem(STORAGE_KEY);
    return null;
  }
  if (!isStoredSession(parsed) || Date.parse(parsed.expiresAt) <= Date.now()) {
    localStorage.removeItem(STORAGE_KEY);
    return null;
  }
  return parsed;
}

function isStoredSession(x: unknown): x is StoredSession {
  if (typeof x !== 'object' || x === null) return false;
  const s = x as Record<string, unknown>;
  const person = s['person'] as Record<string, unknown> | null | undefined;
  return (
    typeof s['token'] === 'string' &&
    typeof s['expiresAt'] === 'string' &&
    !Number.isNaN(Date.parse(s['expiresAt'])) &&
    typeof person === 'object' &&
    person !== null &&
    typeof person['displayName'] === 'string' &&
    Array.isArray(person['roles'])
  );
}
