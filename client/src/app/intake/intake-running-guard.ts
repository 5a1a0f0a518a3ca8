import type { CanDeactivateFn } from '@angular/router';

/** A page that may be sending files. */
export interface SendsFiles {
  isSending(): boolean;
}

/**
 * Leaving Intake stops the files still being sent (their requests are aborted and the server keeps none
 * of them), so ask first. `confirm` is the browser's own dialog: it needs no inline script under the CSP.
 */
export const intakeRunningGuard: CanDeactivateFn<SendsFiles> = (page) =>
  !page.isSending() || window.confirm('Files are still being sent. Leave and stop the ones not yet stored?');
