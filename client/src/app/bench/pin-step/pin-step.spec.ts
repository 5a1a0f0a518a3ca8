import { TestBed } from '@angular/core/testing';
import { chartGrid } from '@shared/domain/chart-grid';
import { paperFromReading } from '@shared/domain/chart-geometry';
import { GENERATED_WEEKLY_FORM } from '../../../../../fixtures/generator/weekly-form';

import { BenchState } from '../bench-state';
import { PinStep } from './pin-step';

// An invented 150 dpi scan of the generator's weekly form with 15 mm of paper round the grid (exact by construction).
const form = GENERATED_WEEKLY_FORM;
const PX_PER_MM = 150 / 25.4;
const { bounds } = chartGrid(form);
const MARGIN_MM = 15;
const SCAN = {
  widthPx: Math.round((bounds.maxUMm - bounds.minUMm + 2 * MARGIN_MM) * PX_PER_MM),
  heightPx: Math.round((bounds.maxVMm + 2 * MARGIN_MM) * PX_PER_MM),
  dpi: 150,
  chartStart: '2026-05-04T00:00:00.000Z',
};
function pixelOf(hours: number, pressure: number) {
  const paper = paperFromReading(form, { hours, pressure });
  return { x: (MARGIN_MM + paper.uMm - bounds.minUMm) * PX_PER_MM, y: SCAN.heightPx - (MARGIN_MM + paper.vMm) * PX_PER_MM };
}

describe('PinStep', () => {
  async function setUp() {
    TestBed.configureTestingModule({ providers: [BenchState] });
    const state = TestBed.inject(BenchState);
    state.setPreviewWidth(SCAN.widthPx, SCAN.widthPx);
    const fixture = TestBed.createComponent(PinStep);
    fixture.componentRef.setInput('pressureUnit', 'hPa');
    fixture.componentRef.setInput('form', form);
    fixture.componentRef.setInput('scan', SCAN);
    fixture.componentRef.setInput('clock', { timeZone: 'Europe/Oslo', timeStandard: 'local_standard' });
    await fixture.whenStable();
    const element = fixture.nativeElement as HTMLElement;
    const field = (testId: string) => element.querySelector<HTMLInputElement>(`[data-testid="${testId}"]`)!;
    return { state, fixture, element, field };
  }

  it('when a crossing is clicked, then its time and pressure come filled in from the printed lines, focused, and Enter saves them', async () => {
    const { state, fixture, element, field } = await setUp();

    state.pickPoint(pixelOf(24, 1040));
    await fixture.whenStable();
    const time = field('pin-time');
    const filled = [time.value, field('pin-pressure').value];
    const focused = document.activeElement;
    // Enter in a field submits its form (the browser's implicit submission; jsdom needs it asked for).
    time.form?.requestSubmit();
    await fixture.whenStable();

    expect(filled).toEqual(['2026-05-05 00:00', '1040']);
    expect(focused).toBe(time);
    expect(state.pins()).toEqual([expect.objectContaining({ time: '2026-05-05T00:00:00.000Z', pressure: 1040 })]);
    expect(element.querySelector('[data-testid="pin-time"]')).toBeNull();
  });

  it('when a crossing is clicked, then the nearby time lines read as local standard time with their UTC instants, and one can be picked', async () => {
    const { state, fixture, element, field } = await setUp();

    state.pickPoint(pixelOf(24, 1040));
    await fixture.whenStable();
    const lines = Array.from(element.querySelectorAll<HTMLButtonElement>('[data-testid="pin-time-line"]'));
    lines[0].click();
    await fixture.whenStable();

    // Oslo keeps CET (UTC+1) as its standard time, summer or not (IANA tz data, common practice).
    expect(element.textContent).toContain('local standard time (UTC+1)');
    expect(lines.map((line) => line.textContent?.replace(/\s+/g, ' ').trim())).toEqual([
      'Mon 4 May 19:00 18:00 UTC',
      'Mon 4 May 21:00 20:00 UTC',
      'Mon 4 May 23:00 22:00 UTC',
      'Tue 5 May 01:00 00:00 UTC',
      'Tue 5 May 03:00 02:00 UTC',
      'Tue 5 May 05:00 04:00 UTC',
      'Tue 5 May 07:00 06:00 UTC',
    ]);
    expect(field('pin-time').value).toBe('2026-05-04 18:00');
  });

  it('when the arrow keys are pressed in the fields, then the time and the pressure step by one printed line', async () => {
    const { state, fixture, field } = await setUp();
    state.pickPoint(pixelOf(24, 1040));
    await fixture.whenStable();

    field('pin-time').dispatchEvent(new KeyboardEvent('keydown', { key: 'ArrowUp', bubbles: true }));
    field('pin-time').dispatchEvent(new KeyboardEvent('keydown', { key: 'PageDown', bubbles: true }));
    field('pin-pressure').dispatchEvent(new KeyboardEvent('keydown', { key: 'ArrowDown', bubbles: true }));
    await fixture.whenStable();

    // 2 h time lines and 1 hPa pressure lines (fixtures/generator/weekly-form.ts): +2 h, then a day back.
    expect(field('pin-time').value).toBe('2026-05-04 02:00');
    expect(field('pin-pressure').value).toBe('1039');
  });
});
