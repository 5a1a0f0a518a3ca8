import { ChangeDetectionStrategy, Component, computed, input } from '@angular/core';

import type { SelectOptions } from './select-options';

/** Says which of a form's select lists failed to load, as an alert; nothing when all loaded. */
@Component({
  selector: 'isl-select-options-failure',
  template: `
    @for (failure of failures(); track failure) {
      <p class="isl-inline-error" role="alert" data-testid="select-options-failure">{{ failure }}</p>
    }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class SelectOptionsFailure {
  readonly options = input.required<readonly SelectOptions<unknown>[]>();
  protected readonly failures = computed(() => this.options().flatMap((options) => options.failure() ?? []));
}
