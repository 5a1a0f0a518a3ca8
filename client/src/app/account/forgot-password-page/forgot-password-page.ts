import { ChangeDetectionStrategy, Component, DestroyRef, inject, signal } from '@angular/core';
import { takeUntilDestroyed } from '@angular/core/rxjs-interop';
import { NonNullableFormBuilder, ReactiveFormsModule, Validators } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatCardModule } from '@angular/material/card';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatInputModule } from '@angular/material/input';
import { RouterLink } from '@angular/router';

import { AccountApi } from '../account-api';
import { problemText } from '../../core/http/problem-text';

/** Asks for a reset link by mail; the answer is the same whether or not the address has an account. */
@Component({
  selector: 'isl-forgot-password-page',
  imports: [ReactiveFormsModule, RouterLink, MatCardModule, MatFormFieldModule, MatInputModule, MatButtonModule],
  templateUrl: './forgot-password-page.html',
  styleUrl: '../account-card.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class ForgotPasswordPage {
  private readonly api = inject(AccountApi);
  private readonly destroyRef = inject(DestroyRef);

  protected readonly form = inject(NonNullableFormBuilder).group({ email: ['', [Validators.required, Validators.email]] });
  protected readonly answer = signal<string | null>(null);
  protected readonly failure = signal<string | null>(null);
  protected readonly isSending = signal(false);

  protected send(): void {
    if (this.form.invalid) {
      this.form.markAllAsTouched();
      return;
    }
    this.isSending.set(true);
    this.failure.set(null);
    this.api
      .requestPasswordReset(this.form.getRawValue().email)
      .pipe(takeUntilDestroyed(this.destroyRef))
      .subscribe({
        next: (response) => this.answer.set(response.message),
        error: (error: unknown) => {
          this.isSending.set(false);
          this.failure.set(problemText(error, 'The request could not be sent. Try again.'));
        },
      });
  }
}
