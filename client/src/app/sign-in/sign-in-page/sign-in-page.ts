import { ChangeDetectionStrategy, Component, DestroyRef, inject, signal } from '@angular/core';
import { takeUntilDestroyed } from '@angular/core/rxjs-interop';
import { NonNullableFormBuilder, ReactiveFormsModule, Validators } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatCardModule } from '@angular/material/card';
import { ErrorStateMatcher } from '@angular/material/core';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatInputModule } from '@angular/material/input';
import { Router, RouterLink } from '@angular/router';

import { AuthApi } from '../../core/auth/auth-api';
import { AuthSession } from '../../core/auth/auth-session';
import { ApiError } from '../../core/http/api-error';
import { ShowOnSubmitErrorStateMatcher } from '../../shared/forms/show-on-submit-error-state';

@Component({
  selector: 'isl-sign-in-page',
  imports: [ReactiveFormsModule, RouterLink, MatCardModule, MatFormFieldModule, MatInputModule, MatButtonModule],
  templateUrl: './sign-in-page.html',
  styleUrl: './sign-in-page.scss',
  // Empty fields turn red after a submit, not as soon as the person tabs past them.
  providers: [{ provide: ErrorStateMatcher, useClass: ShowOnSubmitErrorStateMatcher }],
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class SignInPage {
  private readonly authApi = inject(AuthApi);
  private readonly router = inject(Router);
  private readonly destroyRef = inject(DestroyRef);
  protected readonly session = inject(AuthSession);

  protected readonly form = inject(NonNullableFormBuilder).group({
    email: ['', [Validators.required, Validators.email]],
    password: ['', Validators.required],
  });
  protected readonly isSending = signal(false);
  protected readonly failure = signal<string | null>(null);

  protected signIn(): void {
    if (this.form.invalid) {
      this.form.markAllAsTouched();
      return;
    }
    this.isSending.set(true);
    this.failure.set(null);
    this.authApi
      .signIn(this.form.getRawValue())
      .pipe(takeUntilDestroyed(this.destroyRef))
      .subscribe({
        next: (response) => {
          this.session.start(response);
          void this.router.navigateByUrl('/');
        },
        error: (error: unknown) => {
          this.isSending.set(false);
          this.failure.set(error instanceof ApiError ? error.message : 'Sign-in failed. Try again.');
        },
      });
  }
}
