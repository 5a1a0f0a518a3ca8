import { DestroyRef, inject, signal } from '@angular/core';
import { takeUntilDestroyed } from '@angular/core/rxjs-interop';
import type { AbstractControl } from '@angular/forms';
import { Router } from '@angular/router';
import type { SignInResponse } from '@shared/api/auth';
import type { Observable } from 'rxjs';

import { AuthSession } from './auth-session';
import { problemText } from '../http/problem-text';

/**
 * A form whose answer is a new session (sign-in, accepting an invitation, setting a new password): it checks the
 * form, sends once, starts the session and goes home, or keeps the page and says why not. Create it in a field
 * initializer of the page, where `inject` works.
 */
export class SessionSubmission {
  private readonly session = inject(AuthSession);
  private readonly router = inject(Router);
  private readonly destroyRef = inject(DestroyRef);

  readonly isSending = signal(false);
  readonly failure = signal<string | null>(null);

  submit(form: AbstractControl, request: () => Observable<SignInResponse>, fallbackText: string): void {
    if (form.invalid) {
      form.markAllAsTouched();
      return;
    }
    this.isSending.set(true);
    this.failure.set(null);
    request()
      .pipe(takeUntilDestroyed(this.destroyRef))
      .subscribe({
        next: (response) => {
          this.session.start(response);
          void this.router.navigateByUrl('/');
        },
        error: (error: unknown) => {
          this.isSending.set(false);
          this.failure.set(problemText(error, fallbackText));
        },
      });
  }
}
