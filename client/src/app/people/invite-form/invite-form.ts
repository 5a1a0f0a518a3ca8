import { ChangeDetectionStrategy, Component, DestroyRef, inject, output, signal } from '@angular/core';
import { takeUntilDestroyed } from '@angular/core/rxjs-interop';
import { NonNullableFormBuilder, ReactiveFormsModule, Validators } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatInputModule } from '@angular/material/input';
import { MatSelectModule } from '@angular/material/select';
import { ROLES, type Role } from '@shared/api/roles';

import { problemText } from '../../core/http/problem-text';
import { PeopleApi } from '../people-api';

/** The admin invites an address with roles; the server mails the link. */
@Component({
  selector: 'isl-invite-form',
  imports: [ReactiveFormsModule, MatFormFieldModule, MatInputModule, MatSelectModule, MatButtonModule],
  template: `
    <form [formGroup]="form" (ngSubmit)="invite()" class="invite">
      <mat-form-field>
        <mat-label>E-mail to invite</mat-label>
        <input matInput type="email" formControlName="email" data-testid="invite-email" />
      </mat-form-field>
      <mat-form-field>
        <mat-label>Roles</mat-label>
        <mat-select formControlName="roles" multiple data-testid="invite-roles">
          @for (role of roles; track role) {
            <mat-option [value]="role">{{ role }}</mat-option>
          }
        </mat-select>
      </mat-form-field>
      <button mat-flat-button type="submit" [disabled]="isSending()" data-testid="send-invitation">Invite</button>
      @if (note(); as note) {
        <p role="status" data-testid="invite-note">{{ note }}</p>
      }
    </form>
  `,
  styles: `
    .invite {
      display: flex;
      flex-wrap: wrap;
      gap: 8px 16px;
      align-items: baseline;
    }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class InviteForm {
  private readonly api = inject(PeopleApi);
  private readonly destroyRef = inject(DestroyRef);

  readonly invited = output<void>();
  protected readonly roles = ROLES;
  protected readonly isSending = signal(false);
  protected readonly note = signal<string | null>(null);
  protected readonly form = inject(NonNullableFormBuilder).group({
    email: ['', [Validators.required, Validators.email]],
    roles: [[] as Role[]],
  });

  protected invite(): void {
    if (this.form.invalid) return this.form.markAllAsTouched();
    this.isSending.set(true);
    const { email, roles } = this.form.getRawValue();
    this.api
      .invite({ email, roles })
      .pipe(takeUntilDestroyed(this.destroyRef))
      .subscribe({
        next: (invitation) => {
          this.isSending.set(false);
          this.form.reset();
          this.note.set(`Invitation mailed to ${invitation.email}.`);
          this.invited.emit();
        },
        error: (error: unknown) => {
          this.isSending.set(false);
          this.note.set(problemText(error, 'The invitation could not be sent.'));
        },
      });
  }
}
