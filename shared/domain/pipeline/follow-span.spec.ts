import { SYNTHETIC_FORM } from '../ink/synthetic-scan';
import { followSpanHours, SPAN_MARGIN_HOURS } from './follow-span';

const HOUR_MS = 3_600_000;
const START_MS = Date.parse('2026-03-02T00:00:00Z');

describe('followSpanHours', () => {
  it('when chart on and chart off are known, then the span reaches the margin beyond both', () => {
    const span = followSpanHours(SYNTHETIC_FORM, START_MS, START_MS + 5 * HOUR_MS, START_MS + 15 * HOUR_MS);

    expect(span).toEqual({ startHours: 5 - SPAN_MARGIN_HOURS, endHours: 15 + SPAN_MARGIN_HOURS });
  });

  it('when they are not known or the margin runs off the drum turn, then the span stays within the turn', () => {
    expect(followSpanHours(SYNTHETIC_FORM, START_MS, null, null)).toEqual({ startHours: 0, endHours: SYNTHETIC_FORM.drumHours });
    expect(followSpanHours(SYNTHETIC_FORM, START_MS, START_MS + HOUR_MS, START_MS + (SYNTHETIC_FORM.drumHours - 1) * HOUR_MS)).toEqual({
      startHours: 0,
      endHours: SYNTHETIC_FORM.drumHours,
    });
  });
});
