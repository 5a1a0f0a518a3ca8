import { ChangeDetectionStrategy, Component, DestroyRef, inject, input, OnInit, signal } from '@angular/core';
import { takeUntilDestroyed } from '@angular/core/rxjs-interop';
import { NonNullableFormBuilder, ReactiveFormsModule, Validators } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatCardModule } from '@angular/material/card';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatInputModule } from '@angular/material/input';
import { RouterLink } from '@angular/router';
import { PASSWORD_MIN_LENGTH } from '@shared/api/auth';
import type { InvitationPreview } from '@shared/api/people';

import { AccountApi } from '../account-api';
import { problemText } from '../../core/http/problem-text';
import { SessionSubmission } from '../../core/auth/session-submission';

/** The page an invitation mail links to: the invitee chooses a name and password and is signed in. */
@Component({
  selector: 'isl-accept-invitation-page',
  imports: [ReactiveFormsModule, RouterLink, MatCardModule, MatFormFieldModule, MatInputModule, MatButtonModule],
  templateUrl: './accept-invitation-page.html',
  styleUrl: '../account-card.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class AcceptInvitationPage implements OnInit {
  private readonly api = inject(AccountApi);
  private readonly destroyRef = inject(DestroyRef);

  /** The link's secret, from the route. */
  readonly token = input.required<string>();
  protected readonly minLength = PASSWORD_MIN_LENGTH;
  protected readonly invitation = signal<InvitationPreview | null>(null);
  private readonly submission = new SessionSubmission();
  protected readonly failure = this.submission.failure;
  protected readonly isSending = this.submission.isSending;
  protected readonly form = inject(NonNullableFormBuilder).group({
    displayName: ['', [Validators.required, Validators.maxLength(100)]],
    password: ['', [Validators.required, Validators.minLength(PASSWORD_MIN_LENGTH)]],
  });

  ngOnInit(): void {
    this.api
      .invitation(this.token())
      .pipe(takeUntilDestroyed(this.destroyRef))
      .subscribe({
        next: (invitation) => this.invitation.set(invitation),
        error: (error: unknown) => this.failure.set(problemText(error, 'This invitation could not be opened.')),
      });
  }

  protected accept(): void {
    this.submission.submit(this.form, () => this.api.acceptInvitation(this.token(), this.form.getRawValue()), 'The account could not be made. Try again.');
  }
}
