import { ChangeDetectionStrategy, Component, DestroyRef, inject, input, signal } from '@angular/core';
import { takeUntilDestroyed } from '@angular/core/rxjs-interop';
import { NonNullableFormBuilder, ReactiveFormsModule, Validators } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatCardModule } from '@angular/material/card';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatInputModule } from '@angular/material/input';
import { Router, RouterLink } from '@angular/router';
import { PASSWORD_MIN_LENGTH } from '@shared/api/auth';

import { AuthSession } from '../../core/auth/auth-session';
import { AccountApi } from '../account-api';
import { problemText } from '../problem-text';

/** The page a reset mail links to: a new password, which signs the person out everywhere else and in here. */
@Component({
  selector: 'isl-reset-password-page',
  imports: [ReactiveFormsModule, RouterLink, MatCardModule, MatFormFieldModule, MatInputModule, MatButtonModule],
  templateUrl: './reset-password-page.html',
  styleUrl: '../account-card.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class ResetPasswordPage {
  private readonly api = inject(AccountApi);
  private readonly session = inject(AuthSession);
  private readonly router = inject(Router);
  private readonly destroyRef = inject(DestroyRef);

  readonly token = input.required<string>();
  protected readonly minLength = PASSWORD_MIN_LENGTH;
  protected readonly failure = signal<string | null>(null);
  protected readonly isSending = signal(false);
  protected readonly form = inject(NonNullableFormBuilder).group({
    newPassword: ['', [Validators.required, Validators.minLength(PASSWORD_MIN_LENGTH)]],
  });

  protected save(): void {
    if (this.form.invalid) {
      this.form.markAllAsTouched();
      return;
    }
    this.isSending.set(true);
    this.failure.set(null);
    this.api
      .resetPassword(this.token(), this.form.getRawValue().newPassword)
      .pipe(takeUntilDestroyed(this.destroyRef))
      .subscribe({
        next: (response) => {
          this.session.start(response);
          void this.router.navigateByUrl('/');
        },
        error: (error: unknown) => {
          this.isSending.set(false);
          this.failure.set(problemText(error, 'The password could not be set. Try again.'));
        },
      });
  }
}
