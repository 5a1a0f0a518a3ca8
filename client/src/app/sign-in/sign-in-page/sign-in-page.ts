import { ChangeDetectionStrategy, Component, inject } from '@angular/core';
import { NonNullableFormBuilder, ReactiveFormsModule, Validators } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatCardModule } from '@angular/material/card';
import { ErrorStateMatcher } from '@angular/material/core';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatInputModule } from '@angular/material/input';
import { RouterLink } from '@angular/router';

import { AuthApi } from '../../core/auth/auth-api';
import { AuthSession } from '../../core/auth/auth-session';
import { ShowOnSubmitErrorStateMatcher } from '../../shared/forms/show-on-submit-error-state';
import { SessionSubmission } from '../../core/auth/session-submission';

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
  protected readonly session = inject(AuthSession);

  protected readonly form = inject(NonNullableFormBuilder).group({
    email: ['', [Validators.required, Validators.email]],
    password: ['', Validators.required],
  });
  private readonly submission = new SessionSubmission();
  protected readonly isSending = this.submission.isSending;
  protected readonly failure = this.submission.failure;

  protected signIn(): void {
    this.submission.submit(this.form, () => this.authApi.signIn(this.form.getRawValue()), 'Sign-in failed. Try again.');
  }
}
