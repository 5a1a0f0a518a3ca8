import { ChangeDetectionStrategy, Component, DestroyRef, inject, input, output, signal } from '@angular/core';
import { takeUntilDestroyed } from '@angular/core/rxjs-interop';
import { FormsModule } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatSelectModule } from '@angular/material/select';
import type { PersonSummary } from '@shared/api/people';
import { ROLES, type Role } from '@shared/api/roles';

import { problemText } from '../../core/http/problem-text';
import { PeopleApi } from '../people-api';

/** One person's roles and enabled state, changed in place by the admin; a change ends that person's sessions. */
@Component({
  selector: 'isl-person-roles-editor',
  imports: [FormsModule, MatSelectModule, MatButtonModule],
  template: `
    <div class="editor">
      <mat-select [ngModel]="roles()" (ngModelChange)="roles.set($event)" multiple aria-label="Roles" data-testid="person-roles">
        @for (role of allRoles; track role) {
          <mat-option [value]="role">{{ role }}</mat-option>
        }
      </mat-select>
      <button mat-button type="button" (click)="save({ roles: roles() })" data-testid="save-roles">Save roles</button>
      <button mat-button type="button" (click)="save({ isDisabled: !person().isDisabled })" data-testid="toggle-disabled">
        {{ person().isDisabled ? 'Enable' : 'Disable' }}
      </button>
      @if (note(); as note) {
        <span role="status">{{ note }}</span>
      }
    </div>
  `,
  styles: `
    .editor {
      display: flex;
      align-items: center;
      gap: 8px;
    }
    mat-select {
      min-width: 180px;
    }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class PersonRolesEditor {
  private readonly api = inject(PeopleApi);
  private readonly destroyRef = inject(DestroyRef);

  readonly person = input.required<PersonSummary>();
  readonly changed = output<PersonSummary>();
  protected readonly allRoles = ROLES;
  protected readonly roles = signal<Role[]>([]);
  protected readonly note = signal<string | null>(null);

  ngOnInit(): void {
    this.roles.set([...this.person().roles]);
  }

  protected save(change: { roles?: Role[]; isDisabled?: boolean }): void {
    this.api
      .update(this.person().id, { version: this.person().version, ...change })
      .pipe(takeUntilDestroyed(this.destroyRef))
      .subscribe({
        next: (person) => {
          this.note.set('Saved');
          this.changed.emit(person);
        },
        error: (error: unknown) => this.note.set(problemText(error, 'Not saved.')),
      });
  }
}
