import { HttpClient, provideHttpClient, withInterceptors } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { TestBed } from '@angular/core/testing';
import { provideRouter } from '@angular/router';

import { AuthSession } from '../auth/auth-session';
import { signInForTest } from '../auth/sign-in-for-test';
import { authTokenInterceptor } from './auth-token-interceptor';

describe('authTokenInterceptor', () => {
  let http: HttpClient;
  let controller: HttpTestingController;

  beforeEach(() => {
    localStorage.clear();
    TestBed.configureTestingModule({
      providers: [provideRouter([]), provideHttpClient(withInterceptors([authTokenInterceptor])), provideHttpClientTesting()],
    });
    http = TestBed.inject(HttpClient);
    controller = TestBed.inject(HttpTestingController);
  });

  afterEach(() => controller.verify());

  it('when someone is signed in, then API calls carry their bearer token', () => {
    signInForTest(TestBed.inject(AuthSession), ['archivist']);

    http.get('/api/scans').subscribe();

    expect(controller.expectOne('/api/scans').request.headers.get('Authorization')).toBe('Bearer token-test');
  });

  it('when nobody is signed in, then no Authorization header is sent', () => {
    http.get('/api/health').subscribe();

    expect(controller.expectOne('/api/health').request.headers.has('Authorization')).toBe(false);
  });

  it('when an image is asked for through IIIF, then it carries the bearer token too', () => {
    signInForTest(TestBed.inject(AuthSession), ['volunteer']);

    http.get('/iiif/3/scan-1/full/!2400,2400/0/default.jpg').subscribe();

    expect(controller.expectOne('/iiif/3/scan-1/full/!2400,2400/0/default.jpg').request.headers.get('Authorization')).toBe('Bearer token-test');
  });

  it('when a call goes outside /api and /iiif, then the token is not sent', () => {
    signInForTest(TestBed.inject(AuthSession), ['archivist']);

    http.get('/assets/readme.txt').subscribe();

    expect(controller.expectOne('/assets/readme.txt').request.headers.has('Authorization')).toBe(false);
  });
});
