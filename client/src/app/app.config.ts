import { provideHttpClient, withInterceptors } from '@angular/common/http';
import {
  ApplicationConfig,
  ErrorHandler,
  inject,
  provideAppInitializer,
  provideBrowserGlobalErrorListeners,
  provideZonelessChangeDetection,
} from '@angular/core';
import { MAT_FORM_FIELD_DEFAULT_OPTIONS, MatFormFieldDefaultOptions } from '@angular/material/form-field';
import { MatIconRegistry } from '@angular/material/icon';
import { provideRouter, withComponentInputBinding } from '@angular/router';

import { routes } from './app.routes';
import { watchSessionExpiry } from './core/auth/session-expiry';
import { AppErrorHandler } from './core/errors/app-error-handler';
import { authTokenInterceptor } from './core/http/auth-token-interceptor';
import { httpErrorInterceptor } from './core/http/http-error-interceptor';

export const appConfig: ApplicationConfig = {
  providers: [
    provideZonelessChangeDetection(),
    provideBrowserGlobalErrorListeners(),
    // Order is the chain order: the token goes on first, then errors are mapped on the way back.
    provideHttpClient(withInterceptors([authTokenInterceptor, httpErrorInterceptor])),
    provideRouter(routes, withComponentInputBinding()),
    { provide: ErrorHandler, useClass: AppErrorHandler },
    // Outlined fields keep their labels at the compact density (filled ones hide them below -1).
    {
      provide: MAT_FORM_FIELD_DEFAULT_OPTIONS,
      useValue: { appearance: 'outline', subscriptSizing: 'dynamic' } satisfies MatFormFieldDefaultOptions,
    },
    provideAppInitializer(() => {
      // Icons come from the bundled material-symbols font, not the Material Icons default.
      inject(MatIconRegistry).setDefaultFontSetClass('material-symbols-outlined');
      watchSessionExpiry();
    }),
  ],
};
