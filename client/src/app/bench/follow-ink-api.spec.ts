import { provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { TestBed } from '@angular/core/testing';
import type { FollowInkResult } from '@shared/api/follow-ink';

import { FollowInkApi } from './follow-ink-api';

describe('FollowInkApi', () => {
  let api: FollowInkApi;
  let controller: HttpTestingController;

  beforeEach(() => {
    TestBed.configureTestingModule({ providers: [provideHttpClient(), provideHttpClientTesting()] });
    api = TestBed.inject(FollowInkApi);
    controller = TestBed.inject(HttpTestingController);
  });

  afterEach(() => controller.verify());

  it('when the ink is followed, then the pins go by POST to the scan and the answer comes back as sent', () => {
    const pins = [{ xPx: 10, yPx: 20, time: '2026-03-02T06:00:00.000Z', pressure: 1000 }];
    const answer: FollowInkResult = { knots: [{ xPx: 1, yPx: 2, confidence: 0.9 }], spans: [], lineWidthPx: 3.2, elapsedMs: 40, inkModel: 'colour', inkModelReason: 'test', coverage: 1, problem: null };
    let received: FollowInkResult | null = null;

    api.follow('scan/1', { pins, inkColour: '#223388' }).subscribe((result) => (received = result));
    const request = controller.expectOne('/api/scans/scan%2F1/follow-ink');
    request.flush(answer);

    expect(request.request.method).toBe('POST');
    expect(request.request.body).toEqual({ pins, inkColour: '#223388' });
    expect(received).toEqual(answer);
  });
});
