import { ChangeDetectionStrategy, Component } from '@angular/core';

/** Shown to a signed-in person whose roles open no area yet. */
@Component({
  selector: 'isl-no-area',
  template: `<p class="isl-page">Your account has no area yet. Ask an admin to give you a role.</p>`,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class NoArea {}
