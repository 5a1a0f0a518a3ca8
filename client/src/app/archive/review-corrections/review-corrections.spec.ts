import { TestBed } from '@angular/core/testing';
import type { ReviewCorrections as Corrections } from '@shared/api/review';

import { ReviewCorrections } from './review-corrections';

async function render(corrections: Corrections): Promise<HTMLElement> {
  const fixture = TestBed.createComponent(ReviewCorrections);
  fixture.componentRef.setInput('corrections', corrections);
  await fixture.whenStable();
  return fixture.nativeElement as HTMLElement;
}

const text = (element: HTMLElement, testId: string) => element.querySelector(`[data-testid="${testId}"]`)?.textContent?.replace(/\s+/g, ' ').trim();

describe('ReviewCorrections', () => {
  it('when a clock and an instrument correction were applied, then both are said in words with a row per mark and reading', async () => {
    const element = await render({
      clock: {
        method: 'offset',
        firstOffsetMinutes: 30,
        rateMinutesPerDay: 0,
        rmsMinutes: 0,
        marks: [{ kind: 'chart_on', chartTime: '2026-03-02T02:00:00.000Z', trueTime: '2026-03-02T02:30:00.000Z', errorMinutes: 30, leaveOneOutMinutes: null, isDropped: false }],
      },
      instrument: {
        method: 'drift',
        meanOffsetHpa: -1.5,
        penDriftHpaPerWeek: 0,
        rmsHpa: 0.04,
        readings: [
          { time: '2026-03-02T08:00:00.000Z', offsetHpa: -1.5, residualHpa: 0.04 },
          { time: '2026-03-02T20:00:00.000Z', offsetHpa: -1.5, residualHpa: -0.04 },
        ],
      },
      checkReadingUses: ['used', 'used', 'outlier'],
    });

    expect(text(element, 'review-clock')).toBe('clock 30 min slow at the first mark (offset fit; 0.0 min RMS between marks).');
    expect(text(element, 'review-instrument')).toBe('instrument 1.5 hPa high, steady (drift fit; 0.04 hPa RMS).');
    expect(element.querySelectorAll('table')[0].querySelectorAll('tr')).toHaveLength(2);
    expect(element.querySelectorAll('table')[1].querySelectorAll('tr')).toHaveLength(3);
    expect(element.textContent).toContain('check reading 3 left out: contradicts the others');
  });

  it('when nothing was corrected, then it says why for the clock and for the instrument', async () => {
    const element = await render({ clock: null, instrument: null, checkReadingUses: [] });

    expect(text(element, 'review-clock')).toBe('Clock not corrected: no time marks and no chart on / chart off could be used.');
    expect(text(element, 'review-instrument')).toBe('Instrument not corrected: no check readings on the line.');
    expect(element.querySelectorAll('table')).toHaveLength(0);
  });
});
