import { ErrorHandler, inject, Injectable, Injector } from '@angular/core';
import { MatSnackBar } from '@angular/material/snack-bar';

import { ApiError } from '../http/api-error';

/** Logs every uncaught error; tells the person only when reloading might help. */
@Injectable()
export class AppErrorHandler implements ErrorHandler {
  // Looked up lazily: the handler is built before the overlay container exists.
  private readonly injector = inject(Injector);

  handleError(error: unknown): void {
    console.error(error);
    // ApiErrors were already shown by the interceptor or by the screen that made the call.
    if (error instanceof ApiError) return;
    this.injector.get(MatSnackBar).open('Something went wrong on this page. Reload to try again.', 'Dismiss', { duration: 8000 });
  }
}
