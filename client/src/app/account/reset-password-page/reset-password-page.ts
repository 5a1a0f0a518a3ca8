import { ChangeDetectionStrategy, Component, inject, input } from '@angular/core';
import { NonNullableFormBuilder, ReactiveFormsModule, Validators } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatCardModule } from '@angular/material/card';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatInputModule } from '@angular/material/input';
import { RouterLink } from '@angular/router';
import { PASSWORD_MIN_LENGTH } from '@shared/api/auth';

import { AccountApi } from '../account-api';
import { SessionSubmission } from '../../core/auth/session-submission';

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

  readonly token = input.required<string>();
  protected readonly minLength = PASSWORD_MIN_LENGTH;
  private readonly submission = new SessionSubmission();
  protected readonly failure = this.submission.failure;
  protected readonly isSending = this.submission.isSending;
  protected readonly form = inject(NonNullableFormBuilder).group({
    newPassword: ['', [Validators.required, Validators.minLength(PASSWORD_MIN_LENGTH)]],
  });

  protected save(): void {
    this.submission.submit(
      this.form,
      () => this.api.resetPassword(this.token(), this.form.getRawValue().newPassword),
      'The password could not be set. Try again.',
    );
  }
}
