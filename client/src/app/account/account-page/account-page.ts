import { ChangeDetectionStrategy, Component, DestroyRef, inject, signal } from '@angular/core';
import { takeUntilDestroyed } from '@angular/core/rxjs-interop';
import { NonNullableFormBuilder, ReactiveFormsModule, Validators } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatInputModule } from '@angular/material/input';
import { Router } from '@angular/router';
import { PASSWORD_MIN_LENGTH } from '@shared/api/auth';

import { AuthSession } from '../../core/auth/auth-session';
import { AccountApi } from '../account-api';
import { problemText } from '../../core/http/problem-text';

/** The signed-in person's own account: name, password, and signing out on every device. */
@Component({
  selector: 'isl-account-page',
  imports: [ReactiveFormsModule, MatFormFieldModule, MatInputModule, MatButtonModule],
  templateUrl: './account-page.html',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class AccountPage {
  private readonly api = inject(AccountApi);
  private readonly router = inject(Router);
  private readonly destroyRef = inject(DestroyRef);
  protected readonly session = inject(AuthSession);
  private readonly fb = inject(NonNullableFormBuilder);

  protected readonly minLength = PASSWORD_MIN_LENGTH;
  protected readonly nameForm = this.fb.group({ displayName: [this.session.person()?.displayName ?? '', [Validators.required, Validators.maxLength(100)]] });
  protected readonly passwordForm = this.fb.group({
    currentPassword: ['', Validators.required],
    newPassword: ['', [Validators.required, Validators.minLength(PASSWORD_MIN_LENGTH)]],
  });
  protected readonly nameNote = signal<string | null>(null);
  protected readonly passwordNote = signal<string | null>(null);
  protected readonly failure = signal<string | null>(null);

  protected saveName(): void {
    if (this.nameForm.invalid) return this.nameForm.markAllAsTouched();
    this.api
      .changeName(this.nameForm.getRawValue())
      .pipe(takeUntilDestroyed(this.destroyRef))
      .subscribe({
        next: (person) => {
          const token = this.session.token();
          const expiresAtMs = this.session.expiresAtMs();
          if (token && expiresAtMs) this.session.start({ token, expiresAt: new Date(expiresAtMs).toISOString(), person });
          this.nameNote.set('Your name is saved.');
        },
        error: (error: unknown) => this.nameNote.set(problemText(error, 'Your name could not be saved.')),
      });
  }

  protected changePassword(): void {
    if (this.passwordForm.invalid) return this.passwordForm.markAllAsTouched();
    this.api
      .changePassword(this.passwordForm.getRawValue())
      .pipe(takeUntilDestroyed(this.destroyRef))
      .subscribe({
        next: (response) => {
          // Every other session has ended; this one goes on with the new token.
          this.session.start(response);
          this.passwordForm.reset();
          this.passwordNote.set('Your password is changed; you were signed out everywhere else.');
        },
        error: (error: unknown) => this.passwordNote.set(problemText(error, 'Your password could not be changed.')),
      });
  }

  protected signOutEverywhere(): void {
    this.api
      .signOutEverywhere()
      .pipe(takeUntilDestroyed(this.destroyRef))
      .subscribe({
        next: () => {
          this.session.signOut();
          void this.router.navigateByUrl('/sign-in');
        },
        error: (error: unknown) => this.failure.set(problemText(error, 'Signing out everywhere failed.')),
      });
  }
}
