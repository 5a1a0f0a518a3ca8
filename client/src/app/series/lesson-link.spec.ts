import { MAX_LESSON_DAYS } from '@shared/api/lessons';

import { lessonLinkFor } from './lesson-link';

describe('lessonLinkFor', () => {
  it('when the range is three days, then the link carries the station and the range as ISO 8601 UTC', () => {
    const link = lessonLinkFor('s-1', [Date.UTC(2026, 2, 2, 12), Date.UTC(2026, 2, 5)]);

    expect(link).toEqual({ queryParams: { stationId: 's-1', from: '2026-03-02T12:00:00.000Z', to: '2026-03-05T00:00:00.000Z' } });
  });

  it('when the range is longer than a lesson may be, then there is no link but the reason', () => {
    const link = lessonLinkFor('s-1', [0, (MAX_LESSON_DAYS + 1) * 86_400_000]);

    expect(link).toEqual({ problem: `A lesson covers at most ${MAX_LESSON_DAYS} days: brush a shorter range to start one.` });
  });
});
