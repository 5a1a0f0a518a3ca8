import { Injector, runInInjectionContext } from '@angular/core';
import { TestBed } from '@angular/core/testing';
import { FormControl, Validators } from '@angular/forms';
import { provideRouter, Router } from '@angular/router';
import type { SignInResponse } from '@shared/api/auth';
import { of, throwError } from 'rxjs';

import { ApiError } from '../http/api-error';
import { AuthSession } from './auth-session';
import { SessionSubmission } from './session-submission';

const RESPONSE: SignInResponse = {
  token: 'token-xyz',
  expiresAt: new Date(Date.now() + 3_600_000).toISOString(),
  person: { id: 'p9', email: 'volunteer@isallo.test', displayName: 'Wren Allacombe', roles: ['volunteer'] },
};

function makeSubmission(): SessionSubmission {
  return runInInjectionContext(TestBed.inject(Injector), () => new SessionSubmission());
}

describe('SessionSubmission', () => {
  beforeEach(() => {
    localStorage.clear();
    TestBed.configureTestingModule({ providers: [provideRouter([])] });
  });

  it('when the form is invalid, then nothing is sent and every field is marked touched', () => {
    const submission = makeSubmission();
    const form = new FormControl('', Validators.required);
    const request = jest.fn(() => of(RESPONSE));

    submission.submit(form, request, 'failed');

    expect(request).not.toHaveBeenCalled();
    expect(form.touched).toBe(true);
    expect(submission.isSending()).toBe(false);
  });

  it('when the server answers with a session, then it is started and the person goes home', () => {
    const submission = makeSubmission();
    const navigate = jest.spyOn(TestBed.inject(Router), 'navigateByUrl').mockResolvedValue(true);

    submission.submit(new FormControl('filled'), () => of(RESPONSE), 'failed');

    expect(TestBed.inject(AuthSession).token()).toBe('token-xyz');
    expect(navigate).toHaveBeenCalledWith('/');
  });

  it('when the server refuses, then its words are shown, the page stays signed out and the button is free again', () => {
    const submission = makeSubmission();
    const refusal = new ApiError(400, 'validation_failed', 'Check the fields.', { newPassword: 'The password is on the list of common passwords.' });

    submission.submit(new FormControl('filled'), () => throwError(() => refusal), 'The password could not be set.');

    expect(submission.failure()).toBe('The password is on the list of common passwords.');
    expect(submission.isSending()).toBe(false);
    expect(TestBed.inject(AuthSession).isSignedIn()).toBe(false);
  });

  it('when the call fails without an API error, then the fallback text is shown', () => {
    const submission = makeSubmission();

    submission.submit(new FormControl('filled'), () => throwError(() => new Error('offline')), 'Sign-in failed. Try again.');

    expect(submission.failure()).toBe('Sign-in failed. Try again.');
  });
});
