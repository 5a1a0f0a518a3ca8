import { type BenchWork, EMPTY_BENCH_WORK } from '@shared/api/bench-work';
import { digitizeWork } from '@shared/domain/pipeline/digitize-work';
import { readingToPixel } from '@shared/domain/registration';
import { TEST_WEEKLY_FORM } from '@shared/domain/testing/test-weekly-form';
import { TEST_WEEKLY_PLACEMENT } from '@shared/domain/testing/test-weekly-placement';

import { clockInWords, instrumentInWords, proofChecklist } from './proof-checklist';

// An invented chart (exact by construction): a plain 150 dpi placement, a slow 72-hour swing about 1000 hPa.
const form = TEST_WEEKLY_FORM;
const START_MS = Date.parse('2026-03-02T00:00:00Z');
const placement = TEST_WEEKLY_PLACEMENT;
const pressureAt = (hours: number) => 1000 + 12 * Math.sin((2 * Math.PI * hours) / 72);
const iso = (hours: number) => new Date(START_MS + hours * 3_600_000).toISOString();

function work(overrides: Partial<BenchWork> = {}): BenchWork {
  const pin = (hours: number, pressure: number) => ({ ...readingToPixel(form, placement, { hours, pressure }), time: iso(hours), pressure });
  const knots = [];
  for (let minutes = 120; minutes <= 40 * 60; minutes += 10) knots.push(readingToPixel(form, placement, { hours: minutes / 60, pressure: pressureAt(minutes / 60) }));
  return { ...EMPTY_BENCH_WORK, pins: [pin(24, 1040), pin(144, 1040), pin(144, 960), pin(24, 960), pin(72, 1000), pin(96, 980)], knots, ...overrides };
}

describe('proofChecklist', () => {
  it('when a pin was given a time two hours off, then the checklist names that pin and how far off it is', () => {
    const w = work();
    const pins = w.pins.map((p, i) => (i === 4 ? { ...p, time: iso(74) } : p));

    const items = proofChecklist({ ...w, pins }, digitizeWork(form, START_MS, { ...w, pins }));

    expect(items.some((item) => item.isWarning && /^pin 5 is \d+ min and [\d.]+ hPa off the others$/.test(item.text))).toBe(true);
  });

  it('when no marks and no readings are given, then it warns that neither the clock nor the instrument is corrected', () => {
    const w = work();

    const items = proofChecklist(w, digitizeWork(form, START_MS, w));

    expect(items.filter((item) => item.isWarning).map((item) => item.text)).toEqual([
      'clock not corrected: no time marks and no chart on / chart off',
      'instrument not corrected: no check readings on the line',
    ]);
  });

  it('when chart on and check readings are given, then the corrections are said in plain words', () => {
    // Chart on 30 min after the line's first knot: the clock is 30 min slow. Readings 1.5 hPa below the line (at the corrected time): the pen reads high.
    const w = work({
      chartOn: iso(2.5),
      checkReadings: [8, 32].map((hours) => ({ time: iso(hours), pressureHpa: pressureAt(hours - 0.5) - 1.5 })),
    });

    const result = digitizeWork(form, START_MS, w);

    expect(clockInWords(result)).toBe('clock 30 min slow at the first mark');
    expect(instrumentInWords(result)).toBe('instrument 1.5 hPa high, steady');
  });
});
