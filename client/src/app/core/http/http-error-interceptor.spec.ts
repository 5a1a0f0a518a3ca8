import { HttpClient, provideHttpClient, withInterceptors } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { TestBed } from '@angular/core/testing';
import { MatSnackBar } from '@angular/material/snack-bar';
import { provideRouter, Router } from '@angular/router';
import type { ApiErrorBody } from '@shared/api/errors';

import { AuthSession, SESSION_EXPIRED_MESSAGE } from '../auth/auth-session';
import { signInForTest } from '../auth/sign-in-for-test';
import { ApiError } from './api-error';
import { httpErrorInterceptor } from './http-error-interceptor';

function errorBody(code: ApiErrorBody['error']['code'], message: string, details?: Record<string, string>): ApiErrorBody {
  return { error: { code, message, details } };
}

/** Waits for the interceptor's async body read (a resolved promise) to finish. */
function settle(): Promise<void> {
  return new Promise((resolve) => setTimeout(resolve, 0));
}

describe('httpErrorInterceptor', () => {
  let http: HttpClient;
  let controller: HttpTestingController;
  let session: AuthSession;
  let navigateByUrl: jest.SpyInstance;
  let openSnackBar: jest.Mock;

  beforeEach(() => {
    localStorage.clear();
    openSnackBar = jest.fn();
    TestBed.configureTestingModule({
      providers: [
        provideRouter([]),
        provideHttpClient(withInterceptors([httpErrorInterceptor])),
        provideHttpClientTesting(),
        { provide: MatSnackBar, useValue: { open: openSnackBar } },
      ],
    });
    http = TestBed.inject(HttpClient);
    controller = TestBed.inject(HttpTestingController);
    session = TestBed.inject(AuthSession);
    navigateByUrl = jest.spyOn(TestBed.inject(Router), 'navigateByUrl').mockResolvedValue(true);
  });

  afterEach(() => controller.verify());

  it('when the server says token_expired, then the person is signed out and sent to sign in with the message', async () => {
    signInForTest(session, ['volunteer']);
    let received: unknown;
    http.get('/api/scans').subscribe({ error: (error: unknown) => (received = error) });

    controller.expectOne('/api/scans').flush(errorBody('token_expired', 'Your session has expired. Please sign in again.'), { status: 401, statusText: 'Unauthorized' });
    await settle();

    expect(session.isSignedIn()).toBe(false);
    expect(session.notice()).toBe(SESSION_EXPIRED_MESSAGE);
    expect(navigateByUrl).toHaveBeenCalledWith('/sign-in');
    expect(received).toBeInstanceOf(ApiError);
    expect((received as ApiError).code).toBe('token_expired');
  });

  it('when a bad password gets 401 before anyone is signed in, then nobody is redirected', async () => {
    let received: ApiError | undefined;
    http.post('/api/auth/sign-in', {}).subscribe({ error: (error: ApiError) => (received = error) });

    controller.expectOne('/api/auth/sign-in').flush(errorBody('unauthenticated', 'E-mail or password is wrong.'), { status: 401, statusText: 'Unauthorized' });
    await settle();

    expect(navigateByUrl).not.toHaveBeenCalled();
    expect(session.notice()).toBeNull();
    expect(received?.message).toBe('E-mail or password is wrong.');
  });

  it('when the answer is 403 forbidden, then the session stays and the error reaches the caller', async () => {
    signInForTest(session, ['teacher']);
    let received: ApiError | undefined;
    http.get('/api/people').subscribe({ error: (error: ApiError) => (received = error) });

    controller.expectOne('/api/people').flush(errorBody('forbidden', 'Admins only.'), { status: 403, statusText: 'Forbidden' });
    await settle();

    expect(session.isSignedIn()).toBe(true);
    expect(received?.status).toBe(403);
    expect(received?.code).toBe('forbidden');
  });

  it('when a validation error has field details, then they are kept on the ApiError', async () => {
    let received: ApiError | undefined;
    http.post('/api/scans/s1/ink-lines', {}).subscribe({ error: (error: ApiError) => (received = error) });

    controller
      .expectOne('/api/scans/s1/ink-lines')
      .flush(errorBody('validation_failed', 'The draft is invalid.', { 'pins.2.pressure': 'pressure must be a number' }), { status: 400, statusText: 'Bad Request' });
    await settle();

    expect(received?.details).toEqual({ 'pins.2.pressure': 'pressure must be a number' });
  });

  it('when a blob request fails, then its JSON error body is read and mapped', async () => {
    let received: ApiError | undefined;
    http.get('/api/series.csv', { responseType: 'blob' }).subscribe({ error: (error: ApiError) => (received = error) });

    const body = new Blob([JSON.stringify(errorBody('station_not_found', 'No such station.'))], { type: 'application/json' });
    controller.expectOne('/api/series.csv').flush(body, { status: 404, statusText: 'Not Found' });
    await settle();
    await settle();

    expect(received?.code).toBe('station_not_found');
    expect(received?.message).toBe('No such station.');
  });

  it('when the server is unreachable, then a snackbar says so', async () => {
    http.get('/api/stations').subscribe({ error: () => undefined });

    controller.expectOne('/api/stations').error(new ProgressEvent('error'), { status: 0, statusText: '' });
    await settle();

    expect(openSnackBar).toHaveBeenCalledWith(expect.stringContaining('could not be reached'), 'Dismiss', expect.anything());
  });
});
