import { BreakpointObserver } from '@angular/cdk/layout';
import { ChangeDetectionStrategy, Component, computed, inject } from '@angular/core';
import { toSignal } from '@angular/core/rxjs-interop';
import { MatButtonModule } from '@angular/material/button';
import { MatIconModule } from '@angular/material/icon';
import { MatListModule } from '@angular/material/list';
import { MatSidenavModule } from '@angular/material/sidenav';
import { MatToolbarModule } from '@angular/material/toolbar';
import { Router, RouterLink, RouterLinkActive, RouterOutlet } from '@angular/router';
import { map } from 'rxjs';

import { areasFor } from '../auth/areas';
import { AuthSession } from '../auth/auth-session';

/**
 * Toolbar and side navigation around every signed-in screen; lists only the areas the person may use. The
 * first tab stop skips to the page's main landmark; Sign out asks before it acts.
 */
@Component({
  selector: 'isl-app-shell',
  imports: [MatToolbarModule, MatSidenavModule, MatListModule, MatIconModule, MatButtonModule, RouterOutlet, RouterLink, RouterLinkActive],
  templateUrl: './app-shell.html',
  styleUrl: './app-shell.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class AppShell {
  private readonly session = inject(AuthSession);
  private readonly router = inject(Router);

  protected readonly personName = computed(() => this.session.person()?.displayName ?? '');
  protected readonly areas = computed(() => areasFor(this.session.roles()));
  protected readonly isNarrow = toSignal(
    inject(BreakpointObserver).observe('(max-width: 760px)').pipe(map((state) => state.matches)),
    { initialValue: false },
  );

  /** Sign out asks first (a native modal dialog: focus moves into it and Escape keeps the session). */
  protected askToSignOut(dialog: HTMLDialogElement): void {
    dialog.showModal();
  }

  protected signOut(dialog: HTMLDialogElement): void {
    dialog.close();
    this.session.signOut();
    void this.router.navigateByUrl('/sign-in');
  }

  /** The skip link moves focus into the page, past the toolbar and the navigation. */
  protected skipToMain(event: Event, main: HTMLElement): void {
    event.preventDefault();
    main.focus();
  }
}
