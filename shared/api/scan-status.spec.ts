import type { ScanStatus } from './scans';
import { ALLOWED_STATUS_MOVES, canMoveStatus, missingForTracing, TRACING_NEED_LABELS } from './scan-status';

const STATUSES: ScanStatus[] = ['received', 'ready_to_trace', 'traced', 'approved', 'withdrawn'];
const CATALOGUED = { stationId: 'st-1', chartFormId: 'cf-1', chartStart: '1931-03-02T08:00:00.000Z', derivativeState: 'ready' as const };

describe('scan status moves', () => {
  it('when a scan is in any state but withdrawn, then it may be withdrawn', () => {
    for (const from of STATUSES.filter((status) => status !== 'withdrawn')) expect(canMoveStatus(from, 'withdrawn')).toBe(true);
  });

  it('when a scan is withdrawn, then the only move is back to received', () => {
    expect(ALLOWED_STATUS_MOVES.withdrawn).toEqual(['received']);
    expect(canMoveStatus('withdrawn', 'ready_to_trace')).toBe(false);
  });

  it('when a scan is received, then it cannot be traced or approved by a status move', () => {
    expect(canMoveStatus('received', 'traced')).toBe(false);
    expect(canMoveStatus('received', 'approved')).toBe(false);
  });

  it('when a scan is in a state, then it never moves to the same state', () => {
    for (const status of STATUSES) expect(canMoveStatus(status, status)).toBe(false);
  });
});

describe('missingForTracing', () => {
  it('when a scan arrived without metadata and its tiles are still being made, then all four needs are named in order', () => {
    const missing = missingForTracing({ stationId: null, chartFormId: null, chartStart: null, derivativeState: 'working' });

    expect(missing).toEqual(['stationId', 'chartFormId', 'chartStart', 'derivativeState']);
    expect(missing.map((need) => TRACING_NEED_LABELS[need])).toEqual(['station', 'chart form', 'chart start', 'derivatives']);
  });

  it('when everything is in place, then nothing is missing', () => {
    expect(missingForTracing(CATALOGUED)).toEqual([]);
  });

  it('when only the tiles failed, then only they are missing', () => {
    expect(missingForTracing({ ...CATALOGUED, derivativeState: 'failed' })).toEqual(['derivativeState']);
  });
});
