import { afterNextRender, ChangeDetectionStrategy, Component, ElementRef, inject, output } from '@angular/core';
import { MatButtonModule } from '@angular/material/button';
import { MatIconModule } from '@angular/material/icon';

import { BENCH_SHORTCUTS } from '../bench-shortcuts';

/** The Bench's keyboard shortcuts, listed (opened with `?`, closed with Esc or its button). */
@Component({
  selector: 'isl-shortcut-help',
  imports: [MatButtonModule, MatIconModule],
  template: `
    <section class="help" role="region" aria-labelledby="shortcut-help-heading" tabindex="-1" data-testid="shortcut-help">
      <header class="top">
        <h2 id="shortcut-help-heading" class="heading">Keyboard shortcuts</h2>
        <button mat-icon-button type="button" (click)="closed.emit()" aria-label="Close the shortcuts"><mat-icon>close</mat-icon></button>
      </header>
      <dl class="list">
        @for (shortcut of shortcuts; track shortcut.action) {
          <div class="row" data-testid="shortcut-row">
            <dt><kbd>{{ shortcut.keys }}</kbd></dt>
            <dd>{{ shortcut.does }}</dd>
          </div>
        }
      </dl>
      <p class="isl-muted">Keys typed into a field stay in the field. In the Pin step, ↑ ↓ step the time and the pressure by one printed line.</p>
    </section>
  `,
  styles: `
    .help { margin-bottom: 12px; padding: 8px 12px; border: 1px solid var(--mat-sys-outline-variant); border-radius: 8px; background: var(--mat-sys-surface-container-low); }
    .help:focus-visible { outline: 2px solid var(--mat-sys-primary); }
    .top { display: flex; align-items: center; justify-content: space-between; }
    .heading { font: var(--mat-sys-title-medium); margin: 0; }
    .list { margin: 4px 0; font: var(--mat-sys-body-medium); }
    .row { display: grid; grid-template-columns: 6.5em 1fr; gap: 8px; padding: 2px 0; }
    dd { margin: 0; }
    kbd { display: inline-block; font: var(--mat-sys-label-medium); padding: 0 4px; border: 1px solid var(--mat-sys-outline); border-radius: 3px; }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class ShortcutHelp {
  readonly closed = output<void>();
  protected readonly shortcuts = BENCH_SHORTCUTS;

  constructor() {
    // The panel takes focus when it opens, so a screen reader reads it and Esc closes it at once.
    const host = inject<ElementRef<HTMLElement>>(ElementRef);
    afterNextRender(() => host.nativeElement.querySelector<HTMLElement>('[data-testid="shortcut-help"]')?.focus());
  }
}
